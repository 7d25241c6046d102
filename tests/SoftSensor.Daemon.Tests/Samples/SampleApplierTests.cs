using System.Diagnostics.Metrics;
using System.Text;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Time.Testing;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Demo;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Samples;
using SoftSensor.Daemon.Status;
using SoftSensor.Daemon.Store;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Tests.Samples;

/// <summary>
/// The pipeline resolving operator inputs before its cycle (the estimator of config/demo.json fed the virtual
/// glycerol reactor, invented demo data, on a fake clock; real SQLite store): too old, another batch, waiting.
/// </summary>
public sealed class SampleApplierTests : IDisposable
{
    private static readonly TimeSpan Period = TimeSpan.FromSeconds(10);
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-applier-").FullName;
    private readonly ServiceProvider _sp = new ServiceCollection().AddMetrics().BuildServiceProvider();
    private readonly DaemonMetrics _metrics;
    private readonly SqliteStore _store;
    private readonly SampleBook _book;
    private readonly VirtualReactor _sim;
    private readonly FakeTimeProvider _time;
    private readonly ReactorOptions _reactor;
    private readonly ReactorPipeline _pipeline;

    public SampleApplierTests()
    {
        _metrics = new DaemonMetrics(_sp.GetRequiredService<IMeterFactory>());
        string config = DemoFiles.Find(DemoFiles.Config) ?? throw new FileNotFoundException(DemoFiles.Config);
        var o = new SoftSensorOptions();
        new ConfigurationBuilder().AddJsonFile(config).Build().Bind(o);
        _reactor = o.Reactors[0];
        _reactor.Estimator = _reactor.Estimator with { HistoryCapacity = 20 }; // 200 s of kept cycles
        var scenario = ScenarioLoader.Load(DemoFiles.Find(DemoFiles.Scenario) ?? throw new FileNotFoundException(DemoFiles.Scenario));
        _sim = VirtualReactor.Create(scenario, scenario.Seed);
        _time = new FakeTimeProvider(_sim.Time);
        _store = new SqliteStore(Path.Combine(_dir, "store.db"), _time);
        _book = new SampleBook(_store, _time);
        var bindings = TagBinding.FromOptions(_reactor);
        var cycle = new ReactorCycleFactory(new ConfigLocation(Path.GetDirectoryName(config)!)).Create(_reactor, bindings);
        var dispatcher = new FrameDispatcher([], _metrics, _time, NullLogger<FrameDispatcher>.Instance);
        var services = new PipelineServices(_time, dispatcher, new StatusBoard(), _store, _metrics, NullLogger.Instance, 1_000_000) { Samples = _book };
        _pipeline = new ReactorPipeline(_reactor, bindings, cycle, [], services);
    }

    public void Dispose()
    {
        _store.Dispose();
        _metrics.Dispose();
        _sp.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_dir, recursive: true);
    }

    private async Task CycleAsync()
    {
        _sim.Step(Period);
        foreach (var (name, value) in _sim.ReadTags())
        {
            if (_reactor.Tags.ContainsKey(name))
            {
                _pipeline.Accept(new Sample(name, value, _sim.Time, SampleQuality.Good, 0));
            }
        }

        _time.SetUtcNow(_sim.Time);
        await _pipeline.RunCycleAsync(default);
    }

    private SampleRecord Enter(string batch, DateTimeOffset at) => _book.Enter("r1", batch, SamplePayload.Parse(Encoding.UTF8.GetBytes(
        $$"""{"kind":"dcw","sampledAt":"{{at.UtcDateTime:yyyy-MM-ddTHH:mm:ssZ}}","valueGPerL":0.4,"sigmaGPerL":0.05}"""), _time.GetUtcNow()).Entry!);

    [Fact]
    public async Task Cycle_resolves_too_old_and_other_batch_inputs_and_keeps_a_future_one_waiting()
    {
        var start = _sim.Time;
        for (int n = 0; n < 30; n++)
        {
            await CycleAsync();
        }

        var old = Enter(_reactor.BatchId, start.AddSeconds(10));
        var other = Enter("some-earlier-batch", _sim.Time.AddSeconds(-60));
        var ahead = Enter(_reactor.BatchId, _sim.Time.AddSeconds(30));
        var fresh = Enter(_reactor.BatchId, _sim.Time.AddSeconds(-60));
        await CycleAsync();

        // The kept history (20 cycles = 200 s) no longer reaches the first; the second belongs to a batch the
        // reactor does not run; the one sampled 30 s after the last cycle waits.
        Assert.Equal(SampleOutcomes.TooOld, _book.Get(old.Id)!.Outcome);
        Assert.Contains("historyCapacity", _book.Get(old.Id)!.Detail, StringComparison.Ordinal);
        Assert.Equal(SampleOutcomes.BatchEnded, _book.Get(other.Id)!.Outcome);
        Assert.Equal(SampleOutcomes.Applied, _book.Get(fresh.Id)!.Outcome);
        Assert.Equal(SampleOutcomes.Pending, _book.Get(ahead.Id)!.Outcome);
        Assert.Empty(_book.Trajectory("r1", old.Id));

        await CycleAsync();
        await CycleAsync();
        await CycleAsync();
        Assert.Equal(SampleOutcomes.Applied, _book.Get(ahead.Id)!.Outcome);
        Assert.Empty(_book.Pending("r1"));
    }
}
