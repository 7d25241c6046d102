namespace SoftSensor.Core.Estimation;

/// <summary>The first part of a cycle: time step, broth removed and the liquid volume.</summary>
/// <param name="DtH">Time since the previous cycle, h (0 on the first).</param>
/// <param name="RemovedL">Broth removed since the previous cycle, L.</param>
/// <param name="VolumeL">Liquid volume after the step, L.</param>
/// <param name="Source">Where the volume came from.</param>
public readonly record struct VolumeStep(double DtH, double RemovedL, double VolumeL, VolumeSource Source)
{
    /// <summary>Starts a cycle: initialises the state on the first cycle, takes the removals and finds the volume.</summary>
    public static VolumeStep Begin(Signals.AlignedInputs inputs, EstimatorState state, EstimatorSettings settings)
    {
        long t = inputs.Time.UtcTicks;
        if (!state.Initialised)
        {
            EstimationStep.Initialise(inputs, t, state, settings);
        }

        double dtH = Math.Max(t - state.TimeTicks, 0) / (double)TimeSpan.TicksPerHour;
        double removed = VolumeTracker.TakeRemoved(inputs, state);
        double v = VolumeTracker.Current(inputs, state.VolumeL, removed, dtH, settings, out var source);
        return new VolumeStep(dtH, removed, v, source);
    }
}
