using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// Liquid volume (docs/methods.md §1.7): the controller's volume signal, else the load cell over the
/// broth density, else integrated from the last volume plus feed and base minus evaporation and
/// removals. Removals come from the removed-volume totaliser and from announced harvests.
/// </summary>
public static class VolumeTracker
{
    /// <summary>Broth removed since the last cycle, L (totaliser increase plus announced removals); updates the state's totaliser reading.</summary>
    public static double TakeRemoved(AlignedInputs inputs, EstimatorState state)
    {
        double removed = state.PendingRemovalL;
        state.PendingRemovalL = 0;
        if (Usable(inputs, SignalRole.RemovedVolumeL, out double total) && total >= 0)
        {
            if (double.IsFinite(state.RemovedTotalL) && total > state.RemovedTotalL)
            {
                removed += total - state.RemovedTotalL;
            }

            state.RemovedTotalL = total;
        }

        return removed;
    }

    /// <summary>The volume after this step, L, and its source.</summary>
    public static double Current(AlignedInputs inputs, double previousL, double removedL, double dtH,
        EstimatorSettings settings, out VolumeSource source)
    {
        if (Usable(inputs, SignalRole.LiquidVolumeL, out double v) && v > 0)
        {
            source = VolumeSource.Measured;
            return v;
        }

        if (Usable(inputs, SignalRole.WeightKg, out double w) && w > 0)
        {
            source = VolumeSource.Weight;
            return w / settings.BrothDensityKgPerL;
        }

        source = VolumeSource.Integrated;
        double added = PositiveOrZero(inputs, SignalRole.FeedRateLPerH) + PositiveOrZero(inputs, SignalRole.BaseRateLPerH)
                       - settings.EvaporationLPerH;
        return Math.Max(previousL + (added * Math.Max(dtH, 0)) - removedL, 1e-9);
    }

    internal static bool Usable(AlignedInputs inputs, SignalRole role, out double value)
    {
        value = inputs[role];
        return inputs.QualityOf(role) != SampleQuality.Bad && double.IsFinite(value);
    }

    internal static double PositiveOrZero(AlignedInputs inputs, SignalRole role) =>
        Usable(inputs, role, out double v) && v > 0 ? v : 0.0;
}
