using System.Text;
using Microsoft.Data.Sqlite;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Samples;
using SoftSensor.Daemon.Store;
using SoftSensor.Daemon.Tests.Pipeline;

namespace SoftSensor.Daemon.Tests.Samples;

/// <summary>
/// The pipeline resolving operator inputs before its cycle (the estimator of config/demo.json fed the virtual
/// glycerol reactor, invented demo data, on a fake clock; real SQLite store): too old, another batch, waiting.
/// </summary>
public sealed class SampleApplierTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-applier-").FullName;
    private readonly DemoEstimatorRig _rig = new(r => r.Estimator = r.Estimator with { HistoryCapacity = 20 }); // 200 s of kept cycles
    private readonly SqliteStore _store;
    private readonly SampleBook _book;
    private readonly ReactorPipeline _pipeline;

    public SampleApplierTests()
    {
        _store = new SqliteStore(Path.Combine(_dir, "store.db"), _rig.Time);
        _book = new SampleBook(_store, _rig.Time);
        _pipeline = _rig.NewPipeline(_rig.Services(_store) with { Samples = _book }).Pipeline;
    }

    public void Dispose()
    {
        _store.Dispose();
        _rig.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_dir, recursive: true);
    }

    private async Task CycleAsync()
    {
        _rig.Step(_pipeline);
        await _pipeline.RunCycleAsync(default);
    }

    private SampleRecord Enter(string batch, DateTimeOffset at) => _book.Enter("r1", batch, SamplePayload.Parse(Encoding.UTF8.GetBytes(
        $$"""{"kind":"dcw","sampledAt":"{{at.UtcDateTime:yyyy-MM-ddTHH:mm:ssZ}}","valueGPerL":0.4,"sigmaGPerL":0.05}"""), _rig.Time.GetUtcNow()).Entry!);

    [Fact]
    public async Task Cycle_resolves_too_old_and_other_batch_inputs_and_keeps_a_future_one_waiting()
    {
        var start = _rig.Sim.Time;
        for (int n = 0; n < 30; n++)
        {
            await CycleAsync();
        }

        var old = Enter(_rig.Reactor.BatchId, start.AddSeconds(10));
        var other = Enter("some-earlier-batch", _rig.Sim.Time.AddSeconds(-60));
        var ahead = Enter(_rig.Reactor.BatchId, _rig.Sim.Time.AddSeconds(30));
        var fresh = Enter(_rig.Reactor.BatchId, _rig.Sim.Time.AddSeconds(-60));
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
