using Microsoft.Data.Sqlite;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Batches;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Store;
using SoftSensor.Daemon.Tests.Pipeline;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Tests.Batches;

/// <summary>
/// A batch start hands its initial conditions to the estimator of the pipeline (fake clock, the
/// virtual reactor's tags from config/scenarios/glycerol.json, invented demo data, through the
/// shipped config/demo.json), and checkpoints remember their batch (real SQLite file).
/// </summary>
public sealed class BatchEstimatorTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-batchest-").FullName;
    private readonly DemoEstimatorRig _rig = new();
    private readonly SqliteStore _store;
    private readonly BatchBook _book;

    public BatchEstimatorTests()
    {
        string db = Path.Combine(_dir, "store.db");
        _store = new SqliteStore(db, _rig.Time);
        _book = new BatchBook(db, _rig.Time);
    }

    public void Dispose()
    {
        _store.Dispose();
        _rig.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_dir, recursive: true);
    }

    private ReactorPipeline NewPipeline() => _rig.NewPipeline(_rig.Services(_store, 1) with { Batches = _book }).Pipeline;

    /// <summary>Steps the simulator one period, hands its tags to every pipeline (a restarted daemon's inputs are the same), runs the first.</summary>
    private async Task<EstimateFrame> StepAsync(params ReactorPipeline[] pipelines)
    {
        _rig.Step(pipelines);
        return await pipelines[0].RunCycleAsync(default);
    }

    private static double Value(EstimateFrame f, string name) => f.Values.Single(v => v.Name == name).Value;

    private void Start(string id, double biomassGPerL, double sigmaGPerL)
    {
        var (run, problems) = _book.Start("r1", new BatchStart(id, 30, biomassGPerL, sigmaGPerL, 15));
        Assert.True(run is not null, string.Join("; ", problems));
    }

    [Fact]
    public async Task BatchStart_resets_the_estimator_to_the_batch_initial_conditions_and_checkpoints_with_the_batch()
    {
        var pipeline = NewPipeline();
        EstimateFrame frame = null!;
        for (int i = 0; i < 60; i++)
        {
            frame = await StepAsync(pipeline);
        }

        Assert.Equal("demo-glycerol", frame.BatchId);
        Assert.True(Math.Abs(Value(frame, EstimateNames.BiomassGPerL) - 0.2) > 0.05, "before the batch: the configured inoculum of 0.3 g/L and its growth");

        Start("gly-101", 0.2, 0.04);
        frame = await StepAsync(pipeline);
        Assert.Equal("gly-101", frame.BatchId);
        Assert.Equal("gly-101", pipeline.StateBatch);

        // The first cycle of the batch starts from the stated inoculum with P0 = sigma² (dt = 0: nothing integrated yet).
        Assert.Equal(0.2, Value(frame, EstimateNames.BiomassGPerL), 9);
        Assert.Equal(0.04, frame.Values.Single(v => v.Name == EstimateNames.BiomassGPerL).Sigma, 9);
        var checkpoint = await _store.LatestCheckpointAsync("r1", default);
        Assert.Equal("gly-101", checkpoint!.Batch);
    }

    [Fact]
    public async Task Restart_mid_batch_restores_the_checkpoint_of_the_same_batch_and_continues()
    {
        Start("gly-102", 0.3, 0.05);
        var a = NewPipeline();
        var b = NewPipeline();
        EstimateFrame last = null!;
        for (int i = 0; i < 60; i++)
        {
            last = await StepAsync(a, b);
        }

        await b.RestoreAsync(default);
        Assert.Equal("gly-102", b.StateBatch);
        var fa = await StepAsync(a, b);
        var fb = await b.RunCycleAsync(default);
        Assert.Equal(Value(fa, EstimateNames.BiomassG), Value(fb, EstimateNames.BiomassG), 9);
        Assert.True(Value(fb, EstimateNames.BiomassGPerL) > Value(last, EstimateNames.BiomassGPerL) * 0.99, "continued, not reset");
    }

    [Fact]
    public async Task Restart_in_a_new_batch_does_not_apply_the_previous_batch_checkpoint()
    {
        Start("gly-103", 0.3, 0.05);
        var a = NewPipeline();
        for (int i = 0; i < 60; i++)
        {
            await StepAsync(a);
        }

        Assert.NotNull(_book.End("r1").Run);
        Start("gly-104", 0.25, 0.05);
        var b = NewPipeline();
        await b.RestoreAsync(default);
        Assert.Equal(string.Empty, b.StateBatch);
        var frame = await StepAsync(b);
        Assert.Equal("gly-104", b.StateBatch);
        Assert.Equal(0.25, Value(frame, EstimateNames.BiomassGPerL), 9);
    }

    [Fact]
    public async Task SqliteStore_opens_a_version_1_file_and_adds_the_checkpoint_batch_column()
    {
        string old = Path.Combine(_dir, "v1.db");
        using (var c = new SqliteConnection($"Data Source={old}"))
        {
            c.Open();
            using var cmd = c.CreateCommand();
            cmd.CommandText = """
                CREATE TABLE checkpoints (id INTEGER PRIMARY KEY, reactor TEXT NOT NULL, cycle INTEGER NOT NULL, time_ms INTEGER NOT NULL, state TEXT NOT NULL);
                INSERT INTO checkpoints (reactor, cycle, time_ms, state) VALUES ('r1', 7, 0, 'AAAA');
                PRAGMA user_version = 1;
                """;
            cmd.ExecuteNonQuery();
        }

        using var store = new SqliteStore(old, _rig.Time);
        var legacy = await store.LatestCheckpointAsync("r1", default);
        Assert.Equal((7L, (string?)null), (legacy!.Cycle, legacy.Batch));
        await store.WriteCheckpointAsync(new Checkpoint("r1", 8, _rig.Time.GetUtcNow(), "BBBB", "gly-9"), default);
        Assert.Equal("gly-9", (await store.LatestCheckpointAsync("r1", default))!.Batch);
    }
}
