namespace SoftSensor.Core.Alarms;

/// <summary>Why an alarm changed state.</summary>
public enum AlarmCause
{
    /// <summary>A → B: the condition became present.</summary>
    Activated,
    /// <summary>D → B: the condition came back before anyone acknowledged.</summary>
    Reactivated,
    /// <summary>B → D or C → A: the condition cleared.</summary>
    ReturnedToNormal,
    /// <summary>B → C or D → A: an operator acknowledged.</summary>
    Acknowledged,
    /// <summary>→ F: an operator shelved (or re-shelved with a new expiry).</summary>
    Shelved,
    /// <summary>F →: an operator unshelved.</summary>
    Unshelved,
    /// <summary>F →: the shelving time ran out.</summary>
    ShelveExpired,
    /// <summary>→ G: the watched signal went bad.</summary>
    Suppressed,
    /// <summary>G →: the watched signal is usable again.</summary>
    Unsuppressed,
    /// <summary>→ H: removed from service.</summary>
    RemovedFromService,
    /// <summary>H →: returned to service.</summary>
    ReturnedToService,
    /// <summary>→ A (beneath any mask): a new batch began, the previous batch's process states were cleared.</summary>
    NewBatch,
}

/// <summary>One state change of one alarm: what the journal stores and the event topic carries.</summary>
/// <param name="RuleId">The rule.</param>
/// <param name="From">State before.</param>
/// <param name="To">State after (equal to <paramref name="From"/> only for a re-shelve).</param>
/// <param name="Cause">Why.</param>
/// <param name="Time">Evaluation or command time (UTC).</param>
/// <param name="Value">The source value at that time (NaN when unknown).</param>
/// <param name="Priority">The rule's priority.</param>
/// <param name="Operator">Who commanded it (null for process-driven changes).</param>
/// <param name="ShelvedUntil">Expiry, for a shelve.</param>
public sealed record AlarmTransition(
    string RuleId,
    AlarmState From,
    AlarmState To,
    AlarmCause Cause,
    DateTimeOffset Time,
    double Value,
    AlarmPriority Priority,
    string? Operator,
    DateTimeOffset? ShelvedUntil);

/// <summary>The state of one alarm, enough to show it and to restore it after a restart.</summary>
/// <param name="RuleId">The rule.</param>
/// <param name="State">The state shown (A–H).</param>
/// <param name="ConditionPresent">The (delayed) process condition.</param>
/// <param name="Since">When <paramref name="State"/> was entered.</param>
/// <param name="ShelvedUntil">Shelve expiry, when shelved.</param>
/// <param name="Suppressed">Suppressed by design (may be hidden under shelved or out of service).</param>
/// <param name="OutOfService">Removed from service.</param>
/// <param name="UnmaskedState">The state among A–D the alarm is in beneath any mask.</param>
/// <param name="LastValue">The latest source value.</param>
public sealed record AlarmStatus(
    string RuleId,
    AlarmState State,
    bool ConditionPresent,
    DateTimeOffset Since,
    DateTimeOffset? ShelvedUntil,
    bool Suppressed,
    bool OutOfService,
    AlarmState UnmaskedState,
    double LastValue);
