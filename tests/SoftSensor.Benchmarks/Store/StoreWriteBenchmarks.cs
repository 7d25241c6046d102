using BenchmarkDotNet.Attributes;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Store;

namespace SoftSensor.Benchmarks.Store;

/// <summary>
/// The embedded store's frame writes as the dispatcher makes them under load: one second of a
/// thousand reactors, a few frames of thirteen values (the estimator's frame) per transaction, on a
/// file in the temporary folder (WAL, synchronous=NORMAL, as the daemon runs it). Per frame.
/// Invented values (the demo's scale).
/// <code>dotnet run -c Release --project tests/SoftSensor.Benchmarks -- --filter *StoreWrite*</code>
/// </summary>
[MemoryDiagnoser]
public class StoreWriteBenchmarks
{
    private const int FramesPerBatch = 4;
    private const int Batches = 250;
    private string _folder = "";
    private SqliteStore? _store;
    private EstimateFrame[][] _batches = [];

    [GlobalSetup]
    public void Setup()
    {
        _folder = Directory.CreateTempSubdirectory("softsensor-bench-").FullName;
        _store = new SqliteStore(Path.Combine(_folder, "store.db"), TimeProvider.System);
        var t0 = new DateTimeOffset(2026, 12, 1, 8, 0, 0, TimeSpan.Zero);
        string[] names = ["our", "cer", "rq", "outlet_flow_nl_per_min", "mu_per_h", "mu_raw_per_h", "biomass_g_per_l", "biomass_g", "volume_l", "h", "h_critical", "feed_advisory_l_per_h", "feed_cap_l_per_h"];
        _batches = [.. Enumerable.Range(0, Batches).Select(b => Enumerable.Range(0, FramesPerBatch).Select(f =>
            new EstimateFrame($"r{(b * FramesPerBatch) + f:0000}", "gly-7", t0, SampleQuality.Good,
                [.. names.Select((n, i) => new EstimateValue(n, 10 + i + 0.001 * b, "1", 0.1, SampleQuality.Good, 0))])).ToArray())];
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        _store?.Dispose();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
    }

    [Benchmark(OperationsPerInvoke = Batches * FramesPerBatch)]
    public async Task WriteFrame()
    {
        foreach (var batch in _batches)
        {
            await _store!.WriteFramesAsync(batch, CancellationToken.None);
        }
    }
}
