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
/// series and timestamps, which InfluxDB overwrites by design (docs/daemon.md).
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

    private readonly System.Collections.Concurrent.ConcurrentQueue<string> _stderr = new();

    private Process Start(string config)
    {
        var info = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        info.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "softsensor.dll"));
        info.ArgumentList.Add("run");
        info.ArgumentList.Add("--config");
        info.ArgumentList.Add(config);
        var p = Process.Start(info)!;
        p.OutputDataReceived += (_, _) => { };
        p.ErrorDataReceived += (_, e) => { if (e.Data is { } line) { _stderr.Enqueue(line); } };
        p.BeginOutputReadLine();
        p.BeginErrorReadLine();
        return p;
    }

    private string Stderr => string.Join(Environment.NewLine, _stderr.TakeLast(20));

    private static async Task SignalAsync(Process p, string signal)
    {
        using var kill = Process.Start("kill", [signal, p.Id.ToString(CultureInfo.InvariantCulture)]);
        await kill.WaitForExitAsync();
        using var wait = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        await p.WaitForExitAsync(wait.Token);
    }

    private string StorePath => Path.Combine(_dir, "store.db");

    private int StoredFrames()
    {
        try
        {
            return File.Exists(StorePath) ? FrameTimeChecks.StoredFrameTimes(StorePath).Count : 0;
        }
        catch (Microsoft.Data.Sqlite.SqliteException)
        {
            return 0; // the daemon is still creating its tables
        }
    }

    /// <summary>Waits until the store holds <paramref name="more"/> frames more than now (the daemon is cycling), generous timeout.</summary>
    private async Task WaitForFramesAsync(int more, string what)
    {
        int target = StoredFrames() + more;
        await FrameTimeChecks.WaitUntilAsync(() => StoredFrames() >= target, TimeSpan.FromSeconds(60), what);
    }

    private Task FeedAsync(TestMqttClient plant, CancellationToken stop) => Task.Run(async () =>
    {
        while (!stop.IsCancellationRequested)
        {
            await DaemonMqttTests.PublishHandCaseAsync(plant, "it-kill");
            await Task.Delay(100, CancellationToken.None);
        }
    });

    [Fact]
    public async Task Run_KilledDuringDatabaseOutageAndRestarted_EveryStoredCycleInTheDatabaseOnce()
    {
        string config = WriteConfig();
        await using var plant = await TestMqttClient.ConnectAsync(broker.Port, "it-kill-plant");
        using var stopFeeding = new CancellationTokenSource();
        var feeding = FeedAsync(plant, stopFeeding.Token);

        using var first = Start(config);
        await WaitForFramesAsync(10, "10 frames of the first run");
        await _vm.StopGracefullyAsync();
        await WaitForFramesAsync(8, "8 frames during the database outage");
        await SignalAsync(first, "-KILL");

        await _vm.StartAsync();
        using var second = Start(config);
        await WaitForFramesAsync(10, "10 frames of the second run");
        await stopFeeding.CancelAsync();
        await feeding;
        await SignalAsync(second, "-TERM");
        Assert.True(second.ExitCode == 0, $"exit code {second.ExitCode}; stderr:{Environment.NewLine}{Stderr}");

        var stored = FrameTimeChecks.StoredFrameTimes(StorePath);
        FrameTimeChecks.AssertStrictlyIncreasing(stored, "store across a kill -9 during a database outage");
        await FrameTimeChecks.AssertEachFrameOnceInDatabaseAsync(_vm, stored);
    }

    [Fact]
    public async Task Run_KilledWithInputsAbsentAndRestartedWithout_FramesStayUniqueAndIncreasingInStoreAndDatabase()
    {
        string config = WriteConfig();
        await using var plant = await TestMqttClient.ConnectAsync(broker.Port, "it-kill-absent-plant");
        using var first = Start(config);
        using (var feeding = new CancellationTokenSource())
        {
            var feed = FeedAsync(plant, feeding.Token);
            await WaitForFramesAsync(10, "10 frames with inputs");
            await feeding.CancelAsync();
            await feed;
        }

        // Inputs absent: the newest input time stands still while frames go on (the case that sent 14 frames 2 s back).
        await WaitForFramesAsync(8, "8 frames with the inputs absent");
        await SignalAsync(first, "-KILL");
        using var second = Start(config);
        await WaitForFramesAsync(8, "8 frames after the restart, inputs still absent");
        using (var feeding = new CancellationTokenSource())
        {
            var feed = FeedAsync(plant, feeding.Token);
            await WaitForFramesAsync(8, "8 frames with the inputs back");
            await feeding.CancelAsync();
            await feed;
        }

        await SignalAsync(second, "-TERM");
        Assert.True(second.ExitCode == 0, $"exit code {second.ExitCode}; stderr:{Environment.NewLine}{Stderr}");
        var stored = FrameTimeChecks.StoredFrameTimes(StorePath);
        FrameTimeChecks.AssertStrictlyIncreasing(stored, "store across a kill -9 with the inputs absent");
        await FrameTimeChecks.AssertEachFrameOnceInDatabaseAsync(_vm, stored);
    }
}
