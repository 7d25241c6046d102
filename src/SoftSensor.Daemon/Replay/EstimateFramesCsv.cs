using System.Globalization;
using System.Text;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Sinks;

namespace SoftSensor.Daemon.Replay;

/// <summary>
/// The replay's estimates file, a sink of the pipeline like the live ones: one row per frame (cycle
/// time, frame quality, then value, sigma and quality of each estimate, in the frame's order), the
/// header from the first frame. Numbers are written round-trip ("R"), so a replay's file holds the
/// frames exactly.
/// </summary>
internal sealed class EstimateFramesCsv(TextWriter writer) : IEstimateSink
{
    private IReadOnlyList<string>? _names;
    private readonly StringBuilder _line = new();

    public string Name => "estimates-csv";

    /// <summary>Frames written.</summary>
    public long Frames { get; private set; }

    public ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken)
    {
        if (_names is null)
        {
            _names = [.. frame.Values.Select(v => v.Name)];
            writer.WriteLine("time,quality," + string.Join(',', _names.Select(n => $"{n},{n}_sigma,{n}_quality")));
        }

        _line.Clear().Append(frame.Time.UtcDateTime.ToString("yyyy-MM-ddTHH:mm:ss.fffZ", CultureInfo.InvariantCulture)).Append(',').Append(Q(frame.Quality));
        foreach (var name in _names)
        {
            var v = frame.Values.FirstOrDefault(x => x.Name == name);
            _line.Append(',').Append(N(v.Value)).Append(',').Append(N(v.Sigma)).Append(',').Append(v.Name is null ? "" : Q(v.Quality));
        }

        writer.WriteLine(_line);
        Frames++;
        return ValueTask.CompletedTask;
    }

    private static string N(double x) => double.IsFinite(x) ? x.ToString("R", CultureInfo.InvariantCulture) : "";

    private static string Q(SampleQuality q) => q switch { SampleQuality.Good => "good", SampleQuality.Uncertain => "uncertain", _ => "bad" };
}
