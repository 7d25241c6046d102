using System.Text.Json;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// The JSON of the input samples a checkpoint keeps: <c>[{"tag":"R1.OFFGAS.O2","v":19.8,"t":639000000000000000,
/// "q":0,"c":0}, ...]</c> (value in the role's unit, source time in 100 ns ticks since 0001-01-01 UTC, quality,
/// status code). Values are written in round-trip form, so the restored samples are bit-identical.
/// </summary>
internal static class HeldSamples
{
    private sealed record Row(string Tag, double V, long T, int Q, uint C);

    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web);

    public static string Encode(IReadOnlyList<Sample> samples) =>
        JsonSerializer.Serialize(samples.Select(s => new Row(s.Tag, s.Value, s.SourceTime.UtcTicks, (int)s.Quality, s.StatusCode)), Json);

    /// <summary>The samples, or an empty list with <paramref name="error"/> set when the text is not such a list.</summary>
    public static IReadOnlyList<Sample> Decode(string json, out string? error)
    {
        error = null;
        try
        {
            var rows = JsonSerializer.Deserialize<Row[]>(json, Json) ?? [];
            return [.. rows.Select(r => new Sample(r.Tag, r.V, new DateTimeOffset(Math.Clamp(r.T, 0, DateTimeOffset.MaxValue.UtcTicks), TimeSpan.Zero),
                Enum.IsDefined((SampleQuality)r.Q) ? (SampleQuality)r.Q : SampleQuality.Bad, r.C))];
        }
        catch (JsonException e)
        {
            error = e.Message;
            return [];
        }
    }
}
