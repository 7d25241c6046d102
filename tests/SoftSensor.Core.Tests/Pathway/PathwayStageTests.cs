using SoftSensor.Core.Flux;
using SoftSensor.Core.Tests.Flux;

namespace SoftSensor.Core.Tests.Pathway;

/// <summary>The pathway stage on its own: the ATP balance with P/O and m_ATP free, overflow, no allocation per cycle.</summary>
public sealed class PathwayStageTests
{
    private static PathwayStage Bacterium(double capacity = double.NaN) =>
        new(FluxModel.Load(ShippedModels.Json("glycerol-bacterium-overflow.json")), new PathwaySettings { OverflowReaction = "acetateKinase", RespiratoryCapacityO2MmolPerGh = capacity });

    [Fact]
    public void At_the_model_parameters_the_prediction_closes_the_elemental_balances_and_matches_the_flux_solver()
    {
        // The energetic form must give what `softsensor flux` gives for the same network at the same growth.
        var stage = Bacterium();
        var net = ShippedModels.Network("glycerol-bacterium.json");
        var reference = ShippedModels.AtGrowth(net, 10.0, 400.0);
        double uptake = ShippedModels.RateOf(net, reference, "glycerol");
        var u = new double[PathwayResponse.BasisCount];
        var r = stage.Response;
        Assert.Equal(2.0, r.ModelPoRatio, 12); // the model file's {PO}
        Assert.True(PathwaySolve.Solve(r, PathwayBasis.Substrate, r.ModelPoRatio, r.ModelMaintenanceAtpPerCmmolH, 400.0, uptake, double.NaN, u));
        Assert.Equal(10.0, u[PathwayResponse.Growth], 9);
        Assert.Equal(ShippedModels.RateOf(net, reference, "o2"), r.Rate(r.OxygenIndex, u), 9);
        Assert.Equal(ShippedModels.RateOf(net, reference, "co2"), r.Rate(r.CarbonDioxideIndex, u), 9);
        Assert.Equal(0.0, u[PathwayResponse.Overflow], 12);
    }

    [Fact]
    public void Uptake_above_the_respiratory_capacity_names_acetate_and_predicts_it()
    {
        var stage = Bacterium(capacity: 10);
        var state = new PathwayState();
        var o = PathwayOutputs.Empty;
        // 10 g/L at 10 mmol O2/(g·h) caps respiration at 100 mmol/(L·h); an uptake of 300 C-mmol/(L·h) exceeds it.
        var x = new PathwayInputs
        {
            DtH = 1.0 / 60, SubstrateCmmolPerLh = -300, SubstrateSigmaCmmolPerLh = 3, OurMmolPerLh = 100, OurSigmaMmolPerLh = 1,
            CerMmolPerLh = 120, CerSigmaMmolPerLh = 1, OurCerCovariance = 0, BiomassGPerL = 10, BiomassSigmaGPerL = 0.3,
        };
        stage.Run(x, state, ref o);
        Assert.True(o.Overflow, $"crit {o.CriticalUptakeCmmolPerLh} basis {o.Basis} our {o.PredictedOurMmolPerLh}");
        Assert.Equal("acetate", stage.Response.OverflowProduct);
        Assert.Equal(PathwayBasis.SubstrateAndOxygen, o.Basis);
        Assert.True(o.OverflowProductCmmolPerLh > 0);
        Assert.True(o.CriticalUptakeCmmolPerLh is > 0 and < 300);
        // Carbon closes: uptake = biomass + CO2 + acetate (C-mmol).
        var q = stage.PredictedRates;
        var m = stage.Response.Model;
        double sum = 0;
        for (int j = 0; j < q.Length; j++)
        {
            sum += m.Compounds[j].Formula.Carbon * m.Compounds[j].Formula.FormulaUnitsPerRateUnit * q[j];
        }

        Assert.InRange(sum, -1e-9, 1e-9);
    }

    [Fact]
    public void Run_allocates_nothing_per_cycle()
    {
        var stage = Bacterium(capacity: 10);
        var state = new PathwayState();
        var o = PathwayOutputs.Empty;
        var x = new PathwayInputs
        {
            DtH = 1.0 / 60, SubstrateCmmolPerLh = -60, SubstrateSigmaCmmolPerLh = 1, OurMmolPerLh = 40, OurSigmaMmolPerLh = 0.5,
            CerMmolPerLh = 28, CerSigmaMmolPerLh = 0.5, OurCerCovariance = 0.05, BiomassGPerL = 10, BiomassSigmaGPerL = 0.3,
        };
        stage.Run(x, state, ref o);
        long before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 100; i++)
        {
            stage.Run(x, state, ref o);
        }

        Assert.Equal(0, GC.GetAllocatedBytesForCurrentThread() - before);
    }
}
