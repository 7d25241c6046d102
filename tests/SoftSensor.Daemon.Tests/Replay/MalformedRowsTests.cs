using Microsoft.Extensions.Logging;
using SoftSensor.Daemon.Replay;

namespace SoftSensor.Daemon.Tests.Replay;

/// <summary>Malformed rows of a historian export are skipped with a count and a line number; the replay goes on.</summary>
[Collection(GlycerolReplayCollection.Name)]
public class MalformedRowsTests(GlycerolReplayFixture f)
{
    [Fact]
    public void Run_with_malformed_rows_skips_them_logs_their_line_numbers_and_finishes()
    {
        var lines = File.ReadAllLines(Path.Combine(f.CleanDir, "history.csv")).ToList();
        int cells = lines[0].Split(',').Length;
        // Line numbers are 1-based as an editor shows them (line 1 is the header).
        lines[99] = string.Join(',', lines[99].Split(',').Take(cells - 3));               // line 100: missing cells
        var text = lines[199].Split(',');
        text[5] = "n/a";
        lines[199] = string.Join(',', text);                                             // line 200: text in a numeric column
        lines[299] = lines[250];                                                         // line 300: timestamp going backwards
        lines[399] = lines[399].Replace(lines[399].Split(',')[0], "2026-03-02 99:00", StringComparison.Ordinal); // line 400: bad time
        string dir = Path.Combine(f.Dir, "malformed");
        Directory.CreateDirectory(dir);
        File.WriteAllLines(Path.Combine(dir, "history.csv"), lines);
        File.Copy(Path.Combine(f.CleanDir, "offline.csv"), Path.Combine(dir, "offline.csv"), overwrite: true);

        Assert.True(ReplayConfigLoader.TryLoad(f.ConfigPath, out var config, out var cycle, out var error), error);
        var log = new ListLogger();
        using var history = File.OpenRead(Path.Combine(dir, "history.csv"));
        var result = new ReplayRunner(cycle!, log).Run("history.csv", history, config!.History, [], null, new ReplaySeries(100), new ReplayOptions(), CancellationToken.None);

        Assert.Equal(4, result.SkippedRows);
        Assert.Equal([100L, 200L, 300L, 400L], result.FirstSkipped.Select(s => s.Line));
        Assert.Equal(["missing cell", "text in a numeric column", "timestamp not after the previous row's", "timestamp not in the configured format"],
            result.FirstSkipped.Select(s => s.Reason));
        Assert.Contains(log.Lines, l => l.Contains("line 200: row skipped (text in a numeric column, column 'R1.OFFGAS.O2')", StringComparison.Ordinal));
        Assert.Contains(log.Lines, l => l.Contains("4 skipped", StringComparison.Ordinal));
        Assert.Equal(lines.Count - 1, result.Rows);
        Assert.True(result.Cycles > result.Rows - 10, $"{result.Cycles} cycles of {result.Rows} rows");
    }

    /// <summary>Collects formatted log lines (a log sink for the check, not a stand-in for a component).</summary>
    private sealed class ListLogger : ILogger
    {
        public List<string> Lines { get; } = [];

        public IDisposable? BeginScope<TState>(TState state)
            where TState : notnull => null;

        public bool IsEnabled(LogLevel logLevel) => true;

        public void Log<TState>(LogLevel logLevel, EventId eventId, TState state, Exception? exception, Func<TState, Exception?, string> formatter) =>
            Lines.Add(formatter(state, exception));
    }
}
