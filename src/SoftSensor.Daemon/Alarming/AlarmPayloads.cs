using System.Text.Json;
using System.Text.Json.Serialization;
using SoftSensor.Core.Alarms;

namespace SoftSensor.Daemon.Alarming;

/// <summary>The retained state of one alarm as published (MQTT) and served (status page).</summary>
internal sealed record AlarmStateDocument(
    string Reactor,
    string Alarm,
    string State,
    bool Active,
    bool AwaitingAcknowledgement,
    string Priority,
    string Category,
    string Message,
    DateTimeOffset Since,
    DateTimeOffset? ShelvedUntil,
    double? Value);

/// <summary>One transition as published on the event topic.</summary>
internal sealed record AlarmEventDocument(
    string Reactor,
    string Alarm,
    string From,
    string To,
    string Cause,
    DateTimeOffset Time,
    double? Value,
    string Priority,
    string? Operator,
    DateTimeOffset? ShelvedUntil,
    string Message);

/// <summary>JSON payloads and stable ids of the alarm types (lowercase, '_' between words).</summary>
internal static class AlarmPayloads
{
    public static JsonSerializerOptions Json { get; } = new(JsonSerializerDefaults.Web)
    {
        DefaultIgnoreCondition = JsonIgnoreCondition.Never,
    };

    public static AlarmStateDocument State(string reactor, AlarmRule rule, AlarmStatus s) => new(
        reactor, rule.Id, AlarmStates.Id(s.State), s.State is AlarmState.Unacknowledged or AlarmState.Acknowledged,
        s.State is AlarmState.Unacknowledged or AlarmState.ReturnedUnacknowledged, PriorityId(rule.Priority), rule.Category, rule.Message,
        s.Since, s.ShelvedUntil, Finite(s.LastValue));

    public static AlarmEventDocument Event(string reactor, AlarmRule rule, AlarmTransition t) => new(
        reactor, rule.Id, AlarmStates.Id(t.From), AlarmStates.Id(t.To), CauseId(t.Cause), t.Time, Finite(t.Value),
        PriorityId(t.Priority), t.Operator, t.ShelvedUntil, rule.Message);

    public static byte[] Serialize<T>(T doc) => JsonSerializer.SerializeToUtf8Bytes(doc, Json);

    public static string CauseId(AlarmCause c) => Snake(c.ToString());

    public static AlarmCause ParseCause(string id) => Enum.GetValues<AlarmCause>().FirstOrDefault(c => CauseId(c) == id);

    public static string PriorityId(AlarmPriority p) => Snake(p.ToString());

    public static AlarmPriority ParsePriority(string id) => Enum.GetValues<AlarmPriority>().FirstOrDefault(p => PriorityId(p) == id, AlarmPriority.Medium);

    private static double? Finite(double v) => double.IsFinite(v) ? v : null;

    private static string Snake(string pascal) =>
        string.Concat(pascal.Select((c, i) => char.IsUpper(c) && i > 0 ? "_" + char.ToLowerInvariant(c) : char.ToLowerInvariant(c).ToString()));
}
