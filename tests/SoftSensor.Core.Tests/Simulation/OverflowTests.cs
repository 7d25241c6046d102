using SoftSensor.Simulation.Kinetics;

namespace SoftSensor.Core.Tests.Simulation;

public class OverflowTests
{
    // Postma, Verduyn, Scheffers & van Dijken 1989, Appl. Environ. Microbiol. 55, 468-477:
    // in aerobic glucose-limited chemostats of S. cerevisiae CBS 8066 ethanol appears above a
    // dilution rate of about 0.38 1/h, and RQ rises from about 1.0 to above 1.6 just beyond.
    // The yeast scenario's critical uptake rate is set so that the respiratory route reaches its
    // capacity at mu = 0.38 1/h; the test checks the model's steady states on both sides.
    private static readonly CultureModel Yeast = new(ShippedScenarios.Load("yeast").Culture);

    /// <summary>Chemostat steady state: the uptake at which mu equals D (mu rises with the uptake).</summary>
    private static CultureRates SteadyState(double d)
    {
        double lo = 0, hi = Yeast.QsMaxGPerGH;
        for (int i = 0; i < 100; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (Yeast.EvaluateAtUptake(1.0, mid, 0, 1).MuPerH < d)
            {
                lo = mid;
            }
            else
            {
                hi = mid;
            }
        }

        return Yeast.EvaluateAtUptake(1.0, 0.5 * (lo + hi), 0, 1);
    }

    [Theory]
    [InlineData(0.10)]
    [InlineData(0.25)]
    [InlineData(0.36)]
    [InlineData(0.375)]
    public void EvaluateAtUptake_below_the_critical_rate_forms_no_ethanol_and_RQ_is_about_one(double d)
    {
        var r = SteadyState(d);
        Assert.Equal(d, r.MuPerH, 6);
        Assert.Equal(0, r.OverflowCmmolPerLh);
        Assert.InRange(r.Rq, 0.95, 1.15);
    }

    [Theory]
    [InlineData(0.385)]
    [InlineData(0.40)]
    [InlineData(0.42)]
    public void EvaluateAtUptake_above_the_critical_rate_forms_ethanol(double d)
    {
        var r = SteadyState(d);
        Assert.True(r.OverflowCmmolPerLh > 0, $"ethanol rate {r.OverflowCmmolPerLh} at D = {d}");
        Assert.True(r.Rq > 1.1, $"RQ {r.Rq} at D = {d}");
    }

    [Fact]
    public void EvaluateAtUptake_just_beyond_the_onset_RQ_exceeds_1_6()
    {
        Assert.True(SteadyState(0.42).Rq > 1.6, $"RQ {SteadyState(0.42).Rq} at D = 0.42");
    }
}
