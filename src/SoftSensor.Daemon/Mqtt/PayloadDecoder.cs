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

    /// <summary>Decodes; on failure <paramref name="error"/> names the reason (no timestamp window).</summary>
    public static bool TryDecode(ReadOnlySequence<byte> payload, PayloadOptions layout, out RawReading reading, out string error, bool text = false) =>
        TryDecode(payload, layout, TimestampWindow.Open, out reading, out error, out _, text);

    /// <summary>
    /// Decodes; on failure <paramref name="error"/> names the reason for the log and <paramref name="reason"/>
    /// classifies it for the metric. A numeric tag refuses a boolean, a string that is not a number,
    /// data after the JSON value, a duplicate key anywhere in the object, and a source timestamp outside
    /// <paramref name="window"/>. Never throws on any payload.
    /// </summary>
    public static bool TryDecode(ReadOnlySequence<byte> payload, PayloadOptions layout, TimestampWindow window, out RawReading reading, out string error, out PayloadRejection reason, bool text = false)
    {
        reading = default;
        reason = PayloadRejection.None;
        if (payload.Length == 0)
        {
            return Fail(PayloadRejection.Empty, "empty payload", out error, out reason);
        }

        if (payload.Length > MaxPayloadBytes)
        {
            return Fail(PayloadRejection.TooLarge, $"payload of {payload.Length} bytes (expected at most {MaxPayloadBytes})", out error, out reason);
        }

        if (text && layout.Format == PayloadFormat.Number)
        {
            bool ok = TryText(Encoding.UTF8.GetString(payload).Trim(), "payload", out reading, out error);
            reason = ok ? PayloadRejection.None : PayloadRejection.BadText;
            return ok;
        }

        return layout.Format == PayloadFormat.Number ? TryNumber(payload, out reading, out error, out reason) : TryJson(payload, layout, text, window, out reading, out error, out reason);
    }

    private static bool Fail(PayloadRejection why, string message, out string error, out PayloadRejection reason)
    {
        error = message;
        reason = why;
        return false;
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

    private static bool TryNumber(ReadOnlySequence<byte> payload, out RawReading reading, out string error, out PayloadRejection reason)
    {
        reading = default;
        reason = PayloadRejection.None;
        string text = Encoding.UTF8.GetString(payload).Trim();
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v))
        {
            return Fail(PayloadRejection.NotANumber, $"'{Clip(text)}' is not a number", out error, out reason);
        }

        if (!double.IsFinite(v))
        {
            return Fail(PayloadRejection.NotFinite, $"'{Clip(text)}' is not a finite number", out error, out reason);
        }

        reading = new RawReading(v, null, SampleQuality.Good, StatusCodes.Good);
        error = "";
        return true;
    }

    private static bool TryJson(ReadOnlySequence<byte> payload, PayloadOptions layout, bool text, TimestampWindow window, out RawReading reading, out string error, out PayloadRejection reason)
    {
        reading = default;
        reason = PayloadRejection.None;
        JsonDocument doc;
        var reader = new Utf8JsonReader(payload, new JsonReaderOptions { MaxDepth = 16 });
        try
        {
            doc = JsonDocument.ParseValue(ref reader);
        }
        catch (JsonException e)
        {
            return Fail(PayloadRejection.NotJson, "not JSON: " + e.Message, out error, out reason);
        }

        using (doc)
        {
            if (HasTrailingData(ref reader))
            {
                return Fail(PayloadRejection.TrailingData, $"data after the JSON value at byte {reader.BytesConsumed} (expected one JSON value)", out error, out reason);
            }

            if (FindDuplicate(doc.RootElement) is { } dup)
            {
                return Fail(PayloadRejection.DuplicateKey, $"key '{Clip(dup)}' appears twice in one object (expected each key once)", out error, out reason);
            }

            if (!TryPath(doc.RootElement, layout.ValuePath, out var ve))
            {
                return Fail(PayloadRejection.NoValue, $"no value at '{layout.ValuePath}'", out error, out reason);
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
                    return Fail(PayloadRejection.BadText, $"value at '{layout.ValuePath}' is {Clip(ve.GetRawText())} (expected a string or a number)", out error, out reason);
                }

                if (!TryText(raw, $"value at '{layout.ValuePath}'", out _, out error))
                {
                    reason = PayloadRejection.BadText;
                    return false;
                }

                asText = raw;
            }
            else if (TryValue(ve, out value) is var why && why != PayloadRejection.None)
            {
                return Fail(why, $"value at '{layout.ValuePath}' is {Clip(ve.GetRawText())} (expected a finite number{(why == PayloadRejection.Boolean ? ", not a boolean" : "")})", out error, out reason);
            }

            DateTimeOffset? time = null;
            if (layout.TimestampPath.Length > 0 && TryPath(doc.RootElement, layout.TimestampPath, out var te) && te.ValueKind != JsonValueKind.Null)
            {
                if (!TryTime(te, out var t))
                {
                    return Fail(PayloadRejection.BadTimestamp, $"timestamp at '{layout.TimestampPath}' is {Clip(te.GetRawText())} (expected ISO 8601 text or Unix milliseconds)", out error, out reason);
                }

                if (!window.Contains(t))
                {
                    return Fail(PayloadRejection.TimestampOutsideWindow,
                        $"timestamp at '{layout.TimestampPath}' is {t.UtcDateTime:O} (expected within {window.Past} before and {window.Future} after the daemon's clock, {window.Now.UtcDateTime:O})", out error, out reason);
                }

                time = t;
            }

            var quality = SampleQuality.Good;
            uint code = StatusCodes.Good;
            bool hasCode = false;
            if (layout.StatusCodePath.Length > 0 && TryPath(doc.RootElement, layout.StatusCodePath, out var ce) && ce.ValueKind != JsonValueKind.Null)
            {
                if (ce.ValueKind != JsonValueKind.Number || !ce.TryGetUInt32(out code))
                {
                    return Fail(PayloadRejection.BadStatusCode, $"status code at '{layout.StatusCodePath}' is {Clip(ce.GetRawText())} (expected an unsigned 32-bit integer)", out error, out reason);
                }

                hasCode = true;
                quality = SampleQualities.FromStatusCode(code);
            }

            if (layout.QualityPath.Length > 0 && TryPath(doc.RootElement, layout.QualityPath, out var qe) && qe.ValueKind != JsonValueKind.Null)
            {
                if (!TryQuality(qe, out var q))
                {
                    return Fail(PayloadRejection.BadQuality, $"quality at '{layout.QualityPath}' is {Clip(qe.GetRawText())} (expected good, uncertain, bad or a boolean)", out error, out reason);
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

    /// <summary>Whether anything but white space follows the value the reader stopped after (RFC 8259 §2: a JSON text is one value).</summary>
    private static bool HasTrailingData(ref Utf8JsonReader reader)
    {
        try
        {
            return reader.Read();
        }
        catch (JsonException)
        {
            return true;
        }
    }

    /// <summary>
    /// A key that appears twice in one object, anywhere in the document (RFC 8259 §4: names SHOULD be
    /// unique; which one a reader takes is unspecified, so a payload with two "value"s is refused).
    /// </summary>
    private static string? FindDuplicate(JsonElement e)
    {
        switch (e.ValueKind)
        {
            case JsonValueKind.Object:
                HashSet<string>? seen = null;
                foreach (var p in e.EnumerateObject())
                {
                    seen ??= new HashSet<string>(StringComparer.Ordinal);
                    if (!seen.Add(p.Name))
                    {
                        return p.Name;
                    }

                    if (FindDuplicate(p.Value) is { } inner)
                    {
                        return inner;
                    }
                }

                return null;
            case JsonValueKind.Array:
                foreach (var item in e.EnumerateArray())
                {
                    if (FindDuplicate(item) is { } inner)
                    {
                        return inner;
                    }
                }

                return null;
            default:
                return null;
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

    private static PayloadRejection TryValue(JsonElement e, out double value)
    {
        value = double.NaN;
        switch (e.ValueKind)
        {
            case JsonValueKind.Number:
                return !e.TryGetDouble(out value) ? PayloadRejection.NotANumber : double.IsFinite(value) ? PayloadRejection.None : PayloadRejection.NotFinite;
            case JsonValueKind.True:
            case JsonValueKind.False:
                return PayloadRejection.Boolean;
            case JsonValueKind.String:
                return !double.TryParse(e.GetString(), NumberStyles.Float, CultureInfo.InvariantCulture, out value) ? PayloadRejection.NotANumber
                    : double.IsFinite(value) ? PayloadRejection.None : PayloadRejection.NotFinite;
            default:
                return PayloadRejection.NotANumber;
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
