using System.Text.Json;
using SoftSensor.Daemon.Cli;
using SoftSensor.Daemon.Demo;

namespace SoftSensor.Daemon.Tests.Replay;

/// <summary>
/// <c>softsensor replay --config DEFINITION --input CSV --out DIR</c> with the reactor definition the
/// daemon runs: the demo's own definition replays a <c>softsensor simulate</c> history of the demo
/// scenario (invented data); a bad row is skipped alone; a duplicate header names both columns; a
/// replay without a usable cycle ends with its causes by count and exit code 1.
/// </summary>
public sealed class ReactorReplayTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-reactor-replay-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static string DemoConfig => DemoFiles.Find(DemoFiles.Config) ?? throw new FileNotFoundException(DemoFiles.Config);

    [Fact]
    public async Task The_demo_definition_replays_a_simulated_history_of_the_demo_scenario()
    {
        using (var o = new StringWriter())
        using (var e = new StringWriter())
        {
            Assert.Equal(0, SimulateVerb.Run(DemoFiles.Find(DemoFiles.Scenario)!, Path.Combine(_dir, "sim"), null, 1, false, o, e));
        }

        var (code, stdout, stderr) = await Replay(DemoConfig, Path.Combine(_dir, "sim", "history.csv"), json: true);

        Assert.True(code == ExitCodes.Ok, stderr);
        using var doc = JsonDocument.Parse(stdout);
        var root = doc.RootElement;
        Assert.Equal(361, root.GetProperty("rows").GetInt64());  // 1 h at the scenario's 10 s, both ends
        Assert.Equal(0, root.GetProperty("skippedRows").GetInt64());
        Assert.Equal(0, root.GetProperty("unmappedTags").GetArrayLength());
        Assert.True(root.GetProperty("good").GetInt64() > 300, stdout);
        var lines = await File.ReadAllLinesAsync(Path.Combine(_dir, "out", ReactorReplay.EstimatesFileName));
        Assert.Equal(root.GetProperty("cycles").GetInt64() + 1, lines.Length);
        Assert.StartsWith("time,quality,", lines[0], StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_out_of_order_or_far_future_row_is_skipped_alone_with_its_line_number()
    {
        string history = History(
            "2026-03-02T06:00:00Z", "2026-03-02T06:00:10Z", "2026-03-02T05:59:00Z", "2099-01-01T00:00:00Z", "2026-03-02T06:00:20Z");
        var (code, stdout, _) = await Replay(DemoConfig, history, json: true);

        using var doc = JsonDocument.Parse(stdout);
        var root = doc.RootElement;
        Assert.Equal(5, root.GetProperty("rows").GetInt64());
        Assert.Equal(2, root.GetProperty("skippedRows").GetInt64());
        var skipped = root.GetProperty("firstSkipped").EnumerateArray().ToList();
        Assert.Equal(4, skipped[0].GetProperty("line").GetInt64()); // header is line 1
        Assert.Contains("out of order", skipped[0].GetProperty("reason").GetString(), StringComparison.Ordinal);
        Assert.Equal(5, skipped[1].GetProperty("line").GetInt64());
        Assert.Contains("far future", skipped[1].GetProperty("reason").GetString(), StringComparison.Ordinal);
        Assert.Equal(3, root.GetProperty("cycles").GetInt64());  // 06:00:00, 06:00:10, 06:00:20
        _ = code;
    }

    [Fact]
    public async Task A_duplicate_header_column_is_an_error_naming_both_columns()
    {
        string history = Path.Combine(_dir, "dup.csv");
        await File.WriteAllTextAsync(history, "timestamp,R1.TEMP,R1.PH,R1.TEMP\n2026-03-02T06:00:00Z,37,7,37\n");
        var (code, _, stderr) = await Replay(DemoConfig, history, json: false);

        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("columns 2 and 4 are both named 'R1.TEMP'", stderr, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_replay_without_a_usable_cycle_ends_with_its_causes_by_count_and_exit_one()
    {
        // Only the temperature and pH are in the export: every cycle lacks its gas inputs.
        string history = Path.Combine(_dir, "thin.csv");
        await File.WriteAllTextAsync(history, "timestamp,R1.TEMP,R1.PH\n"
            + string.Join("\n", Enumerable.Range(0, 30).Select(i => $"2026-03-02T06:{i / 6:00}:{i % 6 * 10:00}Z,37,7")) + "\n");
        var (code, stdout, _) = await Replay(DemoConfig, history, json: false);

        Assert.Equal(ExitCodes.Failure, code);
        Assert.Contains("most cycles were not good; causes by count:", stdout, StringComparison.Ordinal);
        Assert.Contains("input R1.AIR.FLOW has no value yet", stdout, StringComparison.Ordinal);
        Assert.Contains("no cycle gave a usable estimate", stdout, StringComparison.Ordinal);
        Assert.Contains("tags without a column in the export: R1.AIR.FLOW", stdout, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_misspelt_key_in_the_definition_is_the_same_message_as_check()
    {
        string config = Path.Combine(_dir, "typo.json");
        await File.WriteAllTextAsync(config, File.ReadAllText(DemoConfig).Replace("\"cyclePeriod\"", "\"cyclePeriode\"", StringComparison.Ordinal));
        var (code, _, stderr) = await Replay(config, History("2026-03-02T06:00:00Z"), json: false);

        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("error: reactors:0:cyclePeriode is not a setting of reactors:0 (did you mean 'cyclePeriod'?)", stderr, StringComparison.Ordinal);
    }

    private string History(params string[] times)
    {
        string path = Path.Combine(_dir, $"h-{Guid.NewGuid():N}.csv");
        var header = "timestamp,R1.AIR.FLOW,R1.O2.FLOW,R1.INLET.O2,R1.INLET.CO2,R1.OFFGAS.O2,R1.OFFGAS.CO2,R1.PRESSURE,R1.TEMP,R1.WEIGHT,R1.FEED.RATE,R1.BASE.RATE,R1.DO,R1.PH";
        File.WriteAllText(path, header + "\n" + string.Join("\n", times.Select(t => t + ",30,0,20.95,0.04,20.5,0.5,150,37,31,0,0,90,6.9")) + "\n");
        return path;
    }

    private async Task<(int Code, string Stdout, string Stderr)> Replay(string config, string history, bool json)
    {
        using var o = new StringWriter();
        using var e = new StringWriter();
        int code = await ReactorReplay.RunAsync(config, null, history, Path.Combine(_dir, "out"), quiet: true, json, o, e, CancellationToken.None);
        return (code, o.ToString(), e.ToString());
    }
}
