using SoftSensor.Core.Estimation;

namespace SoftSensor.Daemon.Samples;

/// <summary>
/// A reactor cycle that takes operator inputs on its kept history (the full estimator). Same threading
/// contract as <see cref="Pipeline.IReactorCycle"/>: called from its pipeline's cycle task only.
/// </summary>
internal interface IOfflineInputTarget
{
    /// <summary>Time of the last cycle the estimator ran (null before the first).</summary>
    DateTimeOffset? ReachedAt { get; }

    /// <summary>Applies an offline biomass sample at its sampling time (Kalman update, re-propagation to now).</summary>
    OfflineCorrection ApplySample(in OfflineSample sample);

    /// <summary>Takes a withdrawal of broth out at its time (volume and biomass balance, re-propagation to now).</summary>
    OfflineCorrection ApplyRemoval(DateTimeOffset at, double volumeL);
}
