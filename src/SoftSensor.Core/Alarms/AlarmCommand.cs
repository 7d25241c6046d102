namespace SoftSensor.Core.Alarms;

/// <summary>An operator's action on an alarm.</summary>
public enum AlarmCommandKind
{
    Acknowledge,
    Shelve,
    Unshelve,
    RemoveFromService,
    ReturnToService,
}

/// <summary>
/// An operator's command. <paramref name="RuleId"/> <c>*</c> acknowledges every alarm awaiting
/// acknowledgement (the other commands need one rule).
/// </summary>
/// <param name="Kind">What to do.</param>
/// <param name="RuleId">Which alarm.</param>
/// <param name="Time">When the command was received (UTC, from the adapter's clock).</param>
/// <param name="Operator">Who sent it (free text, journaled).</param>
/// <param name="ShelveFor">How long to shelve (Shelve only).</param>
public sealed record AlarmCommand(AlarmCommandKind Kind, string RuleId, DateTimeOffset Time, string Operator, TimeSpan? ShelveFor = null)
{
    /// <summary>The id that addresses every alarm (Acknowledge only).</summary>
    public const string AllRules = "*";
}

/// <summary>The outcome of a command: applied with its transitions, or refused with the reason.</summary>
public sealed record AlarmCommandResult(bool Applied, IReadOnlyList<AlarmTransition> Transitions, string Message)
{
    /// <summary>A refusal.</summary>
    public static AlarmCommandResult Refused(string message) => new(false, [], message);
}
