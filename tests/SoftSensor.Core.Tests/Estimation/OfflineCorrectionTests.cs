using SoftSensor.Core.Estimation;

namespace SoftSensor.Core.Tests.Estimation;

/// <summary>Operator inputs on the kept history: OD through a calibration (GUM), and a withdrawal entered after the fact.</summary>
public class OfflineCorrectionTests
{
    [Fact]
    public void DryWeight_od_with_calibration_propagates_both_uncertainties_first_order()
    {
        // JCGM 100:2008 (GUM) 5.1.2 eq. (10), uncorrelated inputs, X = k·OD:
        // u²(X) = (k·u(OD))² + (OD·u(k))². OD 10.0 ± 0.2, k = 0.38 ± 0.02 g/L per OD (invented values):
        // X = 3.8 g/L, u(X) = sqrt(0.076² + 0.2²) = 0.213953 g/L.
        var (x, u) = OpticalDensityCalibration.DryWeight(10.0, 0.2, 0.38, 0.02);
        Assert.Equal(3.8, x, 12);
        Assert.Equal(Math.Sqrt((0.076 * 0.076) + (0.2 * 0.2)), u, 12);
        Assert.Equal(0.213953, u, 6);

        // Same result in GUM 5.1.6 eq. (12), the relative form for a product of powers (exponents 1):
        // (u(X)/X)² = (u(OD)/OD)² + (u(k)/k)².
        Assert.Equal(Math.Sqrt(Math.Pow(0.2 / 10.0, 2) + Math.Pow(0.02 / 0.38, 2)), u / x, 12);

        // An exact calibration leaves only the reading's share: u(X) = k·u(OD).
        Assert.Equal(0.38 * 0.2, OpticalDensityCalibration.DryWeight(10.0, 0.2, 0.38, 0).SigmaGPerL, 12);
    }

    [Fact]
    public void ApplySample_reports_the_prior_at_the_update_point_and_a_trajectory_starting_at_the_Kalman_posterior()
    {
        // Scalar Kalman update (Kalman 1960, J. Basic Eng. 82; Simon 2006, Optimal State Estimation, ch. 5, the
        // discrete-time filter with H = 1; from memory): K = P/(P+R), X+ = X- + K (y - X-), P+ = (1 - K) P.
        var s = EstimationFixtures.Settings();
        var state = Grow(s, 120, withdrawAtMinute: -1, measuredVolume: true);
        var sample = new OfflineSample(EstimationFixtures.Start.AddMinutes(60).AddSeconds(20), 2.0, 0.05);
        var c = OfflineCorrections.ApplySample(state, sample, s);
        Assert.Equal(OfflineSampleOutcome.Applied, c.Outcome);
        Assert.Equal(EstimationFixtures.Start.AddMinutes(60).UtcTicks, c.Prior.TimeTicks); // the kept cycle at or before the sampling time
        double p = c.Prior.BiomassSigmaGPerL * c.Prior.BiomassSigmaGPerL, r = 0.05 * 0.05;
        double k = p / (p + r);
        Assert.Equal(c.Prior.BiomassGPerL + (k * (2.0 - c.Prior.BiomassGPerL)), c.Trajectory[0].BiomassGPerL, 12);
        Assert.Equal(Math.Sqrt((1 - k) * p), c.Trajectory[0].BiomassSigmaGPerL, 12);
        Assert.Equal(61, c.Trajectory.Count); // minutes 60..120
        Assert.Equal(state.Observers.BiomassG / 100, c.Trajectory[^1].BiomassGPerL, 12);
    }

