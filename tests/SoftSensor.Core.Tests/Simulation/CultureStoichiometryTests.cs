using SoftSensor.Core.Chemistry;
using SoftSensor.Simulation.Kinetics;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Core.Tests.Simulation;

public class CultureStoichiometryTests
{
    [Fact]
    public void EvaluateAtUptake_glucose_growth_matches_the_worked_elemental_balance()
    {
        // docs/methods.md §6 (elemental balance, recomputed): aerobic growth on glucose with
        // Y_XS = 0.5 g/g and biomass CH1.8O0.5N0.2 gives per C-mol glucose: biomass 0.6096,
        // CO2 0.3904, O2 0.3599, NH3 0.1219; RQ 1.085. No ash, no maintenance, no by-product.
        var spec = new CultureSpec
        {
            Substrate = new CompoundSpec { Name = "glucose", Formula = "C6H12O6" },
            Biomass = new BiomassSpec { Formula = "CH1.8O0.5N0.2", AshFraction = 0 },
            YieldGPerG = 0.5,
            MaintenanceGPerGH = 0,
            MuMaxPerH = 0.5,
        };
        var m = new CultureModel(spec);
        var r = m.EvaluateAtUptake(1.0, 1.0, 0, 1);
        double s = -r.SubstrateCmmolPerLh;
        Assert.Equal(0.6096, r.BiomassCmmolPerLh / s, 4);
        Assert.Equal(0.3904, r.CerMmolPerLh / s, 4);
        Assert.Equal(0.3599, r.OurMmolPerLh / s, 4);
        Assert.Equal(0.1219, r.AmmoniaUptakeMmolPerLh / s, 4);
        Assert.Equal(1.085, r.Rq, 3);
    }

    [Theory]
    [InlineData("glycerol", 0.05)]
    [InlineData("glycerol", 0.30)]
    [InlineData("yeast", 0.30)]
    [InlineData("yeast", 1.40)]
    public void EvaluateAtUptake_closes_the_C_H_O_N_balances_with_water(string scenario, double qs)
    {
        // Roels 1983: C, H, O, N must balance over substrate, biomass, products, O2, CO2, NH3 and
        // water. The model uses the C and degree-of-reduction balances; here water follows from the
        // H balance and the O balance, which the model never used, must close.
        var spec = ShippedScenarios.Load(scenario).Culture;
        var m = new CultureModel(spec);
        var r = m.EvaluateAtUptake(1.0, qs, 0, 1);
        var terms = new List<(Formula F, double Rate)>
        {
            (Formula.Parse(spec.Substrate.Formula).PerCMol(), r.SubstrateCmmolPerLh),
            (Formula.Parse(spec.Biomass.Formula).PerCMol(), r.BiomassCmmolPerLh),
            (Formula.Parse("O2"), -r.OurMmolPerLh),
            (Formula.Parse("CO2"), r.CerMmolPerLh),
            (Formula.Parse("NH3"), -r.AmmoniaUptakeMmolPerLh),
        };
        if (spec.Byproduct is { } b)
        {
            terms.Add((Formula.Parse(b.Formula).PerCMol(), r.ByproductCmmolPerLh));
        }

        if (spec.Overflow is { } o)
        {
            terms.Add((Formula.Parse(o.Formula).PerCMol(), r.OverflowCmmolPerLh));
        }

        double Sum(Element e) => terms.Sum(t => t.F[e] * t.Rate);
        double water = -Sum(Element.H) / 2.0;
        double scale = Math.Abs(r.SubstrateCmmolPerLh);
        Assert.Equal(0, Sum(Element.C) / scale, 12);
        Assert.Equal(0, Sum(Element.N) / scale, 12);
        Assert.Equal(0, (Sum(Element.O) + water) / scale, 12);
        Assert.True(r.OurMmolPerLh > 0 && r.CerMmolPerLh > 0);
    }

    [Fact]
    public void CultureModel_simulated_biomass_differs_from_the_standard_composition()
    {
        // The simulated culture is not the estimator's model: its own composition and ash
        // (CH1.8O0.5N0.2 is the common standard, Villadsen, Nielsen & Lidén 2011).
        var spec = ShippedScenarios.Load("glycerol").Culture;
        Assert.NotEqual("CH1.8O0.5N0.2", spec.Biomass.Formula);
        Assert.True(spec.Biomass.AshFraction > 0);
        Assert.NotNull(spec.Byproduct);
    }
}
