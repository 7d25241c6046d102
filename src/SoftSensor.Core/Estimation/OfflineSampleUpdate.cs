namespace SoftSensor.Core.Estimation;

/// <summary>
/// Applies an offline sample as a Kalman update at its sampling time (docs/methods.md §4: offline
/// samples correct the estimate, never by overwriting history) and re-runs both observers over
/// the cycles kept since, from the inputs those cycles stored. Allocation-free.
/// </summary>
public static class OfflineSampleUpdate
{
    /// <summary>Applies <paramref name="sample"/> to <paramref name="state"/>.</summary>
    public static OfflineSampleOutcome Apply(EstimatorState state, in OfflineSample sample, EstimatorSettings settings)
    {
        if (!(double.IsFinite(sample.BiomassGPerL) && sample.BiomassGPerL >= 0
              && double.IsFinite(sample.SigmaGPerL) && sample.SigmaGPerL > 0))
        {
            return OfflineSampleOutcome.Invalid;
        }

        var history = state.History;
        long t = sample.SampledAt.UtcTicks;
        if (!state.Initialised || t > state.TimeTicks)
        {
            return OfflineSampleOutcome.NotYetReached;
        }

        int i = history.IndexAtOrBefore(t);
        if (i < 0)
        {
            return OfflineSampleOutcome.TooOld;
        }

        double variance = sample.SigmaGPerL * sample.SigmaGPerL;
        ref var at = ref history[i];
        var s = at.States;
        double v = at.Inputs.VolumeL;
        BiomassIntegrator.Correct(ref s, v, sample.BiomassGPerL, variance);
        PirtEkf.Correct(ref s, v, sample.BiomassGPerL, variance);
        at.States = s;

        for (int j = i + 1; j < history.Count; j++)
        {
            ref var next = ref history[j];
            var u = next.Inputs;
            BiomassIntegrator.Advance(ref s, u, settings);
            PirtEkf.Advance(ref s, u, settings);
            next.States = s;
        }

        state.Observers = s;
        state.OfflineSamplesApplied++;
        return OfflineSampleOutcome.Applied;
    }
}
