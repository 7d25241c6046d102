using BenchmarkDotNet.Attributes;
using Microsoft.Extensions.Logging.Abstractions;
using SoftSensor.Daemon.Replay;

namespace SoftSensor.Benchmarks.Cycle;

/// <summary>
/// The whole replay from CSV as <c>softsensor replay --no-report</c> runs it, over an in-memory
/// history of 103,692 rows (<see cref="ReplayHistory"/>): decode and split each line, parse the
/// timestamp and 13 numbers, align for the analyser dead time, run the cycle, keep the report
/// series, format the estimates.csv row and encode it as UTF-8 into a reused memory stream (so the
/// disk is not measured). The report and its plots are not part of the figure. Rows per second =
/// 103,692 / mean time. Run: dotnet run -c Release --project tests/SoftSensor.Benchmarks -- --filter '*ReplayBenchmarks*' --job short
/// </summary>
[MemoryDiagnoser]
[InProcess]
public class ReplayBenchmarks
{
    private ReplayHistory _history = null!;
    private MemoryStream _estimates = null!;

    [GlobalSetup]
    public void Setup()
    {
        _history = ReplayHistory.Create();
        _estimates = new MemoryStream(64 << 20);
    }

    [Benchmark]
    public long Replay100kRows() => ReplayOnce(_history, _estimates);

    /// <summary>One replay of <paramref name="history"/>, estimates.csv written into <paramref name="estimates"/> (rewound first).</summary>
    internal static long ReplayOnce(ReplayHistory history, MemoryStream estimates)
    {
        ReplayConfigLoader.TryLoad(ReplayHistory.ConfigPath, out var config, out var cycle, out _);
        estimates.SetLength(0);
        using var input = new MemoryStream(history.Csv, writable: false);
        using var csv = new StreamWriter(estimates, new System.Text.UTF8Encoding(false), 1 << 16, leaveOpen: true);
        using var writer = new EstimatesCsvWriter(csv);
        var result = new ReplayRunner(cycle!, NullLogger.Instance).Run("history.csv", input, config!.History, history.Samples, writer,
            new ReplaySeries(config.ReportPoints), new ReplayOptions(), CancellationToken.None);
        return result.Cycles;
    }
}
