using SoftSensor.Core.Chemistry;
using SoftSensor.Core.Flux;
using static SoftSensor.Core.Tests.Flux.ShippedModels;

namespace SoftSensor.Core.Tests.Flux;

/// <summary>The example networks in config/models: yields, extra equations, closure.</summary>
public class ShippedNetworkTests
{
    [Theory]
    [InlineData(0.05)]
    [InlineData(0.3)]
    [InlineData(0.6)]
    public void Bacterium_growth_yield_and_RQ_fall_in_the_published_range_for_bacteria_on_glycerol(double muPerH)
    {
        // Published range (from memory, no page checked): aerobic E. coli and K. pneumoniae on
        // glycerol reach Y_XS of about 0.4-0.6 g dry weight per g glycerol. Through the black-box
        // balance of {glycerol, O2, CO2, NH3, biomass} that range implies RQ between 0.69 (Y 0.6) and
        // 0.79 (Y 0.4), below the 6/7 of complete oxidation (recomputed with gamma(glycerol) 14/3,
        // gamma(biomass) 4.2, 26.2 g per C-mol biomass with 6 % ash).
        var net = Network(Bacterium);
        double x = net.Model.BiomassCmmolPerL(10.0);
        var s = AtGrowth(net, muPerH * x, x);
        Assert.Equal(FluxSolveStatus.Determined, s.Status);
        double biomassG = RateOf(net, s, "biomass") * net.Model.Biomass!.WeighedMassGPerRateUnit;
        double glycerolG = -RateOf(net, s, "glycerol") / 3 * Formula.Parse("C3H8O3").MolarMassGPerMol;
        double yield = biomassG / glycerolG;
        double rq = RateOf(net, s, "co2") / -RateOf(net, s, "o2");
        Assert.InRange(yield, 0.4, 0.6);
        Assert.InRange(rq, 0.69, 0.79);
        Assert.Equal(0, s.DirectionViolations);
    }

    [Theory]
    [InlineData(Bacterium)]
    [InlineData(Yeast)]
    public void Predicted_rates_close_every_elemental_balance_to_1e_9(string file)
    {
        // docs/methods.md §3: rates of an elementally balanced network close the black-box balance to numerical precision.
        var net = Network(file);
        double x = net.Model.BiomassCmmolPerL(10.0);
        var s = AtGrowth(net, 0.2 * x, x);
        Assert.Equal(FluxSolveStatus.Determined, s.Status);
        Assert.Equal(net.BalancedElements.Count + 1, s.Closure.Length);
        foreach (double r in s.Closure)
        {
            Assert.InRange(r, -1e-9, 1e-9);
        }
    }

    [Fact]
    public void Bacterium_gives_one_extra_equation_the_ATP_balance()
    {
        // {glycerol, O2, CO2, NH3, H2O, biomass}: 6 compounds, rank(E) = 4 (C, H, O, N), 2 degrees of
        // freedom (docs/methods.md §2.3); the network's ATP balance fixes one, the basis the other.
        var net = Network(Bacterium);
        Assert.Equal(1, net.ExtraEquations);
    }

    [Fact]
    public void Yeast_anaerobic_network_gives_two_extra_equations()
    {
        // {sucrose, ethanol, glycerol, CO2, NH3, H2O, biomass}: 7 compounds, rank(E) = 4, 3 degrees of
        // freedom; the ATP and the NADH balances (no electron acceptor) leave only the basis (docs/methods.md §3).
        var net = Network(Yeast);
        Assert.Equal(2, net.ExtraEquations);
    }

    [Fact]
    public void Yeast_growth_makes_glycerol_in_proportion_to_biomass()
    {
        // Redox: 0.3 NADH per C-mol biomass from biosynthesis goes to glycerol (van Dijken &
        // Scheffers 1986, glycerol as the redox sink of anaerobic growth; from memory about 10 mmol/g):
        // 0.3 mol per C-mol = 0.9 C-mol per C-mol, 11.5 mmol per g dry weight.
        var net = Network(Yeast);
        double x = net.Model.BiomassCmmolPerL(5.0);
        var s = AtGrowth(net, 0.1 * x, x);
        double glycerolMolPerCmol = RateOf(net, s, "glycerol") / 3 / RateOf(net, s, "biomass");
        Assert.Equal(0.3, glycerolMolPerCmol, 10);
        double mmolPerG = glycerolMolPerCmol / net.Model.Biomass!.WeighedMassGPerRateUnit * 1000;
        Assert.InRange(mmolPerG, 8, 14);
    }

    [Fact]
    public void Maintenance_per_gram_is_converted_per_C_mmol_with_ash()
    {
        // Molar mass of CH1.8O0.5N0.2 from IUPAC 2021 atomic weights: 24.6263 g/C-mol. 2 mmol/(g·h) * (24.6263 g/C-mol / 0.94) / 1000 = 0.0523964 mmol/(C-mmol·h).
        var model = Network(Bacterium).Model;
        Assert.Equal(2.0 * 24.6263 / 0.94 / 1000, model.Maintenance!.AtpMmolPerCmmolBiomassPerH, 8);
    }
}
