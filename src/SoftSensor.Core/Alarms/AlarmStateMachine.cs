namespace SoftSensor.Core.Alarms;

/// <summary>
/// The ANSI/ISA-18.2-2016 alarm state model for one alarm (IEC 62682:2014 has the same figure).
/// Unmasked states and their transitions:
/// A normal → B unacknowledged (condition present); B → C acknowledged (operator); B → D
/// return-to-normal unacknowledged (condition cleared); C → A (cleared); D → A (operator);
/// D → B (condition back). Masks, strongest first: H out of service, F shelved (with an expiry),
/// G suppressed by design. Leaving a mask lands in B when the condition is present, else in A.
/// Pure: time arrives as arguments; every method returns the transition it caused, or null.
/// </summary>
public sealed class AlarmStateMachine
{
    private readonly string _ruleId;
    private readonly AlarmPriority _priority;
    private AlarmState _unmasked = AlarmState.Normal;
    private DateTimeOffset? _shelvedUntil;
    private bool _suppressed;
    private bool _outOfService;

    /// <summary>Creates a machine in state A (normal).</summary>
    public AlarmStateMachine(string ruleId, AlarmPriority priority, DateTimeOffset since)
    {
        _ruleId = ruleId;
        _priority = priority;
        Since = since;
    }

    /// <summary>The state shown.</summary>
    public AlarmState State => _outOfService ? AlarmState.OutOfService
        : _shelvedUntil is not null ? AlarmState.Shelved
        : _suppressed ? AlarmState.SuppressedByDesign
        : _unmasked;

    /// <summary>When <see cref="State"/> was entered.</summary>
    public DateTimeOffset Since { get; private set; }

    /// <summary>The latest (delayed) process condition.</summary>
    public bool ConditionPresent { get; private set; }

    /// <summary>The latest source value.</summary>
    public double LastValue { get; private set; } = double.NaN;

    /// <summary>The state and everything needed to restore it.</summary>
    public AlarmStatus Status => new(_ruleId, State, ConditionPresent, Since, _shelvedUntil, _suppressed, _outOfService, _unmasked, LastValue);

    /// <summary>
    /// One evaluation: the shelve expiry is checked first, then suppression by design, then the
    /// process condition moves the unmasked state.
    /// </summary>
    public AlarmTransition? Step(DateTimeOffset time, bool conditionPresent, bool suppressed, double value)
    {
        var before = State;
        AlarmCause? cause = null;
        LastValue = value;
        ConditionPresent = conditionPresent;
        if (_shelvedUntil is { } until && time >= until)
        {
            _shelvedUntil = null;
            cause = AlarmCause.ShelveExpired;
        }

        if (suppressed != _suppressed)
        {
            _suppressed = suppressed;
            cause ??= suppressed ? AlarmCause.Suppressed : AlarmCause.Unsuppressed;
        }

        if (AlarmStates.IsMasked(State))
        {
            return Emit(before, cause, time, null, force: false);
        }

        if (AlarmStates.IsMasked(before))
        {
            _unmasked = conditionPresent ? AlarmState.Unacknowledged : AlarmState.Normal;
            return Emit(before, cause, time, null, force: false);
        }

        (_unmasked, cause) = (_unmasked, conditionPresent) switch
        {
            (AlarmState.Normal, true) => (AlarmState.Unacknowledged, AlarmCause.Activated),
            (AlarmState.Unacknowledged, false) => (AlarmState.ReturnedUnacknowledged, AlarmCause.ReturnedToNormal),
            (AlarmState.Acknowledged, false) => (AlarmState.Normal, AlarmCause.ReturnedToNormal),
            (AlarmState.ReturnedUnacknowledged, true) => (AlarmState.Unacknowledged, AlarmCause.Reactivated),
            _ => (_unmasked, cause),
        };
        return Emit(before, cause, time, null, force: false);
    }

    /// <summary>Operator acknowledgement: B → C, D → A; refused in any other state.</summary>
    public AlarmTransition? Acknowledge(DateTimeOffset time, string by, out string refusal)
    {
        refusal = "";
        var before = State;
        switch (before)
        {
            case AlarmState.Unacknowledged:
                _unmasked = AlarmState.Acknowledged;
                break;
            case AlarmState.ReturnedUnacknowledged:
                _unmasked = AlarmState.Normal;
                break;
            default:
                refusal = $"alarm '{_ruleId}' is {AlarmStates.Id(before)}: nothing to acknowledge";
                return null;
        }

        return Emit(before, AlarmCause.Acknowledged, time, by, force: false);
    }

