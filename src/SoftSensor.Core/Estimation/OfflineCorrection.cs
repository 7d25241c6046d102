namespace SoftSensor.Core.Estimation;

/// <summary>One cycle of a re-propagated (corrected) biomass trajectory.</summary>
/// <param name="TimeTicks">Cycle time, UTC ticks.</param>
/// <param name="BiomassGPerL">Biomass of the selected observer, g/L.</param>
/// <param name="BiomassSigmaGPerL">Its standard uncertainty, g/L.</param>
/// <param name="IntegratorGPerL">Biomass of the balance integrator, g/L.</param>
/// <param name="EkfGPerL">Biomass of the Pirt filter, g/L.</param>
/// <param name="VolumeL">Liquid volume of the cycle, L.</param>
public readonly record struct TrajectoryPoint(long TimeTicks, double BiomassGPerL, double BiomassSigmaGPerL, double IntegratorGPerL, double EkfGPerL, double VolumeL)
{
    /// <summary>The point of a kept cycle.</summary>
    public static TrajectoryPoint Of(in HistoryEntry e, EstimatorSettings settings)
    {
        var s = e.States;
        double v = e.Inputs.VolumeL;
        bool ekf = settings.Observer == ObserverKind.PirtEkf;
        double variance = ekf ? s.EkfP00 : s.BiomassVarG2;
        return new TrajectoryPoint(e.TimeTicks, (ekf ? s.EkfBiomassG : s.BiomassG) / v, Math.Sqrt(Math.Max(variance, 0.0)) / v,
            s.BiomassG / v, s.EkfBiomassG / v, v);
    }
}

/// <summary>What an operator input did: its outcome, the estimate at the update point before it, and the corrected trajectory from there to the present.</summary>
/// <param name="Outcome">Applied, or why not.</param>
/// <param name="Prior">The kept cycle the input was applied at, as it stood before (default when not applied).</param>
/// <param name="Trajectory">The re-propagated cycles from the update point to the present (empty when not applied).</param>
public sealed record OfflineCorrection(OfflineSampleOutcome Outcome, TrajectoryPoint Prior, IReadOnlyList<TrajectoryPoint> Trajectory);

/// <summary>
/// Operator inputs applied on the kept cycle history (docs/methods.md §4): an offline biomass sample
/// (a Kalman update at its sampling time, <see cref="OfflineSampleUpdate"/>) and a withdrawal of broth at
/// a past time (it changes the retained biomass of that cycle and, when the volume is integrated, every
/// volume since). Both re-run the observers to the present; the caller keeps what was published.
/// </summary>
public static class OfflineCorrections
{
    /// <summary>Applies an offline biomass sample and returns the prior at the update point and the corrected trajectory.</summary>
    public static OfflineCorrection ApplySample(EstimatorState state, in OfflineSample sample, EstimatorSettings settings)
    {
        long t = sample.SampledAt.UtcTicks;
        int i = state.Initialised && t <= state.TimeTicks ? state.History.IndexAtOrBefore(t) : -1;
        var prior = i >= 0 ? TrajectoryPoint.Of(state.History[i], settings) : default;
        var outcome = OfflineSampleUpdate.Apply(state, sample, settings);
        return new OfflineCorrection(outcome, prior, outcome == OfflineSampleOutcome.Applied ? From(state, i, settings) : []);
    }

    /// <summary>
    /// Takes <paramref name="volumeL"/> of broth out at the kept cycle at or before <paramref name="at"/>: that
    /// cycle's removed fraction grows (d(X·V)/dt loses X·ΔV, docs/methods.md §4); with an integrated volume
    /// (<paramref name="volumeIntegrated"/>) every later volume drops by ΔV and the per-litre rates of those
    /// cycles are rescaled so that the grams they added stay the same. The observers are re-run from the
    /// cycle before. Needs one kept cycle before the removal (else <see cref="OfflineSampleOutcome.TooOld"/>).
    /// </summary>
    public static OfflineCorrection ApplyRemoval(EstimatorState state, DateTimeOffset at, double volumeL, bool volumeIntegrated, EstimatorSettings settings)
    {
        if (!(double.IsFinite(volumeL) && volumeL > 0))
        {
            return new OfflineCorrection(OfflineSampleOutcome.Invalid, default, []);
        }

        long t = at.UtcTicks;
        if (!state.Initialised || t > state.TimeTicks)
        {
            return new OfflineCorrection(OfflineSampleOutcome.NotYetReached, default, []);
        }

        var history = state.History;
        int i = history.IndexAtOrBefore(t);
        if (i < 1)
        {
            return new OfflineCorrection(OfflineSampleOutcome.TooOld, default, []);
        }

        var prior = TrajectoryPoint.Of(history[i], settings);
        for (int j = i; j < history.Count; j++)
        {
            ref var e = ref history[j];
            var u = e.Inputs;
            double v = u.VolumeL;
            double after = volumeIntegrated ? Math.Max(v - volumeL, 1e-9) : v;
            if (j == i)
            {
                // RemovedFraction = removed / (volume after the step + removed), as EstimationStep writes it.
                double before = u.RemovedFraction > 0 ? u.RemovedFraction * v / (1.0 - u.RemovedFraction) : 0.0;
                double total = before + volumeL;
                u.RemovedFraction = Math.Min(total / (after + total), 0.999);
            }

            if (volumeIntegrated)
            {
                // Rates per litre were computed with the old volume: keep the amounts (rate × volume) the same.
                double scale = v / after;
                u.GrowthGPerLh *= scale;
                u.GrowthSigmaGPerLh *= scale;
                u.OurMmolPerLh *= scale;
                u.OurSigmaMmolPerLh *= scale;
                u.VolumeL = after;
            }

            e.Inputs = u;
        }

        var s = history[i - 1].States;
        for (int j = i; j < history.Count; j++)
        {
            ref var e = ref history[j];
            var u = e.Inputs;
            BiomassIntegrator.Advance(ref s, u, settings);
            PirtEkf.Advance(ref s, u, settings);
            e.States = s;
        }

        state.Observers = s;
        if (volumeIntegrated)
        {
            double v = state.VolumeL;
            state.VolumeL = Math.Max(v - volumeL, 1e-9);
        }

        // The residual substrate leaves with the broth in the same proportion (concentration unchanged).
        double now = state.VolumeL;
        state.SubstrateG *= volumeIntegrated ? now / (now + volumeL) : 1.0 - (volumeL / (now + volumeL));
        return new OfflineCorrection(OfflineSampleOutcome.Applied, prior, From(state, i, settings));
    }

    private static TrajectoryPoint[] From(EstimatorState state, int i, EstimatorSettings settings)
    {
        var history = state.History;
        var points = new TrajectoryPoint[history.Count - i];
        for (int j = i; j < history.Count; j++)
        {
            points[j - i] = TrajectoryPoint.Of(history[j], settings);
        }

        return points;
    }
}
