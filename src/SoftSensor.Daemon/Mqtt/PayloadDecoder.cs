using System.Buffers;
using System.Globalization;
using System.Text;
using System.Text.Json;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using StatusCodes = SoftSensor.OpcUa.Encoding.StatusCodes;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>A tag reading as decoded from a payload, before scaling: raw value, optional source time, quality, status code.</summary>
internal readonly record struct RawReading(double Value, DateTimeOffset? SourceTime, SampleQuality Quality, uint StatusCode)
{
    /// <summary>The value as text, for a text-valued tag (decoded with <c>text: true</c>); null otherwise.</summary>
    public string? Text { get; init; }
}

/// <summary>
/// Decodes a tag payload by its configured layout: a plain number as text, or a JSON object read
/// through dotted paths for the value, the source timestamp (ISO 8601 text or Unix milliseconds),
/// the quality (good/uncertain/bad or a boolean) and an OPC UA status code. A payload that does
/// not fit is an everyday failure: the result says why, naming the path and what was found.
/// A text-valued tag (a batch id) is decoded with <c>text: true</c>: the value may then be a JSON
/// string or number (or the whole payload, for format number), kept as text of 1 to 64 characters.
/// </summary>
internal static class PayloadDecoder
{
    private const int MaxPayloadBytes = 64 * 1024;

    /// <summary>Decodes; on failure <paramref name="error"/> names the reason.</summary>
    public static bool TryDecode(ReadOnlySequence<byte> payload, PayloadOptions layout, out RawReading reading, out string error, bool text = false)
    {
        reading = default;
        if (payload.Length == 0)
        {
            error = "empty payload";
            return false;
        }

        if (payload.Length > MaxPayloadBytes)
        {
            error = $"payload of {payload.Length} bytes (expected at most {MaxPayloadBytes})";
            return false;
        }

        if (text && layout.Format == "number")
        {
            return TryText(Encoding.UTF8.GetString(payload).Trim(), "payload", out reading, out error);
        }

        return layout.Format == "number" ? TryNumber(payload, out reading, out error) : TryJson(payload, layout, text, out reading, out error);
    }

    private const int MaxTextLength = 64;

    private static bool TryText(string value, string where, out RawReading reading, out string error)
    {
        reading = default;
        if (value.Length is 0 or > MaxTextLength || value.Any(char.IsControl))
        {
            error = $"{where} is '{Clip(value)}' (expected 1 to {MaxTextLength} printable characters)";
            return false;
        }

        reading = new RawReading(double.NaN, null, SampleQuality.Good, StatusCodes.Good) { Text = value };
        error = "";
        return true;
    }

