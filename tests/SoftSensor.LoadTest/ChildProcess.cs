using System.Diagnostics;
using System.Globalization;

namespace SoftSensor.LoadTest;

/// <summary>A child process (the daemon, a private mosquitto) with its CPU time and peak memory read from Linux /proc.</summary>
internal sealed class ChildProcess : IAsyncDisposable
{
    private static readonly double TicksPerSecond = 100; // USER_HZ: 100 on Linux (sysconf(_SC_CLK_TCK)), common practice
    private readonly Process _process;
    private readonly StreamWriter _log;

    private ChildProcess(Process process, StreamWriter log)
    {
        _process = process;
        _log = log;
    }

    public int Id => _process.Id;

    public bool HasExited => _process.HasExited;

    public static ChildProcess Start(string file, IEnumerable<string> args, string logPath)
    {
        var psi = new ProcessStartInfo(file, args) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        var log = new StreamWriter(logPath) { AutoFlush = true };
        var p = Process.Start(psi) ?? throw new InvalidOperationException($"{file} did not start");
        p.OutputDataReceived += (_, e) => Write(log, e.Data);
        p.ErrorDataReceived += (_, e) => Write(log, e.Data);
        p.BeginOutputReadLine();
        p.BeginErrorReadLine();
        return new ChildProcess(p, log);
    }

    private static void Write(StreamWriter log, string? line)
    {
        if (line is null)
        {
            return;
        }

        lock (log)
        {
            log.WriteLine(line);
        }
    }

    /// <summary>User plus system CPU time so far (/proc/PID/stat fields 14 and 15).</summary>
    public TimeSpan CpuTime()
    {
        string stat = File.ReadAllText($"/proc/{Id}/stat");
        var fields = stat[(stat.LastIndexOf(')') + 2)..].Split(' ');
        long ticks = long.Parse(fields[11], CultureInfo.InvariantCulture) + long.Parse(fields[12], CultureInfo.InvariantCulture);
        return TimeSpan.FromSeconds(ticks / TicksPerSecond);
    }

    /// <summary>Peak resident set size (VmHWM of /proc/PID/status), MiB.</summary>
    public double PeakRssMiB()
    {
        foreach (var line in File.ReadLines($"/proc/{Id}/status"))
        {
            if (line.StartsWith("VmHWM:", StringComparison.Ordinal))
            {
                return long.Parse(line[6..].Trim().Split(' ')[0], CultureInfo.InvariantCulture) / 1024.0;
            }
        }

        return double.NaN;
    }

    /// <summary>SIGTERM (a clean stop: the daemon flushes and says offline), then SIGKILL after <paramref name="grace"/>.</summary>
    public async Task StopAsync(TimeSpan grace)
    {
        if (_process.HasExited)
        {
            return;
        }

        using (var kill = Process.Start("kill", ["-TERM", Id.ToString(CultureInfo.InvariantCulture)]))
        {
            await kill!.WaitForExitAsync();
        }

        using var cts = new CancellationTokenSource(grace);
        try
        {
            await _process.WaitForExitAsync(cts.Token);
        }
        catch (OperationCanceledException)
        {
            _process.Kill(entireProcessTree: true);
            await _process.WaitForExitAsync();
        }
    }

    public async ValueTask DisposeAsync()
    {
        await StopAsync(TimeSpan.FromSeconds(30));
        _process.Dispose();
        await _log.DisposeAsync();
    }
}
