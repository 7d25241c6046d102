namespace SoftSensor.Core.Alarms;

/// <summary>
/// On-delay and off-delay of an alarm condition (ANSI/ISA-18.2 "alarm on-delay / off-delay"): the
/// filtered condition changes only after the raw condition has held its new value without a
/// break for the delay, measured on the evaluation times passed in.
/// </summary>
public sealed class DelayFilter
{
    private readonly TimeSpan _onDelay;
    private readonly TimeSpan _offDelay;
    private DateTimeOffset? _pendingSince;

    /// <summary>Creates a filter; both delays must be zero or more.</summary>
    public DelayFilter(TimeSpan onDelay, TimeSpan offDelay)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(onDelay, TimeSpan.Zero);
        ArgumentOutOfRangeException.ThrowIfLessThan(offDelay, TimeSpan.Zero);
        _onDelay = onDelay;
        _offDelay = offDelay;
    }

    /// <summary>The filtered condition.</summary>
    public bool IsOn { get; private set; }

    /// <summary>Takes the raw condition at <paramref name="time"/> and returns the filtered one.</summary>
    public bool Update(bool raw, DateTimeOffset time)
    {
        if (raw == IsOn)
        {
            _pendingSince = null;
            return IsOn;
        }

        if (_pendingSince is not { } since || time < since)
        {
            _pendingSince = since = time;
        }

        if (time - since >= (raw ? _onDelay : _offDelay))
        {
            IsOn = raw;
            _pendingSince = null;
        }

        return IsOn;
    }

    /// <summary>Keeps the filtered condition but forgets a pending change (the raw condition is unknown).</summary>
    public bool Hold()
    {
        _pendingSince = null;
        return IsOn;
    }

    /// <summary>Sets the filtered condition (restart, suppression) and forgets a pending change.</summary>
    public void Reset(bool on)
    {
        IsOn = on;
        _pendingSince = null;
    }
}
