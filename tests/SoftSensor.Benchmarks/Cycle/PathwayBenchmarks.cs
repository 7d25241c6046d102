using BenchmarkDotNet.Attributes;
using SoftSensor.Core.Estimation;
using SoftSensor.Core.Flux;
using SoftSensor.Core.Signals;

namespace SoftSensor.Benchmarks.Cycle;

/// <summary>
/// The added cost per cycle of the pathway stage and the heat balance on the glycerol model
/// (docs/pathway.md §7): the same cycle as <see cref="CycleBenchmarks"/> without them, with the
/// pathway stage, and with both; the differences of the means are the added costs. [MemoryDiagnoser]
/// must show 0 B allocated. Run: dotnet run -c Release --project tests/SoftSensor.Benchmarks -- --filter '*PathwayBenchmarks*'
/// </summary>
[MemoryDiagnoser]
[InProcess]
public class PathwayBenchmarks
{
    private const int Cycles = 10_000;
    private readonly AlignedInputs _inputs = new();
    private readonly CycleOutputs _outputs = new();
    private Core.Estimation.Cycle _cycle = null!;
    private EstimatorState _state = null!;
    private DateTimeOffset _t;

    /// <summary>none: the plain cycle; pathway: with the pathway stage; pathway+heat: with the heat balance as well.</summary>
    [Params("none", "pathway", "pathway+heat")]
    public string Stages { get; set; } = "none";

    [GlobalSetup]
    public void Setup()
    {
        var model = GlycerolCycleFixture.Model();
        var pathway = Stages == "none" ? null
            : new PathwayStage(FluxModel.Load(File.ReadAllText(Path.Combine(GlycerolCycleFixture.RepoRoot(), "config", "models", "glycerol-bacterium.json"))), new PathwaySettings());
        var heat = Stages == "pathway+heat" ? new HeatBalanceSettings { HeatLossW = 50 } : null;
        _cycle = new Core.Estimation.Cycle(model, GlycerolCycleFixture.Settings(), pathway, heat);
        _state = _cycle.NewState();
        _t = new DateTimeOffset(2026, 3, 2, 6, 0, 0, TimeSpan.Zero);
        Fill();
    }

    [Benchmark(OperationsPerInvoke = Cycles)]
    public double RunCycle()
    {
        for (int i = 0; i < Cycles; i++)
        {
            _t = _t.AddTicks(TimeSpan.TicksPerSecond * 10);
            Fill();
            _cycle.Run(_inputs, _state, _outputs);
        }

        return _outputs.Pathway.MuPerH;
    }

    private void Fill()
    {
        GlycerolCycleFixture.Fill(_inputs, _t, 1.0);
        _inputs.Set(SignalRole.CoolantFlowLPerH, 150, SampleQuality.Good, _t);
        _inputs.Set(SignalRole.CoolantInletTemperatureC, 15, SampleQuality.Good, _t);
        _inputs.Set(SignalRole.CoolantOutletTemperatureC, 16.5, SampleQuality.Good, _t);
        _inputs.Set(SignalRole.StirrerPowerW, 150, SampleQuality.Good, _t);
    }
}
