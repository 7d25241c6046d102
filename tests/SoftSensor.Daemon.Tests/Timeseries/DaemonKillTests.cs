using System.Diagnostics;
using System.Globalization;
using System.Text.Json.Nodes;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Store;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.Daemon.Tests.Integration;

namespace SoftSensor.Daemon.Tests.Timeseries;

/// <summary>
/// The real executable (<c>dotnet softsensor.dll run</c>) as a child process, fed over a real
/// mosquitto, writing to a real VictoriaMetrics: the database stops gracefully, the daemon is
/// killed (SIGKILL) during the outage, the database and the daemon start again. Every cycle in the
/// daemon's store is then in the database exactly once. VictoriaMetrics runs with
/// -dedup.minScrapeInterval=1ms: a batch acknowledged just before the kill is resent with the same
/// series and timestamps, which InfluxDB overwrites by design (INTEGRATION.md).
/// </summary>
public sealed class DaemonKillTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>, IAsyncLifetime
{
    private readonly VictoriaMetricsServer _vm = new(dedup: true);
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-kill-").FullName;

    public Task InitializeAsync() => _vm.StartAsync();

    public async Task DisposeAsync()
    {
        await _vm.DisposeAsync();
        Directory.Delete(_dir, recursive: true);
    }

    private string WriteConfig()
    {
        var flat = TestConfigs.HandCase(broker.Port, "it-kill");
        flat["store:path"] = Path.Combine(_dir, "store.db");
        flat["status:url"] = "http://127.0.0.1:0";
        flat["timeseries:url"] = _vm.Url;
        flat["timeseries:retryInitialSeconds"] = "0.05";
        flat["timeseries:retryMaxSeconds"] = "0.5";
        flat["timeseries:idlePollSeconds"] = "0.2";
        var root = new JsonObject();
        foreach (var (key, value) in flat)
        {
            var node = root;
            var parts = key.Split(':');
            for (int i = 0; i < parts.Length - 1; i++)
            {
                node = (JsonObject)(node[parts[i]] ??= new JsonObject());
            }

            node[parts[^1]] = value;
        }

        string path = Path.Combine(_dir, "softsensor.json");
        File.WriteAllText(path, root.ToJsonString());
        return path;
    }

    private static Process Start(string config)
    {
        var info = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        info.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "softsensor.dll"));
        info.ArgumentList.Add("run");
        info.ArgumentList.Add("--config");
        info.ArgumentList.Add(config);
        var p = Process.Start(info)!;
        p.OutputDataReceived += (_, _) => { };
        p.ErrorDataReceived += (_, _) => { };
        p.BeginOutputReadLine();
        p.BeginErrorReadLine();
        return p;
    }

    private static async Task SignalAsync(Process p, string signal)
    {
        using var kill = Process.Start("kill", [signal, p.Id.ToString(CultureInfo.InvariantCulture)]);
        await kill.WaitForExitAsync();
        using var wait = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        await p.WaitForExitAsync(wait.Token);
    }

    [Fact]
    public async Task Run_KilledDuringDatabaseOutageAndRestarted_EveryStoredCycleInTheDatabaseOnce()
    {
        string config = WriteConfig();
        await using var plant = await TestMqttClient.ConnectAsync(broker.Port, "it-kill-plant");
        using var stopFeeding = new CancellationTokenSource();
        var feeding = Task.Run(async () =>
        {
            while (!stopFeeding.IsCancellationRequested)
            {
                await DaemonMqttTests.PublishHandCaseAsync(plant, "it-kill");
                await Task.Delay(100);
            }
        });

        using var first = Start(config);
        await Task.Delay(4000);
        await _vm.StopGracefullyAsync();
        await Task.Delay(2000);
        await SignalAsync(first, "-KILL");

        await _vm.StartAsync();
        using var second = Start(config);
        await Task.Delay(4000);
        await stopFeeding.CancelAsync();
        await feeding;
        await Task.Delay(500);
        await SignalAsync(second, "-TERM");
        Assert.Equal(0, second.ExitCode);

        using var store = new SqliteStore(Path.Combine(_dir, "store.db"), TimeProvider.System);
        var cycles = (await store.QueryEstimatesAsync("r1", EstimateNames.Our, DateTimeOffset.UnixEpoch, DateTimeOffset.UtcNow.AddDays(1), 1_000_000, default))
            .Select(r => r.Time.ToUnixTimeMilliseconds()).ToHashSet();
        Assert.True(cycles.Count > 20, $"only {cycles.Count} cycles stored");
        var stored = await _vm.ExportWhenCompleteAsync("softsensor_gas_our_quality", 1, cycles.Count);
        var series = Assert.Single(stored, kv => kv.Key.Contains("area", StringComparison.Ordinal) || kv.Key.Contains("unit=r1", StringComparison.Ordinal));
        var missing = cycles.Except(series.Value).Count();
        Assert.True(missing == 0 && series.Value.Count == cycles.Count && series.Value.Distinct().Count() == cycles.Count,
            $"store has {cycles.Count} cycles; database has {series.Value.Count} samples ({series.Value.Distinct().Count()} distinct), {missing} cycles missing");
    }
}
