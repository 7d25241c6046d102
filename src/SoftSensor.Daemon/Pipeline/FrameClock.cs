namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// The time of each frame of one reactor: its cycle's scheduled time (the tick the period loop was
/// due at, or the moment a triggered cycle ran), in whole milliseconds, and always after the frame
/// before it, including the newest frame a previous run stored (<see cref="Resume"/>). Two frames of
/// a reactor never share a time, so a time-series database (one value per series and time) keeps
/// every one and a trend never steps back. When the schedule would not move past the previous
/// frame, a tick in the slot of the one before (timer jitter) takes the next millisecond, and a
/// clock a period or more behind the previous frame (set back, or a restart whose clock is behind
/// the store) gives the previous time plus one period, so frames keep the reactor's pace.
/// Threading contract: used from its pipeline's cycle task only.
/// </summary>
internal sealed class FrameClock(TimeSpan period)
{
    private readonly long _periodMs = Math.Max(1, (long)period.TotalMilliseconds);
    private long _lastMs = long.MinValue;
    private long _originMs = long.MinValue;

    /// <summary>The newest frame time handed out (or resumed from), null before the first.</summary>
    public DateTimeOffset? Last => _lastMs == long.MinValue ? null : DateTimeOffset.FromUnixTimeMilliseconds(_lastMs);

    /// <summary>Times a schedule was behind the previous frame and the frame was moved after it.</summary>
    public long Bumped { get; private set; }

    /// <summary>Continues after a frame a previous run stored.</summary>
    public void Resume(DateTimeOffset lastStored)
    {
        _lastMs = Math.Max(_lastMs, lastStored.ToUnixTimeMilliseconds());
    }

    /// <summary>Starts the period grid at <paramref name="origin"/> (the period loop's start): ticks are due at origin + k·period.</summary>
    public void StartGrid(DateTimeOffset origin) => _originMs = origin.ToUnixTimeMilliseconds();

    /// <summary>
    /// The time of a cycle run at <paramref name="now"/>: on the grid (the tick it was due at, a late
    /// tick keeps its due time) once <see cref="StartGrid"/> was called, else <paramref name="now"/>
    /// itself; in both cases after the previous frame.
    /// </summary>
    public DateTimeOffset Next(DateTimeOffset now)
    {
        long ms = now.ToUnixTimeMilliseconds();
        if (_originMs != long.MinValue && ms >= _originMs)
        {
            ms = _originMs + ((ms - _originMs) / _periodMs * _periodMs);
        }

        if (_lastMs != long.MinValue && ms <= _lastMs)
        {
            // A tick that lands in the slot of the one before (timer jitter) takes the next millisecond;
            // a clock a period or more behind the previous frame keeps the reactor's pace.
            ms = _lastMs + (_lastMs - ms < _periodMs ? 1 : _periodMs);
            Bumped++;
        }

        _lastMs = ms;
        return DateTimeOffset.FromUnixTimeMilliseconds(ms);
    }
}
