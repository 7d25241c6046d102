using System.Globalization;
using System.Text.Json;
using SoftSensor.Core.Estimation;

namespace SoftSensor.Daemon.Samples;

/// <summary>
/// Reads an operator input from its JSON payload (MQTT command, status API, status form, CLI):
/// <c>{"kind": "dcw"|"od"|"substrate"|"product"|"removal", "sampledAt": ISO 8601 with offset,
/// "valueGPerL", "sigmaGPerL", "od", "odSigma", "factorGPerLPerOd", "factorSigmaGPerLPerOd",
/// "withdrawnMl", "analyte", "operator", "note"}</c>. Every problem names the field, the value and the
/// expectation; all of them are reported at once.
/// </summary>
internal static class SamplePayload
{
    /// <summary>How far after the daemon's clock a sampling time may lie (clock skew between the lab and the edge PC).</summary>
    public static readonly TimeSpan FutureTolerance = TimeSpan.FromMinutes(5);

    private static readonly string[] Known =
        ["kind", "sampledAt", "valueGPerL", "sigmaGPerL", "od", "odSigma", "factorGPerLPerOd", "factorSigmaGPerLPerOd", "withdrawnMl", "analyte", "operator", "note"];

    /// <summary>The entry, or the problems; <paramref name="now"/> is the daemon's time.</summary>
    public static (SampleEntry? Entry, IReadOnlyList<string> Problems) Parse(ReadOnlySpan<byte> utf8, DateTimeOffset now)
    {
        JsonDocument doc;
        try
        {
            var reader = new Utf8JsonReader(utf8);
            doc = JsonDocument.ParseValue(ref reader);
        }
        catch (JsonException e)
        {
            return (null, [$"payload is not JSON ({e.Message}); expected an object such as {{\"kind\":\"dcw\",\"sampledAt\":\"2026-03-01T10:00:00Z\",\"valueGPerL\":4.2,\"sigmaGPerL\":0.15}}"]);
        }

        using (doc)
        {
            if (doc.RootElement.ValueKind != JsonValueKind.Object)
            {
                return (null, [$"payload is a JSON {doc.RootElement.ValueKind.ToString().ToLowerInvariant()} (expected an object)"]);
            }

            return Read(doc.RootElement, Text(utf8), now);
        }
    }

    private static (SampleEntry?, IReadOnlyList<string>) Read(JsonElement o, string payload, DateTimeOffset now)
    {
        var p = new List<string>();
        foreach (var prop in o.EnumerateObject())
        {
            if (Array.IndexOf(Known, prop.Name) < 0)
            {
                p.Add($"field '{prop.Name}' is not known (expected one of {string.Join(", ", Known)})");
            }
        }

        string? kindText = String(o, "kind", p);
        SampleKind? kind = kindText switch
        {
            "dcw" => SampleKind.Dcw,
            "od" => SampleKind.Od,
            "substrate" => SampleKind.Substrate,
            "product" => SampleKind.Product,
            "removal" => SampleKind.Removal,
            _ => null,
        };
        if (kind is null)
        {
            p.Add($"kind is '{kindText}' (expected dcw, od, substrate, product or removal)");
        }

        var sampledAt = Time(o, p, now);
        double? value = Number(o, "valueGPerL", p);
        double? sigma = Number(o, "sigmaGPerL", p);
        double? od = Number(o, "od", p);
        double? odSigma = Number(o, "odSigma", p);
        double? factor = Number(o, "factorGPerLPerOd", p);
        double? factorSigma = Number(o, "factorSigmaGPerLPerOd", p);
        double? withdrawnMl = Number(o, "withdrawnMl", p);
        string? analyte = String(o, "analyte", p);
        string? who = String(o, "operator", p);
        String(o, "note", p);

        if (withdrawnMl is { } w && !(w > 0))
        {
            p.Add(Bad("withdrawnMl", w, "a positive volume in mL, or leave it out"));
        }

        switch (kind)
        {
            case SampleKind.Dcw or SampleKind.Substrate or SampleKind.Product:
                Concentration(value, sigma, p);
                Absent(p, kind.Value, ("od", od), ("odSigma", odSigma), ("factorGPerLPerOd", factor), ("factorSigmaGPerLPerOd", factorSigma));
                break;
            case SampleKind.Od:
                Required(p, "od", od, v => v >= 0, "0 or more OD units");
                Required(p, "odSigma", odSigma, v => v > 0, "a positive standard uncertainty in OD units");
                Required(p, "factorGPerLPerOd", factor, v => v > 0, "a positive calibration factor in g/L per OD unit");
                Required(p, "factorSigmaGPerLPerOd", factorSigma, v => v >= 0, "0 or more g/L per OD unit");
                Absent(p, kind.Value, ("valueGPerL", value), ("sigmaGPerL", sigma));
                if (od is >= 0 && odSigma is > 0 && factor is > 0 && factorSigma is >= 0)
                {
                    (value, sigma) = OpticalDensityCalibration.DryWeight(od.Value, odSigma.Value, factor.Value, factorSigma.Value);
                }

                break;
            case SampleKind.Removal:
                if (withdrawnMl is null)
                {
                    p.Add("withdrawnMl is missing (expected the volume withdrawn in mL for a removal)");
                }

                Absent(p, kind.Value, ("valueGPerL", value), ("sigmaGPerL", sigma), ("od", od), ("odSigma", odSigma), ("factorGPerLPerOd", factor), ("factorSigmaGPerLPerOd", factorSigma));
                break;
        }

        if (p.Count > 0)
        {
            return (null, p);
        }

        return (new SampleEntry(kind!.Value, sampledAt!.Value, value, sigma, (withdrawnMl ?? 0) / 1000.0, analyte, who, payload), []);
    }

