using System.Buffers;
using System.Text.Json;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>
/// The JSON of one published estimate: <c>{"value":38.63,"unit":"mmol/(L·h)","sigma":0.4,
/// "timestamp":"2026-12-01T23:00:00.000Z","quality":"good","statusCode":0,"inputAgeS":4.2}</c>; a value that could
/// not be computed is <c>null</c> with quality bad. <c>timestamp</c> is the frame's (its cycle's
/// scheduled time, one per cycle); <c>inputAgeS</c> how old the newest input the cycle used was at
/// that time (left out when the cycle used none).
/// </summary>
internal static class EstimatePayload
{
    /// <summary>Encodes one value of a frame (timestamp: the frame's time; the newest input's age when known).</summary>
    public static byte[] Encode(in EstimateValue value, DateTimeOffset frameTime, TimeSpan? inputAge = null)
    {
        var buffer = new ArrayBufferWriter<byte>(160);
        using (var w = new Utf8JsonWriter(buffer))
        {
            w.WriteStartObject();
            WriteNumber(w, "value", value.Value);
            w.WriteString("unit", value.Unit);
            WriteNumber(w, "sigma", value.Sigma);
            w.WriteString("timestamp", frameTime.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fff'Z'", System.Globalization.CultureInfo.InvariantCulture));
            w.WriteString("quality", Name(value.Quality));
            w.WriteNumber("statusCode", value.StatusCode);
            if (inputAge is { } age)
            {
                w.WriteNumber("inputAgeS", Math.Round(age.TotalSeconds, 3));
            }

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
