using SoftSensor.Core.Estimation;

namespace SoftSensor.Core.Tests.Estimation;

public class OfflineSampleUpdateTests
{
    [Fact]
    public void Correct_scalar_update_matches_the_Kalman_formulas()
    {
        // Scalar Kalman update (Kalman 1960; Gelb 1974, Applied Optimal Estimation, ch. 4):
        // K = P / (P + R), x+ = x + K (z - x), P+ = (1 - K) P. Prior X = 2.0 g/L with sigma 0.3 g/L,
        // sample 2.4 g/L with sigma 0.1 g/L: K = 0.09 / 0.10 = 0.9, x+ = 2.36 g/L, sigma+ = 0.0949 g/L.
        const double v = 50;
        var s = new ObserverStates { BiomassG = 2.0 * v, BiomassVarG2 = 0.09 * v * v };
        BiomassIntegrator.Correct(ref s, v, 2.4, 0.01);
        Assert.Equal(2.36, s.BiomassG / v, 12);
        Assert.Equal(Math.Sqrt(0.009), Math.Sqrt(s.BiomassVarG2) / v, 12);
    }

    [Fact]
    public void Apply_late_sample_gives_the_same_state_as_the_sample_applied_on_time()
    {
        // Re-propagation from the stored inputs must reproduce the run in which the sample was
        // applied right after its own cycle (to 1e-12 relative), for both observers.
        var s = EstimationFixtures.Settings();
        var onTime = Run(s, sampleAfterCycle: 120, lateBy: 0);
        var late = Run(s, sampleAfterCycle: 120, lateBy: 90);
        Assert.Equal(onTime.BiomassG, late.BiomassG, onTime.BiomassG * 1e-12);
        Assert.Equal(onTime.EkfBiomassG, late.EkfBiomassG, onTime.EkfBiomassG * 1e-12);
        Assert.Equal(onTime.EkfMuPerH, late.EkfMuPerH, 1e-12);
        Assert.Equal(onTime.BiomassVarG2, late.BiomassVarG2, onTime.BiomassVarG2 * 1e-12);
    }

    [Fact]
    public void Apply_sample_pulls_a_biased_estimate_towards_the_assay()
    {
        var s = EstimationFixtures.Settings() with { InitialBiomassGPerL = 1.3 }; // 30 % high
        var state = new EstimatorState(s.HistoryCapacity);
        var o = new CycleOutputs();
        for (int k = 0; k <= 60; k++)
        {
            var t = EstimationFixtures.Start.AddMinutes(k);
            EstimationStep.Run(EstimationFixtures.Inputs(t, 100), EstimationFixtures.Rates(0.1, Math.Exp(0.1 * k / 60.0), s), state, s, o);
        }

        double truth = Math.Exp(0.1);
        double before = state.Observers.BiomassG / 100;
        var outcome = OfflineSampleUpdate.Apply(state, new OfflineSample(EstimationFixtures.Start.AddMinutes(60), truth, 0.02), s);
        double after = state.Observers.BiomassG / 100;
        Assert.Equal(OfflineSampleOutcome.Applied, outcome);
        Assert.True(Math.Abs(after - truth) < 0.1 * Math.Abs(before - truth), $"before {before}, after {after}, truth {truth}");
    }

    [Fact]
    public void Apply_sample_outside_the_history_is_reported_not_applied()
    {
        var s = EstimationFixtures.Settings() with { HistoryCapacity = 10 };
        var state = new EstimatorState(s.HistoryCapacity);
        var o = new CycleOutputs();
        Assert.Equal(OfflineSampleOutcome.NotYetReached, OfflineSampleUpdate.Apply(state, new OfflineSample(EstimationFixtures.Start, 1, 0.1), s));
        for (int k = 0; k < 30; k++)
        {
            EstimationStep.Run(EstimationFixtures.Inputs(EstimationFixtures.Start.AddMinutes(k), 100), EstimationFixtures.Rates(0.1, 1, s), state, s, o);
        }

        Assert.Equal(OfflineSampleOutcome.TooOld, OfflineSampleUpdate.Apply(state, new OfflineSample(EstimationFixtures.Start, 1, 0.1), s));
        Assert.Equal(OfflineSampleOutcome.NotYetReached, OfflineSampleUpdate.Apply(state, new OfflineSample(EstimationFixtures.Start.AddHours(1), 1, 0.1), s));
        Assert.Equal(OfflineSampleOutcome.Invalid, OfflineSampleUpdate.Apply(state, new OfflineSample(EstimationFixtures.Start.AddMinutes(25), double.NaN, 0.1), s));
        Assert.Equal(OfflineSampleOutcome.Invalid, OfflineSampleUpdate.Apply(state, new OfflineSample(EstimationFixtures.Start.AddMinutes(25), 1, 0), s));
    }

    private static ObserverStates Run(EstimatorSettings s, int sampleAfterCycle, int lateBy)
    {
        var state = new EstimatorState(s.HistoryCapacity);
        var o = new CycleOutputs();
        var sample = new OfflineSample(EstimationFixtures.Start.AddMinutes(sampleAfterCycle), 2.0, 0.05);
        for (int k = 0; k <= 300; k++)
        {
            var t = EstimationFixtures.Start.AddMinutes(k);
            EstimationStep.Run(EstimationFixtures.Inputs(t, 100 + (0.01 * k)), EstimationFixtures.Rates(0.12, Math.Exp(0.12 * k / 60.0), s), state, s, o);
            if (k == sampleAfterCycle + lateBy)
            {
                Assert.Equal(OfflineSampleOutcome.Applied, OfflineSampleUpdate.Apply(state, sample, s));
            }
        }

        return state.Observers;
    }
}
