using System.Diagnostics;
using SoftSensor.Core.Signals;

namespace SoftSensor.Benchmarks.Cycle;

/// <summary>
/// A plain loop over the glycerol cycle for profilers (valgrind --tool=callgrind, perf record):
/// <c>dotnet tests/SoftSensor.Benchmarks/bin/Release/net10.0/SoftSensor.Benchmarks.dll loop N [co2Factor]</c>.
/// Instruction counts of two runs with different N, divided by their difference in N, give the
/// instructions of one cycle without start-up and JIT. Not a benchmark: BenchmarkDotNet's
/// <see cref="CycleBenchmarks"/> gives the figure docs/performance.md quotes.
/// </summary>
internal static class CycleLoop
{
    public static void Run(int cycles, double co2Factor)
    {
        var cycle = new Core.Estimation.Cycle(GlycerolCycleFixture.Model(), GlycerolCycleFixture.Settings());
        var state = cycle.NewState();
        var inputs = new AlignedInputs();
        var outputs = new Core.Estimation.CycleOutputs();
        var t = new DateTimeOffset(2026, 3, 2, 6, 0, 0, TimeSpan.Zero);
        var watch = Stopwatch.StartNew();
        for (int i = 0; i < cycles; i++)
        {
            t = t.AddTicks(TimeSpan.TicksPerSecond * 10);
            GlycerolCycleFixture.Fill(inputs, t, co2Factor);
            cycle.Run(inputs, state, outputs);
        }

        watch.Stop();
        Console.WriteLine($"{cycles} cycles in {watch.Elapsed.TotalMilliseconds:F1} ms ({cycles / watch.Elapsed.TotalSeconds:F0}/s); biomass {outputs.BiomassGPerL:R} g/L, h {outputs.Rates.H:R}");
    }
}