    private static void Concentration(double? value, double? sigma, List<string> p)
    {
        Required(p, "valueGPerL", value, v => v >= 0, "0 or more g/L");
        Required(p, "sigmaGPerL", sigma, v => v > 0, "a positive standard uncertainty in g/L");
    }

    private static void Required(List<string> p, string field, double? value, Func<double, bool> ok, string expected)
    {
        if (value is null)
        {
            p.Add($"{field} is missing (expected {expected})");
        }
        else if (!ok(value.Value))
        {
            p.Add(Bad(field, value.Value, expected));
        }
    }

    private static void Absent(List<string> p, SampleKind kind, params (string Field, double? Value)[] fields)
    {
        foreach (var (field, value) in fields)
        {
            if (value is { } v)
            {
                p.Add($"{field} is {v.ToString("R", CultureInfo.InvariantCulture)} (expected no {field} for kind {SampleEntry.Name(kind)})");
            }
        }
    }

    private static DateTimeOffset? Time(JsonElement o, List<string> p, DateTimeOffset now)
    {
        string? text = String(o, "sampledAt", p);
        if (text is null)
        {
            p.Add("sampledAt is missing (expected the sampling time, ISO 8601 with Z or an offset, e.g. 2026-03-01T10:00:00Z)");
            return null;
        }

        bool hasOffset = text.EndsWith('Z') || text.EndsWith('z') || (text.Length > 6 && text[^6] is '+' or '-' && text[^3] == ':');
        if (!hasOffset || !DateTimeOffset.TryParse(text, CultureInfo.InvariantCulture, DateTimeStyles.None, out var t))
        {
            p.Add($"sampledAt is '{text}' (expected ISO 8601 with Z or an offset, e.g. 2026-03-01T10:00:00Z)");
            return null;
        }

        if (t > now + FutureTolerance)
        {
            p.Add($"sampledAt is {t.UtcDateTime:O} (expected not after the daemon's time {now.UtcDateTime:O} plus {FutureTolerance.TotalMinutes} min)");
            return null;
        }

        return t.ToUniversalTime();
    }

    private static double? Number(JsonElement o, string field, List<string> p)
    {
        if (!o.TryGetProperty(field, out var e) || e.ValueKind == JsonValueKind.Null)
        {
            return null;
        }

        if (e.ValueKind != JsonValueKind.Number || !e.TryGetDouble(out double v) || !double.IsFinite(v))
        {
            p.Add($"{field} is {e.GetRawText()} (expected a number)");
            return null;
        }

        return v;
    }

    private static string? String(JsonElement o, string field, List<string> p)
    {
        if (!o.TryGetProperty(field, out var e) || e.ValueKind == JsonValueKind.Null)
        {
            return null;
        }

        if (e.ValueKind != JsonValueKind.String)
        {
            p.Add($"{field} is {e.GetRawText()} (expected a string)");
            return null;
        }

        string s = e.GetString()!;
        if (s.Length > 200)
        {
            p.Add($"{field} is {s.Length} characters long (expected at most 200)");
            return null;
        }

        return s;
    }

    private static string Bad(string field, double v, string expected) =>
        $"{field} is {v.ToString("R", CultureInfo.InvariantCulture)} (expected {expected})";

    private static string Text(ReadOnlySpan<byte> utf8) => System.Text.Encoding.UTF8.GetString(utf8);
}
