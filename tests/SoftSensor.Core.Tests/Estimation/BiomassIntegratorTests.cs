using SoftSensor.Core.Estimation;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Estimation;

public class BiomassIntegratorTests
{
    [Fact]
    public void Run_exponential_growth_at_constant_volume_matches_the_analytic_solution()
    {
        // dX/dt = mu X has X(t) = X0 exp(mu t) (analytic solution; common practice). The rate given
        // at each cycle is that of the analytic curve at the cycle's midpoint, so the integral is
        // the midpoint rule: relative error below 1e-5 over 10 h with 36 s steps.
        var s = EstimationFixtures.Settings();
        var state = new EstimatorState(s.HistoryCapacity);
        var o = new CycleOutputs();
        const double mu = 0.2;
        double dtH = 0.01;
        for (int k = 0; k <= 1000; k++)
        {
            var t = EstimationFixtures.Start.AddHours(k * dtH);
            double xMid = Math.Exp(mu * ((k - 0.5) * dtH));
            EstimationStep.Run(EstimationFixtures.Inputs(t, 100), EstimationFixtures.Rates(mu, xMid, s), state, s, o);
        }

        double expected = Math.Exp(mu * 10);
        Assert.True(Math.Abs(o.BiomassGPerL - expected) / expected < 1e-5, $"X = {o.BiomassGPerL}, expected {expected}");
        Assert.Equal(mu, o.MuRawPerH, 2);
        Assert.Equal(SampleQuality.Good, o.BiomassQuality);
    }

    [Fact]
    public void Run_removal_by_totaliser_keeps_concentration_and_removes_mass()
    {
        // A sample takes broth at the vessel's concentration: X unchanged, X·V down by the removed fraction.
        var s = EstimationFixtures.Settings();
        var state = new EstimatorState(s.HistoryCapacity);
        var o = new CycleOutputs();
        var zero = EstimationFixtures.Rates(0, 1, s);
        var a = EstimationFixtures.Inputs(EstimationFixtures.Start, 100);
        a.Set(SignalRole.RemovedVolumeL, 0, SampleQuality.Good, a.Time);
        EstimationStep.Run(a, zero, state, s, o);
        double before = state.Observers.BiomassG;

        var b = EstimationFixtures.Inputs(EstimationFixtures.Start.AddMinutes(1), 90);
        b.Set(SignalRole.RemovedVolumeL, 10, SampleQuality.Good, b.Time);
        EstimationStep.Run(b, zero, state, s, o);

        Assert.Equal(1.0, o.BiomassGPerL, 12);
        Assert.Equal(before * 0.9, state.Observers.BiomassG, 9);
    }

    [Fact]
    public void Run_without_volume_signal_integrates_feed_and_base()
    {
        // V(t) = V0 + (F_feed + F_base) t (docs/methods.md §1.7): 100 L + (2 + 0.5) L/h × 4 h = 110 L.
        var s = EstimationFixtures.Settings();
        var state = new EstimatorState(s.HistoryCapacity);
        var o = new CycleOutputs();
        var rates = EstimationFixtures.Rates(0.1, 1, s);
        for (int k = 0; k <= 240; k++)
        {
            var t = EstimationFixtures.Start.AddMinutes(k);
            var a = new AlignedInputs { Time = t };
            a.Set(SignalRole.FeedRateLPerH, 2.0, SampleQuality.Good, t);
            a.Set(SignalRole.BaseRateLPerH, 0.5, SampleQuality.Good, t);
            EstimationStep.Run(a, rates, state, s, o);
        }

        Assert.Equal(110.0, o.VolumeL, 9);
        Assert.Equal(VolumeSource.Integrated, o.VolumeSource);
    }

    [Fact]
    public void Run_with_bad_rates_coasts_on_smoothed_mu_and_marks_uncertain()
    {
        var s = EstimationFixtures.Settings();
        var state = new EstimatorState(s.HistoryCapacity);
        var o = new CycleOutputs();
        for (int k = 0; k <= 300; k++)
        {
            var t = EstimationFixtures.Start.AddMinutes(k);
            EstimationStep.Run(EstimationFixtures.Inputs(t, 100), EstimationFixtures.Rates(0.1, Math.Exp(0.1 * k / 60.0), s), state, s, o);
        }

        double x0 = o.BiomassGPerL;
        var bad = new BalanceRates { OurMmolPerLh = double.NaN, GrowthCmmolPerLh = double.NaN, GasQuality = SampleQuality.Bad, GrowthQuality = SampleQuality.Bad };
        EstimationStep.Run(EstimationFixtures.Inputs(EstimationFixtures.Start.AddMinutes(361), 100), bad, state, s, o);

        Assert.Equal(SampleQuality.Uncertain, o.BiomassQuality);
        Assert.Equal(0x40900000u, o.BiomassStatusCode); // UncertainLastUsableValue, OPC UA Part 8 §7.3.2
        Assert.True(o.BiomassGPerL > x0, "coasting on a positive mu keeps growing");
    }
}
