using System.Globalization;
using SoftSensor.Daemon.Cli;

namespace SoftSensor.Daemon.Tests.Replay;

/// <summary>The replay verb end to end: files in, estimates.csv, report.html with PNG figures and the state file out.</summary>
[Collection(GlycerolReplayCollection.Name)]
public class ReplayCommandTests(GlycerolReplayFixture f)
{
    [Fact]
    public void Run_writes_estimates_report_figures_and_state()
    {
        var outDir = new DirectoryInfo(Path.Combine(f.Dir, "verb-out"));
        var stdout = new StringWriter(CultureInfo.InvariantCulture);
        var stderr = new StringWriter(CultureInfo.InvariantCulture);
        var cmd = new ReplayCommand(new FileInfo(f.ConfigPath), new FileInfo(Path.Combine(f.CleanDir, "history.csv")), outDir,
            new FileInfo(Path.Combine(f.CleanDir, "offline.csv")), null, null, NoReport: false, Quiet: true, Json: true);

        Assert.Equal(ExitCodes.Ok, cmd.Run(stdout, stderr, CancellationToken.None));

        var header = File.ReadLines(Path.Combine(outDir.FullName, "estimates.csv")).First().Split(',');
        Assert.Equal(["time", "our"], header.Take(2));
        Assert.Contains("cer", header);
        Assert.Contains("rq", header);
        Assert.Contains("mu_per_h", header);
        Assert.Contains("biomass_g_per_l", header);
        Assert.Contains("quality", header);
        string html = File.ReadAllText(Path.Combine(outDir.FullName, "report.html"));
        foreach (var png in new[] { "rates.png", "biomass.png", "mu.png", "consistency.png", "alarms.png" })
        {
            Assert.Contains($"src=\"{png}\"", html, StringComparison.Ordinal);
            var bytes = File.ReadAllBytes(Path.Combine(outDir.FullName, png));
            Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47 }, bytes.Take(4)); // PNG signature (ISO/IEC 15948)
        }

        Assert.Contains("not a safety instrumented system", html, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(outDir.FullName, ReplayCommand.StateFileName)));
        Assert.Contains("\"cycles\"", stdout.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Run_with_a_missing_input_is_bad_input_naming_the_flag()
    {
        var stderr = new StringWriter(CultureInfo.InvariantCulture);
        var cmd = new ReplayCommand(new FileInfo(f.ConfigPath), new FileInfo(Path.Combine(f.Dir, "nope.csv")), new DirectoryInfo(f.Dir),
            null, null, null, NoReport: true, Quiet: true, Json: false);
        Assert.Equal(ExitCodes.BadInput, cmd.Run(TextWriter.Null, stderr, CancellationToken.None));
        Assert.StartsWith("error: --input '", stderr.ToString(), StringComparison.Ordinal);
        Assert.Single(stderr.ToString().Trim().Split('\n'));
    }
}
