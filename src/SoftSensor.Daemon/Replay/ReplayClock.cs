namespace SoftSensor.Daemon.Replay;

/// <summary>The clock of a replay: the export's own timeline, set by the replay before each cycle.</summary>
internal sealed class ReplayClock(DateTimeOffset start) : TimeProvider
{
    private DateTimeOffset _now = start;

    /// <summary>Moves the clock to <paramref name="time"/> (never back).</summary>
    public void Set(DateTimeOffset time)
    {
        if (time > _now)
        {
            _now = time;
        }
    }

    public override DateTimeOffset GetUtcNow() => _now;
}
