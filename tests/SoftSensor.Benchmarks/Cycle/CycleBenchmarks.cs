using BenchmarkDotNet.Attributes;
using SoftSensor.Core.Estimation;
using SoftSensor.Core.Signals;

namespace SoftSensor.Benchmarks.Cycle;

/// <summary>
/// The cycle alone for the glycerol model (gas balance, reconciliation, h test, integration and
/// observers; diagnosis when the test fails): cycles per second = OperationsPerInvoke / mean time.
/// [MemoryDiagnoser] must show 0 B allocated. In process: the benchmark project references the daemon, whose generated rebuild is slow. Run: dotnet run -c Release --project tests/SoftSensor.Benchmarks -- --filter '*CycleBenchmarks*'
/// </summary>
[MemoryDiagnoser]
[InProcess]
public class CycleBenchmarks
{
    private const int Cycles = 10_000;
    private readonly AlignedInputs _inputs = new();
    private readonly CycleOutputs _outputs = new();
    private Core.Estimation.Cycle _cycle = null!;
    private EstimatorState _state = null!;
    private DateTimeOffset _t;

    /// <summary>1.00: consistent measurements; 1.05: a 5 % CO2 analyser error, so every cycle runs the diagnosis.</summary>
    [Params(1.00, 1.05)]
    public double Co2Factor { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _cycle = new Core.Estimation.Cycle(GlycerolCycleFixture.Model(), GlycerolCycleFixture.Settings());
        _state = _cycle.NewState();
        _t = new DateTimeOffset(2026, 3, 2, 6, 0, 0, TimeSpan.Zero);
        GlycerolCycleFixture.Fill(_inputs, _t, Co2Factor);
    }

    [Benchmark(OperationsPerInvoke = Cycles)]
    public double RunCycle()
    {
        for (int i = 0; i < Cycles; i++)
        {
            _t = _t.AddTicks(TimeSpan.TicksPerSecond * 10);
            GlycerolCycleFixture.Fill(_inputs, _t, Co2Factor);
            _cycle.Run(_inputs, _state, _outputs);
        }

        return _outputs.BiomassGPerL;
    }
}
