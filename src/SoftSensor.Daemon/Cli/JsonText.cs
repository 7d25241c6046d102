using System.Globalization;
using System.Text;
using System.Text.Json;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// Human-readable text of a JSON answer, for the client verbs without <c>--json</c>: one
/// <c>name: value</c> line per field (names as the API spells them, their unit in the name), nested
/// objects indented, a list of objects as numbered blocks, null as <c>-</c>.
/// </summary>
internal static class JsonText
{
    public static string Render(JsonElement root)
    {
        var b = new StringBuilder();
        Write(b, root, 0, null);
        return b.ToString().TrimEnd();
    }

    private static void Write(StringBuilder b, JsonElement e, int indent, string? name)
    {
        string pad = new(' ', indent * 2);
        switch (e.ValueKind)
        {
            case JsonValueKind.Object:
                if (name is not null)
                {
                    b.Append(pad).Append(name).AppendLine(":");
                    indent++;
                }

                foreach (var p in e.EnumerateObject())
                {
                    Write(b, p.Value, indent, p.Name);
                }

                break;
            case JsonValueKind.Array when e.EnumerateArray().Any(x => x.ValueKind is JsonValueKind.Object or JsonValueKind.Array):
                if (name is not null)
                {
                    b.Append(pad).Append(name).AppendLine(":");
                }

                int i = 0;
                foreach (var x in e.EnumerateArray())
                {
                    Write(b, x, indent + 1, "#" + (++i).ToString(CultureInfo.InvariantCulture));
                }

                if (i == 0)
                {
                    b.Append(pad).AppendLine("  (none)");
                }

                break;
            default:
                b.Append(pad);
                if (name is not null)
                {
                    b.Append(name).Append(": ");
                }

                b.AppendLine(Scalar(e));
                break;
        }
    }

    private static string Scalar(JsonElement e) => e.ValueKind switch
    {
        JsonValueKind.String => e.GetString() ?? "",
        JsonValueKind.Null => "-",
        JsonValueKind.Array => e.GetArrayLength() == 0 ? "(none)" : string.Join(", ", e.EnumerateArray().Select(Scalar)),
        JsonValueKind.Number => e.TryGetDouble(out double d) ? Number(d) : e.GetRawText(),
        _ => e.GetRawText(),
    };

    private static string Number(double d) =>
        d == Math.Round(d) && Math.Abs(d) < 1e15 ? d.ToString("F0", CultureInfo.InvariantCulture) : d.ToString("G6", CultureInfo.InvariantCulture);
}
