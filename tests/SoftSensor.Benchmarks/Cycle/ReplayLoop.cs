using System.Diagnostics;

namespace SoftSensor.Benchmarks.Cycle;

/// <summary>
/// The replay of <see cref="ReplayBenchmarks"/> in a plain loop for profilers and for a quick figure:
/// <c>dotnet tests/SoftSensor.Benchmarks/bin/Release/net10.0/SoftSensor.Benchmarks.dll replay-loop N</c>
/// replays the 103,692-row history N times after one warm-up run and prints rows per second of
/// wall time and of this process' CPU time (the latter is the steadier figure on a shared machine).
/// </summary>
internal static class ReplayLoop
{
    public static void Run(int repeats)
    {
        var history = ReplayHistory.Create();
        var estimates = new MemoryStream(64 << 20);
        ReplayBenchmarks.ReplayOnce(history, estimates);
        var process = Process.GetCurrentProcess();
        var cpu0 = process.TotalProcessorTime;
        var watch = Stopwatch.StartNew();
        long cycles = 0;
        for (int i = 0; i < repeats; i++)
        {
            cycles += ReplayBenchmarks.ReplayOnce(history, estimates);
        }

        watch.Stop();
        process.Refresh();
        double cpu = (process.TotalProcessorTime - cpu0).TotalSeconds;
        double rows = (double)history.Rows * repeats;
        Console.WriteLine($"{repeats} x {history.Rows} rows ({cycles} cycles, {estimates.Length} bytes of estimates.csv each): "
            + $"{rows / watch.Elapsed.TotalSeconds:F0} rows/s wall, {rows / cpu:F0} rows/s CPU");
    }
}