    /// <summary>Shelves until <paramref name="until"/> (A–D, G or already shelved: a new expiry); refused out of service or with an expiry not after <paramref name="time"/>.</summary>
    public AlarmTransition? Shelve(DateTimeOffset time, DateTimeOffset until, string by, out string refusal)
    {
        refusal = "";
        var before = State;
        if (_outOfService)
        {
            refusal = $"alarm '{_ruleId}' is out of service: return it to service before shelving";
            return null;
        }

        if (until <= time)
        {
            refusal = $"alarm '{_ruleId}': shelve expiry {until:O} is not after the command time {time:O}";
            return null;
        }

        _shelvedUntil = until;
        return Emit(before, AlarmCause.Shelved, time, by, force: true);
    }

    /// <summary>Ends a shelve early; refused when not shelved.</summary>
    public AlarmTransition? Unshelve(DateTimeOffset time, string by, out string refusal)
    {
        refusal = "";
        var before = State;
        if (before != AlarmState.Shelved)
        {
            refusal = $"alarm '{_ruleId}' is {AlarmStates.Id(before)}, not shelved";
            return null;
        }

        _shelvedUntil = null;
        Unmask();
        return Emit(before, AlarmCause.Unshelved, time, by, force: false);
    }

    /// <summary>Removes the alarm from service (from any state but H).</summary>
    public AlarmTransition? RemoveFromService(DateTimeOffset time, string by, out string refusal)
    {
        refusal = "";
        var before = State;
        if (_outOfService)
        {
            refusal = $"alarm '{_ruleId}' is already out of service";
            return null;
        }

        _outOfService = true;
        _shelvedUntil = null;
        return Emit(before, AlarmCause.RemovedFromService, time, by, force: false);
    }

    /// <summary>Returns an out-of-service alarm to service.</summary>
    public AlarmTransition? ReturnToService(DateTimeOffset time, string by, out string refusal)
    {
        refusal = "";
        var before = State;
        if (!_outOfService)
        {
            refusal = $"alarm '{_ruleId}' is {AlarmStates.Id(before)}, not out of service";
            return null;
        }

        _outOfService = false;
        Unmask();
        return Emit(before, AlarmCause.ReturnedToService, time, by, force: false);
    }

    /// <summary>
    /// A new batch: the process state goes back to A (normal, condition absent), whatever the previous
    /// batch left (active, unacknowledged); the operator's masks (shelved with its expiry, out of
    /// service) stay, since they are decisions about the instrument rather than the batch, and so does
    /// suppression by design, which the next evaluation sets from its signal. Null when nothing changed.
    /// </summary>
    public AlarmTransition? BeginBatch(DateTimeOffset time)
    {
        var before = State;
        bool changed = _unmasked != AlarmState.Normal || ConditionPresent;
        _unmasked = AlarmState.Normal;
        ConditionPresent = false;
        LastValue = double.NaN;
        return changed ? Emit(before, AlarmCause.NewBatch, time, null, force: true) : null;
    }

    /// <summary>Restores a state saved before a restart.</summary>
    public void Restore(AlarmStatus status)
    {
        if (AlarmStates.IsMasked(status.UnmaskedState))
        {
            throw new ArgumentException($"alarm '{_ruleId}': unmasked state {status.UnmaskedState} must be one of A–D", nameof(status));
        }

        _unmasked = status.UnmaskedState;
        _shelvedUntil = status.ShelvedUntil;
        _suppressed = status.Suppressed;
        _outOfService = status.OutOfService;
        ConditionPresent = status.ConditionPresent;
        LastValue = status.LastValue;
        Since = status.Since;
    }

    private void Unmask()
    {
        if (!AlarmStates.IsMasked(State))
        {
            _unmasked = ConditionPresent ? AlarmState.Unacknowledged : AlarmState.Normal;
        }
    }

    private AlarmTransition? Emit(AlarmState before, AlarmCause? cause, DateTimeOffset time, string? by, bool force)
    {
        var after = State;
        if ((after == before && !force) || cause is null)
        {
            return null;
        }

        Since = after == before ? Since : time;
        return new AlarmTransition(_ruleId, before, after, cause.Value, time, LastValue, _priority, by,
            after == AlarmState.Shelved ? _shelvedUntil : null);
    }
}
