using System.Text.Json;
using SoftSensor.Daemon.Cli;
using SoftSensor.Daemon.Status;

namespace SoftSensor.Daemon.Tests.Cli;

/// <summary>How the client verbs find a daemon, and how they print its answers without --json.</summary>
public sealed class DaemonClientTests
{
    [Fact]
    public void A_status_file_of_a_daemon_that_no_longer_runs_is_named_with_its_pid()
    {
        string dir = Directory.CreateTempSubdirectory("softsensor-locator-").FullName;
        try
        {
            // Linux pids stop at 4,194,304 (kernel pid_max limit): this one cannot be running.
            File.WriteAllText(Path.Combine(dir, DaemonStatusDocument.FileName), """{"statusUrl": "http://127.0.0.1:45959", "pid": 4999999, "config": null, "reactors": ["r1"]}""");
            var (target, problem) = DaemonLocator.Find(null, null, dir);
            Assert.Null(target);
            Assert.Contains("names a daemon (pid 4999999) that is not running", problem, StringComparison.Ordinal);

            File.WriteAllText(Path.Combine(dir, DaemonStatusDocument.FileName), $$"""{"statusUrl": "http://127.0.0.1:45959", "pid": {{Environment.ProcessId}}, "reactors": ["r1"]}""");
            (target, _) = DaemonLocator.Find(null, null, dir);
            Assert.Equal(new Uri("http://127.0.0.1:45959"), target!.Url);
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void Data_folder_without_a_status_file_is_refused_naming_the_flag()
    {
        string dir = Directory.CreateTempSubdirectory("softsensor-locator-").FullName;
        try
        {
            var (code, _, error) = CliRunner.Run("batch", "status", "--reactor", "r1", "--data", dir);
            Assert.Equal(ExitCodes.BadInput, code);
            Assert.Contains($"--data: no daemon.json in {dir}", error, StringComparison.Ordinal);
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    [Theory]
    [InlineData("http://0.0.0.0:8470", "http://127.0.0.1:8470")]
    [InlineData("http://[::]:8470", "http://[::1]:8470")]
    [InlineData("http://127.0.0.1:40375", "http://127.0.0.1:40375")]
    public void A_wildcard_listen_address_is_written_as_the_loopback_a_client_dials(string listen, string dialled) =>
        Assert.Equal(dialled, DaemonStatusDocument.Dialable(listen));

    [Fact]
    public void JsonText_renders_fields_as_lines_nested_objects_indented_and_null_as_a_dash()
    {
        using var doc = JsonDocument.Parse("""{"accepted": true, "sample": {"id": 7, "valueGPerL": 3.8, "analyte": null}, "problems": []}""");
        Assert.Equal("accepted: true\nsample:\n  id: 7\n  valueGPerL: 3.8\n  analyte: -\nproblems: (none)", JsonText.Render(doc.RootElement).ReplaceLineEndings("\n"));
    }

    [Fact]
    public void A_batch_is_described_in_one_readable_line_with_its_initial_conditions()
    {
        using var doc = JsonDocument.Parse("""{"reactor":"r1","batchId":"gly-042","startedAt":"2026-03-02T06:04:42.18828+00:00","endedAt":null,"initialVolumeL":30,"inoculumBiomassGPerL":0.3,"inoculumBiomassSigmaGPerL":0.05,"initialSubstrateGPerL":15,"phase":"fed-batch","phaseSince":"2026-03-02T14:00:00+00:00"}""");
        Assert.Equal("reactor r1: batch gly-042 open, phase fed-batch since 2026-03-02 14:00:00 UTC\n  started 2026-03-02 06:04:42 UTC; initial volume 30 L, inoculum 0.300 ± 0.050 g/L, substrate 15 g/L",
            BatchVerb.Describe(doc.RootElement, null));
    }
}
