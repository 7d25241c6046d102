using System.Diagnostics;
using Microsoft.Data.Sqlite;
using SoftSensor.Daemon.Tests.Timeseries;

namespace SoftSensor.Daemon.Tests.Integration;

/// <summary>
/// The check, as a user runs it: <c>softsensor demo --speed 3600 --for 24h</c> (the real
/// executable, its embedded broker and virtual reactor) leaves a store whose frames each have their own
/// time, after the one before, spanning about the day asked for (the stop is on wall time: at 3600x a
/// few hundred milliseconds late is minutes of simulated time), and only the few checkpoints <c>store:checkpointsKept</c> allows.
/// About 25 s of wall time.
/// </summary>
public sealed class DemoDayTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-demo-day-").FullName;

    public void Dispose()
    {
        SqliteConnection.ClearAllPools();
        Directory.Delete(_dir, recursive: true);
    }

    [Fact]
    public async Task Demo_a_day_at_3600x_stores_unique_increasing_frame_times_and_at_most_three_checkpoints()
    {
        var info = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (var a in new[] { Path.Combine(AppContext.BaseDirectory, "softsensor.dll"), "demo", "--speed", "3600", "--for", "24h", "--data", _dir })
        {
            info.ArgumentList.Add(a);
        }

        var stderr = new System.Collections.Concurrent.ConcurrentQueue<string>();
        using var p = Process.Start(info)!;
        p.OutputDataReceived += (_, _) => { };
        p.ErrorDataReceived += (_, e) => { if (e.Data is { } l) { stderr.Enqueue(l); } };
        p.BeginOutputReadLine();
        p.BeginErrorReadLine();
        using (var wait = new CancellationTokenSource(TimeSpan.FromMinutes(3)))
        {
            await p.WaitForExitAsync(wait.Token);
        }

        Assert.True(p.ExitCode == 0, $"exit code {p.ExitCode}: {string.Join(Environment.NewLine, stderr.TakeLast(15))}");
        string store = Path.Combine(_dir, "demo.db");
        var times = FrameTimeChecks.StoredFrameTimes(store);
        // At 3600x a 10 s cycle is 2.8 ms of wall time: some ticks are skipped, never doubled.
        Assert.True(times.Count > 2000, $"only {times.Count} frames in a simulated day");
        FrameTimeChecks.AssertStrictlyIncreasing(times, "demo store after a day at 3600x");
        Assert.True(times[^1] - times[0] <= TimeSpan.FromHours(25).TotalMilliseconds, $"frames span {(times[^1] - times[0]) / 3.6e6:F2} h");
        using var c = new SqliteConnection($"Data Source={store};Mode=ReadOnly;Pooling=false");
        c.Open();
        using var cmd = c.CreateCommand();
        cmd.CommandText = "SELECT COUNT(*) FROM checkpoints";
        Assert.InRange((long)cmd.ExecuteScalar()!, 1, 3);
    }
}
