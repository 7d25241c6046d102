using System.Text.Json;
using SoftSensor.Core.Alarms;

namespace SoftSensor.Daemon.Alarming;

/// <summary>
/// An operator command as JSON, the same on the MQTT command topic and the status page's POST:
/// <c>{"command": "acknowledge" | "shelve" | "unshelve" | "remove_from_service" | "return_to_service",
/// "alarm": "rq_window" (or "*" to acknowledge all), "operator": "name", "shelveMinutes": 30,
/// "reactor": "r1" (HTTP only; the topic names it on MQTT)}</c>.
/// </summary>
internal static class AlarmCommandPayload
{
    private const int MaxOperatorLength = 64;

    /// <summary>The parsed command and its reactor (null when the payload did not name one), or an error naming the field.</summary>
    public static bool TryParse(ReadOnlySpan<byte> json, DateTimeOffset now, out AlarmCommand command, out string? reactor, out string error, string? user = null)
    {
        command = null!;
        reactor = null;
        error = "";
        JsonDocument doc;
        try
        {
            var reader = new Utf8JsonReader(json, new JsonReaderOptions { CommentHandling = JsonCommentHandling.Skip, MaxDepth = 4 });
            doc = JsonDocument.ParseValue(ref reader);
        }
        catch (JsonException e)
        {
            error = "alarm command: not JSON (" + e.Message + ")";
            return false;
        }

        using (doc)
        {
            var root = doc.RootElement;
            if (root.ValueKind != JsonValueKind.Object)
            {
                error = "alarm command: expected a JSON object";
                return false;
            }

            string? verb = Text(root, "command");
            string? alarm = Text(root, "alarm");
            string op = user ?? Text(root, "operator") ?? "";
            reactor = Text(root, "reactor");
            AlarmCommandKind? kind = verb switch
            {
                "acknowledge" or "ack" => AlarmCommandKind.Acknowledge,
                "shelve" => AlarmCommandKind.Shelve,
                "unshelve" => AlarmCommandKind.Unshelve,
                "remove_from_service" => AlarmCommandKind.RemoveFromService,
                "return_to_service" => AlarmCommandKind.ReturnToService,
                _ => null,
            };
            if (kind is null)
            {
                error = $"alarm command: command is '{verb ?? "(missing)"}', expected acknowledge, shelve, unshelve, remove_from_service or return_to_service";
                return false;
            }

            if (string.IsNullOrWhiteSpace(alarm))
            {
                error = "alarm command: alarm is missing, expected a rule id (or \"*\" with acknowledge)";
                return false;
            }

            if (alarm == AlarmCommand.AllRules && kind != AlarmCommandKind.Acknowledge)
            {
                error = $"alarm command: alarm \"*\" only works with acknowledge, not {verb}";
                return false;
            }

            if (string.IsNullOrWhiteSpace(op) || op.Length > MaxOperatorLength)
            {
                error = $"alarm command: operator is '{op}', expected who sends it (1 to {MaxOperatorLength} characters): the journal records it";
                return false;
            }

            TimeSpan? shelve = null;
            if (kind == AlarmCommandKind.Shelve)
            {
                if (!root.TryGetProperty("shelveMinutes", out var m) || m.ValueKind != JsonValueKind.Number || !m.TryGetDouble(out double minutes) || !(minutes > 0) || minutes > 7 * 24 * 60)
                {
                    error = "alarm command: shelveMinutes is missing or not a number above 0 (at most 10080), expected how long to shelve";
                    return false;
                }

                shelve = TimeSpan.FromMinutes(minutes);
            }

            command = new AlarmCommand(kind.Value, alarm, now, op, shelve);
            return true;
        }
    }

    private static string? Text(JsonElement root, string name) =>
        root.TryGetProperty(name, out var v) && v.ValueKind == JsonValueKind.String ? v.GetString() : null;
}