    [Fact]
    public void ApplyRemoval_late_with_measured_volume_gives_the_state_of_the_removal_taken_on_time()
    {
        // With the volume measured, the level already shows the withdrawal; the biomass balance
        // (docs/methods.md §4, d(XV)/dt = r_X V - X·F_out) must lose X·ΔV at the withdrawal whether the
        // operator announced it on time or hours later: the re-propagation reproduces the on-time run.
        var s = EstimationFixtures.Settings();
        var onTime = Grow(s, 180, withdrawAtMinute: 60, measuredVolume: true);
        var late = Grow(s, 180, withdrawAtMinute: 60, measuredVolume: true, announce: false);
        var c = OfflineCorrections.ApplyRemoval(late, EstimationFixtures.Start.AddMinutes(60), 2.5, volumeIntegrated: false, s);
        Assert.Equal(OfflineSampleOutcome.Applied, c.Outcome);
        Assert.Equal(onTime.Observers.BiomassG, late.Observers.BiomassG, onTime.Observers.BiomassG * 1e-12);
        Assert.Equal(onTime.Observers.EkfBiomassG, late.Observers.EkfBiomassG, onTime.Observers.EkfBiomassG * 1e-12);
        Assert.Equal(onTime.Observers.BiomassVarG2, late.Observers.BiomassVarG2, onTime.Observers.BiomassVarG2 * 1e-12);
        Assert.Equal(onTime.VolumeL, late.VolumeL, 12);
    }

    [Fact]
    public void ApplyRemoval_with_integrated_volume_takes_out_the_withdrawn_volume_and_its_biomass()
    {
        // Integrated volume: the withdrawal lowers every later volume by ΔV; the biomass balance loses the
        // grams in the withdrawn broth, X·ΔV at the time of the withdrawal (docs/methods.md §4), and the
        // grams grown afterwards stay as the balance computed them.
        var s = EstimationFixtures.Settings();
        var state = Grow(s, 180, withdrawAtMinute: -1, measuredVolume: false);
        int k = state.History.IndexAtOrBefore(EstimationFixtures.Start.AddMinutes(60).UtcTicks);
        double xvBefore = state.History[k - 1].States.BiomassG;
        double vAtK = state.History[k].Inputs.VolumeL;
        double grams = state.Observers.BiomassG, volume = state.VolumeL;
        var c = OfflineCorrections.ApplyRemoval(state, EstimationFixtures.Start.AddMinutes(60), 2.5, volumeIntegrated: true, s);
        Assert.Equal(OfflineSampleOutcome.Applied, c.Outcome);
        Assert.Equal(volume - 2.5, state.VolumeL, 9);
        Assert.Equal(vAtK - 2.5, c.Trajectory[0].VolumeL, 9);
        Assert.Equal(grams - (xvBefore * 2.5 / vAtK), state.Observers.BiomassG, grams * 1e-12);
    }

    [Fact]
    public void ApplyRemoval_outside_the_history_or_ahead_of_the_estimator_is_reported_not_applied()
    {
        var s = EstimationFixtures.Settings();
        var state = Grow(s, 30, withdrawAtMinute: -1, measuredVolume: true);
        Assert.Equal(OfflineSampleOutcome.TooOld, OfflineCorrections.ApplyRemoval(state, EstimationFixtures.Start.AddHours(-1), 1, false, s).Outcome);
        Assert.Equal(OfflineSampleOutcome.NotYetReached, OfflineCorrections.ApplyRemoval(state, EstimationFixtures.Start.AddHours(1), 1, false, s).Outcome);
        Assert.Equal(OfflineSampleOutcome.Invalid, OfflineCorrections.ApplyRemoval(state, EstimationFixtures.Start.AddMinutes(10), -1, false, s).Outcome);
    }

    private static EstimatorState Grow(EstimatorSettings s, int minutes, int withdrawAtMinute, bool measuredVolume, bool announce = true)
    {
        var state = new EstimatorState(s.HistoryCapacity);
        var o = new CycleOutputs();
        double v = 100;
        for (int m = 0; m <= minutes; m++)
        {
            var t = EstimationFixtures.Start.AddMinutes(m);
            if (m == withdrawAtMinute)
            {
                v -= 2.5;
                if (announce)
                {
                    state.RegisterRemoval(2.5);
                }
            }

            var inputs = measuredVolume ? EstimationFixtures.Inputs(t, v) : new Signals.AlignedInputs { Time = t };
            EstimationStep.Run(inputs, EstimationFixtures.Rates(0.12, Math.Exp(0.12 * m / 60.0), s), state, s, o);
        }

        return state;
    }
}
