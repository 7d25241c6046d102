using System.Text.Json;
using SoftSensor.Daemon.Cli;

namespace SoftSensor.Daemon.Tests.Cli;

public sealed class SimulateVerbTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "softsensor-sim-" + Guid.NewGuid().ToString("N"));

    private static string Scenario(string name)
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "SoftSensor.sln")))
        {
            dir = dir.Parent;
        }

        return Path.Combine(dir!.FullName, "config", "scenarios", name + ".json");
    }

    public void Dispose()
    {
        if (Directory.Exists(_dir))
        {
            Directory.Delete(_dir, true);
        }
    }

    [Fact]
    public void Run_glycerol_two_hours_writes_history_truth_and_offline_files()
    {
        var outDir = Path.Combine(_dir, "a");
        using var o = new StringWriter();
        using var e = new StringWriter();
        int code = SimulateVerb.Run(Scenario("glycerol"), outDir, 3, 2, false, o, e);
        Assert.Equal(0, code);
        Assert.Contains("final biomass", o.ToString(), StringComparison.Ordinal);
        var history = File.ReadAllLines(Path.Combine(outDir, "history.csv"));
        Assert.StartsWith("timestamp,R1.AIR.FLOW,R1.O2.FLOW,R1.INLET.O2,R1.INLET.CO2,R1.OFFGAS.O2,R1.OFFGAS.CO2,", history[0], StringComparison.Ordinal);
        Assert.Equal(1 + 721, history.Length); // 2 h every 10 s, both ends included
        Assert.StartsWith("2026-03-02T06:00:10Z,", history[2], StringComparison.Ordinal);
        var truth = File.ReadAllLines(Path.Combine(outDir, "truth.csv"));
        Assert.StartsWith("time,biomass_g_per_l,mu_per_h,volume_l,our,cer,otr,ctr,rq,substrate_g_per_l,acetate_g_per_l,", truth[0], StringComparison.Ordinal);
        Assert.Equal(history.Length, truth.Length);
        var offline = File.ReadAllLines(Path.Combine(outDir, "offline.csv"));
        Assert.Equal("time,dcw_g_per_l,sd_g_per_l,volume_ml", offline[0]);
        Assert.Equal(2, offline.Length); // the sample at 2 h
    }

    [Fact]
    public void Run_same_seed_gives_byte_identical_files()
    {
        using var o = new StringWriter();
        using var e = new StringWriter();
        SimulateVerb.Run(Scenario("yeast"), Path.Combine(_dir, "x"), 11, 1, false, o, e);
        SimulateVerb.Run(Scenario("yeast"), Path.Combine(_dir, "y"), 11, 1, false, o, e);
        foreach (var f in new[] { "history.csv", "truth.csv", "offline.csv" })
        {
            Assert.Equal(File.ReadAllBytes(Path.Combine(_dir, "x", f)), File.ReadAllBytes(Path.Combine(_dir, "y", f)));
        }
    }

    [Fact]
    public void Run_json_prints_one_document_with_the_summary()
    {
        using var o = new StringWriter();
        using var e = new StringWriter();
        Assert.Equal(0, SimulateVerb.Run(Scenario("glycerol"), Path.Combine(_dir, "j"), null, 1, true, o, e));
        using var doc = JsonDocument.Parse(o.ToString());
        Assert.True(doc.RootElement.GetProperty("finalBiomassGPerL").GetDouble() > 0.3);
        Assert.Equal(42, doc.RootElement.GetProperty("seed").GetInt32());
    }

    [Theory]
    [InlineData(-1.0, "--hours is -1")]
    [InlineData(0.0, "--hours is 0")]
    public void Run_bad_hours_is_one_line_and_exit_2(double hours, string expected)
    {
        using var o = new StringWriter();
        using var e = new StringWriter();
        Assert.Equal(2, SimulateVerb.Run(Scenario("glycerol"), _dir, null, hours, false, o, e));
        Assert.Contains(expected, e.ToString(), StringComparison.Ordinal);
        Assert.Single(e.ToString().Trim().Split('\n'));
    }

    [Fact]
    public void Run_bad_scenario_key_is_named_and_exit_2()
    {
        Directory.CreateDirectory(_dir);
        string path = Path.Combine(_dir, "bad.json");
        File.WriteAllText(path, """{ "vessel": { "temperature_c": 120 } }""");
        using var o = new StringWriter();
        using var e = new StringWriter();
        Assert.Equal(2, SimulateVerb.Run(path, Path.Combine(_dir, "out"), null, null, false, o, e));
        Assert.Contains("key 'vessel.temperature_c' is 120", e.ToString(), StringComparison.Ordinal);
        Assert.Single(e.ToString().Trim().Split('\n'));
    }

    [Fact]
    public void Parse_missing_scenario_flag_is_an_error()
    {
        var parse = VerbCatalog.BuildRoot().Parse(["simulate", "--out", _dir]);
        Assert.NotEmpty(parse.Errors);
    }
}
