using System.Globalization;
using BenchmarkDotNet.Running;
using SoftSensor.Benchmarks.Cycle;

namespace SoftSensor.Benchmarks;

internal static class Program
{
    private static void Main(string[] args)
    {
        if (args.Length >= 2 && args[0] == "loop")
        {
            // A plain loop for profilers (see CycleLoop); everything else goes to BenchmarkDotNet.
            CycleLoop.Run(int.Parse(args[1], CultureInfo.InvariantCulture), args.Length > 2 ? double.Parse(args[2], CultureInfo.InvariantCulture) : 1.0);
            return;
        }

        if (args.Length >= 2 && args[0] == "replay-loop")
        {
            ReplayLoop.Run(int.Parse(args[1], CultureInfo.InvariantCulture));
            return;
        }

        BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
    }
}
