using System.Globalization;
using System.Text.Json;

namespace SoftSensor.Core.Flux;

/// <summary>Small typed readers for model-file fields; each error names the field and what was expected.</summary>
internal static class JsonFields
{
    public static Dictionary<string, JsonElement> Unique(JsonElement obj, string path)
    {
        var d = new Dictionary<string, JsonElement>(StringComparer.Ordinal);
        foreach (var p in obj.EnumerateObject())
        {
            if (!d.TryAdd(p.Name, p.Value))
            {
                throw new FluxModelException(path == "model" ? p.Name : $"{path}.{p.Name}", "duplicate key: each key may appear once");
            }
        }

        return d;
    }

    public static JsonElement Object(JsonElement e, string path) =>
        e.ValueKind == JsonValueKind.Object ? e : throw new FluxModelException(path, $"expected an object, found {e.ValueKind}");

    public static void OnlyKeys(Dictionary<string, JsonElement> props, string path, string[] allowed)
    {
        foreach (string key in props.Keys)
        {
            if (Array.IndexOf(allowed, key) < 0)
            {
                throw new FluxModelException($"{path}.{key}", $"unknown key (allowed: {string.Join(", ", allowed)})");
            }
        }
    }

    public static string String(JsonElement e, string path) =>
        e.ValueKind == JsonValueKind.String ? e.GetString()! : throw new FluxModelException(path, $"expected a string, found {e.ValueKind}");

    public static bool Bool(JsonElement e, string path) => e.ValueKind switch
    {
        JsonValueKind.True => true,
        JsonValueKind.False => false,
        _ => throw new FluxModelException(path, $"expected true or false, found {e.ValueKind}"),
    };

    public static double Number(JsonElement e, string path) =>
        e.ValueKind == JsonValueKind.Number && e.TryGetDouble(out double v) && double.IsFinite(v)
            ? v
            : throw new FluxModelException(path, $"expected a finite number, found {e.ValueKind}");

    public static double Positive(JsonElement e, string path)
    {
        double v = Number(e, path);
        return v > 0 ? v : throw new FluxModelException(path, $"{v.ToString(CultureInfo.InvariantCulture)} must be > 0");
    }

    public static double NonNegative(JsonElement e, string path)
    {
        double v = Number(e, path);
        return v >= 0 ? v : throw new FluxModelException(path, $"{v.ToString(CultureInfo.InvariantCulture)} must be >= 0");
    }
}