    private static bool TryNumber(ReadOnlySequence<byte> payload, out RawReading reading, out string error)
    {
        reading = default;
        string text = Encoding.UTF8.GetString(payload).Trim();
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v))
        {
            error = $"'{Clip(text)}' is not a finite number";
            return false;
        }

        reading = new RawReading(v, null, SampleQuality.Good, StatusCodes.Good);
        error = "";
        return true;
    }

    private static bool TryJson(ReadOnlySequence<byte> payload, PayloadOptions layout, bool text, out RawReading reading, out string error)
    {
        reading = default;
        JsonDocument doc;
        try
        {
            var reader = new Utf8JsonReader(payload, new JsonReaderOptions { MaxDepth = 16 });
            doc = JsonDocument.ParseValue(ref reader);
        }
        catch (JsonException e)
        {
            error = "not JSON: " + e.Message;
            return false;
        }

        using (doc)
        {
            if (!TryPath(doc.RootElement, layout.ValuePath, out var ve))
            {
                error = $"no value at '{layout.ValuePath}'";
                return false;
            }

            double value = double.NaN;
            string? asText = null;
            if (text)
            {
                string? raw = ve.ValueKind switch
                {
                    JsonValueKind.String => ve.GetString()?.Trim(),
                    JsonValueKind.Number => ve.GetRawText(),
                    _ => null,
                };
                if (raw is null)
                {
                    error = $"value at '{layout.ValuePath}' is {Clip(ve.GetRawText())} (expected a string or a number)";
                    return false;
                }

                if (!TryText(raw, $"value at '{layout.ValuePath}'", out _, out error))
                {
                    return false;
                }

                asText = raw;
            }
            else if (!TryValue(ve, out value))
            {
                error = $"value at '{layout.ValuePath}' is {Clip(ve.GetRawText())} (expected a finite number)";
                return false;
            }

            DateTimeOffset? time = null;
            if (layout.TimestampPath.Length > 0 && TryPath(doc.RootElement, layout.TimestampPath, out var te) && te.ValueKind != JsonValueKind.Null)
            {
                if (!TryTime(te, out var t))
                {
                    error = $"timestamp at '{layout.TimestampPath}' is {Clip(te.GetRawText())} (expected ISO 8601 text or Unix milliseconds)";
                    return false;
                }

                time = t;
            }

            var quality = SampleQuality.Good;
            uint code = StatusCodes.Good;
            bool hasCode = false;
            if (layout.StatusCodePath.Length > 0 && TryPath(doc.RootElement, layout.StatusCodePath, out var ce) && ce.ValueKind != JsonValueKind.Null)
            {
                if (!ce.TryGetUInt32(out code))
                {
                    error = $"status code at '{layout.StatusCodePath}' is {Clip(ce.GetRawText())} (expected an unsigned 32-bit integer)";
                    return false;
                }

                hasCode = true;
                quality = SampleQualities.FromStatusCode(code);
            }

            if (layout.QualityPath.Length > 0 && TryPath(doc.RootElement, layout.QualityPath, out var qe) && qe.ValueKind != JsonValueKind.Null)
            {
                if (!TryQuality(qe, out var q))
                {
                    error = $"quality at '{layout.QualityPath}' is {Clip(qe.GetRawText())} (expected good, uncertain, bad or a boolean)";
                    return false;
                }

                quality = SampleQualities.Worst(quality, q);
            }

            if (!hasCode)
            {
                code = quality switch { SampleQuality.Good => StatusCodes.Good, SampleQuality.Uncertain => StatusCodes.Uncertain, _ => StatusCodes.Bad };
            }

            reading = new RawReading(value, time, quality, code) { Text = asText };
            error = "";
            return true;
        }
    }

    // A path's parts, split once (payloads come at the tag rate; the configured paths are few).
    private static readonly System.Collections.Concurrent.ConcurrentDictionary<string, string[]> Paths = new(StringComparer.Ordinal);

    private static bool TryPath(JsonElement root, string path, out JsonElement element)
    {
        element = root;
        foreach (var part in Paths.GetOrAdd(path, p => p.Split('.')))
        {
            if (element.ValueKind != JsonValueKind.Object || !element.TryGetProperty(part, out element))
            {
                return false;
            }
        }

        return true;
    }

    private static bool TryValue(JsonElement e, out double value)
    {
        value = double.NaN;
        switch (e.ValueKind)
        {
            case JsonValueKind.Number:
                return e.TryGetDouble(out value) && double.IsFinite(value);
            case JsonValueKind.True:
                value = 1;
                return true;
            case JsonValueKind.False:
                value = 0;
                return true;
            case JsonValueKind.String:
                return double.TryParse(e.GetString(), NumberStyles.Float, CultureInfo.InvariantCulture, out value) && double.IsFinite(value);
            default:
                return false;
        }
    }

    private static bool TryTime(JsonElement e, out DateTimeOffset time)
    {
        time = default;
        if (e.ValueKind == JsonValueKind.Number && e.TryGetInt64(out long ms) && ms is > 0 and < 253402300799999)
        {
            time = DateTimeOffset.FromUnixTimeMilliseconds(ms);
            return true;
        }

        if (e.ValueKind != JsonValueKind.String)
        {
            return false;
        }

        // ISO 8601 (the usual form) without making a string: with Z or an offset as given; without an
        // offset (DateTimeKind.Unspecified) as UTC, like the parser below with AssumeUniversal.
        // Z (the usual form) is read once; only a text with a numeric offset is read again to keep it exact.
        if (e.TryGetDateTime(out var dt))
        {
            switch (dt.Kind)
            {
                case DateTimeKind.Utc:
                    time = new DateTimeOffset(dt);
                    return true;
                case DateTimeKind.Unspecified:
                    time = new DateTimeOffset(DateTime.SpecifyKind(dt, DateTimeKind.Utc));
                    return true;
                default:
                    bool ok = e.TryGetDateTimeOffset(out var withOffset);
                    time = withOffset.ToUniversalTime();
                    return ok;
            }
        }

        return DateTimeOffset.TryParse(e.GetString(), CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal | DateTimeStyles.AdjustToUniversal, out time);
    }

    private static bool TryQuality(JsonElement e, out SampleQuality quality)
    {
        quality = SampleQuality.Bad;
        switch (e.ValueKind)
        {
            case JsonValueKind.True:
                quality = SampleQuality.Good;
                return true;
            case JsonValueKind.False:
                return true;
            case JsonValueKind.String when e.ValueEquals("good"):
                quality = SampleQuality.Good;
                return true;
            case JsonValueKind.String:
                switch (e.GetString()?.ToLowerInvariant())
                {
                    case "good":
                        quality = SampleQuality.Good;
                        return true;
                    case "uncertain":
                        quality = SampleQuality.Uncertain;
                        return true;
                    case "bad":
                        return true;
                    default:
                        return false;
                }

            default:
                return false;
        }
    }

    private static string Clip(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
