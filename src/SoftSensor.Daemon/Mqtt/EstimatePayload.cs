using System.Buffers;
using System.Text.Json;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>
/// The JSON of one published estimate: <c>{"value":38.63,"unit":"mmol/(L·h)","sigma":0.4,
/// "timestamp":"2026-12-01T23:00:00.000Z","quality":"good","statusCode":0}</c>; a value that could
/// not be computed is <c>null</c> with quality bad.
/// </summary>
internal static class EstimatePayload
{
    /// <summary>Encodes one value of a frame (timestamp: the frame's source time).</summary>
    public static byte[] Encode(in EstimateValue value, DateTimeOffset sourceTime)
    {
        var buffer = new ArrayBufferWriter<byte>(160);
        using (var w = new Utf8JsonWriter(buffer))
        {
            w.WriteStartObject();
            WriteNumber(w, "value", value.Value);
            w.WriteString("unit", value.Unit);
            WriteNumber(w, "sigma", value.Sigma);
            w.WriteString("timestamp", sourceTime.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fff'Z'", System.Globalization.CultureInfo.InvariantCulture));
            w.WriteString("quality", Name(value.Quality));
            w.WriteNumber("statusCode", value.StatusCode);
            w.WriteEndObject();
        }

        return buffer.WrittenSpan.ToArray();
    }

    /// <summary>The lowercase name of a quality, as published.</summary>
    public static string Name(SampleQuality quality) => quality switch
    {
        SampleQuality.Good => "good",
        SampleQuality.Uncertain => "uncertain",
        _ => "bad",
    };

    private static void WriteNumber(Utf8JsonWriter w, string name, double v)
    {
        if (double.IsFinite(v))
        {
            w.WriteNumber(name, v);
        }
        else
        {
            w.WriteNull(name);
        }
    }
}
