namespace SoftSensor.Daemon.Demo;

/// <summary>
/// A clock that runs <see cref="Speed"/> times faster than the wall clock from a chosen start (the
/// demo's accelerated batch): wall time elapsed × speed is added to the start; timers fire at their
/// period divided by the speed. Timestamps (<see cref="TimeProvider.GetTimestamp"/>) stay real, so
/// latency metrics measure the machine, not the simulation.
/// </summary>
internal sealed class ScaledTimeProvider : TimeProvider
{
    private readonly DateTimeOffset _start;
    private readonly long _origin;

    public ScaledTimeProvider(DateTimeOffset start, double speed)
    {
        ArgumentOutOfRangeException.ThrowIfLessThanOrEqual(speed, 0);
        _start = start;
        Speed = speed;
        _origin = System.GetTimestamp();
    }

    /// <summary>Simulated seconds per wall-clock second.</summary>
    public double Speed { get; }

    public override DateTimeOffset GetUtcNow() => _start + System.GetElapsedTime(_origin) * Speed;

    public override ITimer CreateTimer(TimerCallback callback, object? state, TimeSpan dueTime, TimeSpan period) =>
        System.CreateTimer(callback, state, Scale(dueTime), Scale(period));

    private TimeSpan Scale(TimeSpan t) => t == Timeout.InfiniteTimeSpan ? t : t / Speed;
}
