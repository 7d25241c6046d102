using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Batches;
using SoftSensor.Daemon.Cli;
using SoftSensor.Daemon.Tests.Fixtures;

namespace SoftSensor.Daemon.Tests.Batches;

/// <summary>
/// The batch lifecycle end to end in an in-process daemon on a real mosquitto (<see cref="BatchDaemonRig"/>):
/// restart mid-batch, a new batch resetting integrals and alarms, fed-batch from the feed, batch id
/// and phase from plant tags, the batch report at the end.
/// </summary>
public sealed class BatchLifecycleTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>
{
    private static BatchStart Start(string id, double biomassGPerL = 0.3) => new(id, 30, biomassGPerL, 0.05, 15);

    [Fact]
    public async Task Restart_mid_batch_resumes_the_same_batch_and_ends_within_0_1_percent_of_an_uninterrupted_run()
    {
        const int before = 90, after = 90; // 15 min + 15 min of process time, past the analysers' 45 s dead time
        double uninterrupted;
        await using (var a = new BatchDaemonRig(broker.Port, "restart-a"))
        {
            await a.StartDaemonAsync();
            Assert.NotNull(a.Book.Start("r1", Start("gly-200")).Run);
            var last = await a.StepAsync(before + after);
            Assert.Equal("gly-200", last.BatchId);
            uninterrupted = BatchDaemonRig.Value(last, EstimateNames.BiomassG);
        }

        await using var b = new BatchDaemonRig(broker.Port, "restart-b");
        await b.StartDaemonAsync();
        Assert.NotNull(b.Book.Start("r1", Start("gly-200")).Run);
        var beforeStop = await b.StepAsync(before);
        await b.StopDaemonAsync();
        await b.StartDaemonAsync();
        Assert.Equal("gly-200", b.Book.Current("r1")!.BatchId);
        var first = await b.StepAsync();
        Assert.Equal("gly-200", first.BatchId);
        Assert.Equal("gly-200", b.Pipeline.StateBatch);

        // The integral continued from the checkpoint instead of restarting from the inoculum of 0.3 g/L x 30 L.
        Assert.True(BatchDaemonRig.Value(first, EstimateNames.BiomassG) >= BatchDaemonRig.Value(beforeStop, EstimateNames.BiomassG) * 0.999);
        var end = await b.StepAsync(after - 1);

        double resumed = BatchDaemonRig.Value(end, EstimateNames.BiomassG);
        // The bound is 0.1 %; the checkpoint keeps the state bit for bit and the inputs of the analyser
        // dead-time window, so the resumed run in fact reproduces the uninterrupted one.
        Assert.True(Math.Abs(resumed - uninterrupted) < 1e-3 * uninterrupted, $"biomass after the restart {resumed} g vs uninterrupted {uninterrupted} g");
    }

    [Fact]
    public async Task New_batch_resets_the_integrals_and_returns_the_alarms_to_normal()
    {
        string rules = Path.Combine(Path.GetTempPath(), $"softsensor-batchrules-{Guid.NewGuid():N}.json");
        await File.WriteAllTextAsync(rules, """
            {"rules": [{"id": "biomass_grown", "kind": "high", "source": "biomass_g_per_l", "limit": 0.32, "priority": "low",
                        "category": "process", "message": "test rule: biomass above 0.32 g/L"}]}
            """);
        try
        {
            await using var rig = new BatchDaemonRig(broker.Port, "newbatch", new() { ["alarms:ruleFiles:0"] = rules });
            await rig.StartDaemonAsync();
            Assert.NotNull(rig.Book.Start("r1", Start("gly-300")).Run);
            var grown = await rig.StepAsync(120);
            Assert.True(BatchDaemonRig.Value(grown, EstimateNames.BiomassGPerL) > 0.32, "the culture grew past the rule's limit");
            var engine = rig.Daemon!.Get<SoftSensor.Daemon.Alarming.AlarmService>();
            await BatchDaemonRig.WaitUntilAsync(() => engine.Engine.States().Any(s => s.Alarm == "biomass_grown" && s.State == "unacknowledged"), () => "alarm not raised");

            Assert.NotNull(rig.Book.End("r1").Run);
            Assert.NotNull(rig.Book.Start("r1", Start("gly-301", 0.2)).Run);
            var fresh = await rig.StepAsync();
            Assert.Equal("gly-301", fresh.BatchId);
            Assert.Equal(0.2, BatchDaemonRig.Value(fresh, EstimateNames.BiomassGPerL), 9);
            await BatchDaemonRig.WaitUntilAsync(() => engine.Engine.States().Single(s => s.Alarm == "biomass_grown").State == "normal", () => "alarm not reset");
            var journal = engine.Journal.Recent("r1", 50);
            Assert.Contains(journal, e => e.Transition.RuleId == "biomass_grown" && e.Transition.Cause == Core.Alarms.AlarmCause.NewBatch);
        }
        finally
        {
            File.Delete(rules);
        }
    }

    [Fact]
    public async Task Feed_above_threshold_for_the_hold_time_moves_the_batch_to_fed_batch_and_frames_carry_it()
    {
        await using var rig = new BatchDaemonRig(broker.Port, "fedbatch", new()
        {
            ["reactors:0:batches:fedBatchFeedAboveLPerH"] = "0.05",
            ["reactors:0:batches:fedBatchHold"] = "00:02:00",
        });
        await rig.StartDaemonAsync();
        Assert.NotNull(rig.Book.Start("r1", Start("gly-400")).Run);
        var noFeed = new Dictionary<string, double> { ["R1.FEED.RATE"] = 0.0 };
        var feed = new Dictionary<string, double> { ["R1.FEED.RATE"] = 0.12 };
        Assert.Equal("batch", (await rig.StepAsync(6, noFeed)).Phase);
        Assert.Equal("batch", (await rig.StepAsync(6, feed)).Phase);     // 50 s above: still inside the 2 min hold
        await rig.StepAsync(3, noFeed);                                    // a pause restarts the hold
        Assert.Equal("batch", (await rig.StepAsync(12, feed)).Phase);    // 110 s above
        var frame = await rig.StepAsync(2, feed);                         // 130 s above
        Assert.Equal("fed-batch", frame.Phase);
        var phases = rig.Book.Phases("r1", "gly-400");
        Assert.Equal(["batch", "fed-batch"], phases.Select(p => p.Phase));
        Assert.Equal("feed", phases[^1].Source);

        // The operator moves it on through the CLI path; the status page shows it.
        using var output = new StringWriter();
        using var error = new StringWriter();
        Assert.Equal(ExitCodes.Ok, await BatchVerb.SendAsync(rig.Daemon!.StatusAddress, "/api/batches/r1/phase", new PhaseCommand("induced"), output, error, CancellationToken.None));
        Assert.Equal("induced", (await rig.StepAsync()).Phase);
        Assert.Equal(ExitCodes.BadInput, await BatchVerb.SendAsync(rig.Daemon.StatusAddress, "/api/batches/r1/phase", new PhaseCommand("stationary"), output, error, CancellationToken.None));
        Assert.Contains("phase is 'stationary' (expected one of batch, fed-batch, induced, harvest)", error.ToString(), StringComparison.Ordinal);
        using var http = new HttpClient();
        string page = await http.GetStringAsync(new Uri(rig.Daemon.StatusAddress + "/batches"));
        Assert.Contains("id=\"phase-r1\">induced</b>", page, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Batch_id_tag_change_ends_the_batch_starts_the_next_with_the_tag_volume_and_writes_the_report()
    {
        await using var rig = new BatchDaemonRig(broker.Port, "idtag", new()
        {
            ["reactors:0:tags:R1.BATCH.ID:role"] = "BatchId",
            ["reactors:0:tags:R1.BATCH.ID:unit"] = "id",
            ["reactors:0:tags:R1.BATCH.ID:topic"] = "batchrig/idtag/r1.batch.id",
            ["reactors:0:tags:R1.PHASE:role"] = "BatchPhaseCode",
            ["reactors:0:tags:R1.PHASE:unit"] = "code",
            ["reactors:0:tags:R1.PHASE:topic"] = "batchrig/idtag/r1.phase",
            ["reactors:0:batches:phaseCodes:10"] = "batch",
            ["reactors:0:batches:phaseCodes:20"] = "fed-batch",
            ["reactors:0:batches:phaseCodes:30"] = "induced",
        });
        await rig.StartDaemonAsync();
        await rig.StepAsync(3);
        await rig.PublishAsync("R1.BATCH.ID", "GLY-1042");
        var frame = await rig.StepAsync();
        Assert.Equal("GLY-1042", frame.BatchId);
        var run = rig.Book.Current("r1")!;
        double weightVolume = rig.Sim.ReadTags()["R1.WEIGHT"] / 1.03; // the tag is read as a volume with scale 1/1.03 (config/demo.json)
        Assert.Equal(weightVolume, run.InitialVolumeL, 1);
        Assert.Equal(0.3, run.InoculumBiomassGPerL); // estimator:initialBiomassGPerL of config/demo.json

        await rig.PublishAsync("R1.PHASE", 30);
        Assert.Equal("induced", (await rig.StepAsync(30)).Phase);

        await rig.PublishAsync("R1.BATCH.ID", 1043); // a numeric id from the controller
        var next = await rig.StepAsync();
        Assert.Equal("1043", next.BatchId);
        Assert.Equal("induced", next.Phase); // the phase tag still reads 30: the controller's phase holds for the new batch
        Assert.Equal([("batch", "tag"), ("induced", "tag")], rig.Book.Phases("r1", "1043").Select(p => (p.Phase, p.Source)));
        var ended = rig.Book.Runs("r1").Single(r => r.BatchId == "GLY-1042");
        Assert.NotNull(ended.EndedAt);

        // The report of GLY-1042, written off the cycle from the store, is served by the status server with its figures.
        using var http = new HttpClient();
        string url = rig.Daemon!.StatusAddress + "/reports/r1/GLY-1042/report.html";
        string? html = null;
        await BatchDaemonRig.WaitUntilAsync(() =>
        {
            var r = http.GetAsync(new Uri(url)).GetAwaiter().GetResult();
            html = r.IsSuccessStatusCode ? r.Content.ReadAsStringAsync().GetAwaiter().GetResult() : null;
            return html is not null;
        }, () => "report not served", 30);
        Assert.Contains("Batch GLY-1042 of reactor r1", html, StringComparison.Ordinal);
        Assert.Contains("<img src=\"rates.png\"", html, StringComparison.Ordinal);
        Assert.Contains("<img src=\"biomass.png\"", html, StringComparison.Ordinal);
        Assert.Contains("<td>induced</td>", html, StringComparison.Ordinal);
        var png = await http.GetAsync(new Uri(rig.Daemon.StatusAddress + "/reports/r1/GLY-1042/rates.png"));
        Assert.Equal("image/png", png.Content.Headers.ContentType?.MediaType);
        var bytes = await png.Content.ReadAsByteArrayAsync();
        Assert.Equal([0x89, (byte)'P', (byte)'N', (byte)'G'], bytes[..4]); // PNG signature (ISO/IEC 15948 §5.2)
        string list = await http.GetStringAsync(new Uri(rig.Daemon.StatusAddress + "/reports"));
        Assert.Contains("/reports/r1/GLY-1042/report.html", list, StringComparison.Ordinal);
        Assert.Equal(System.Net.HttpStatusCode.NotFound, (await http.GetAsync(new Uri(rig.Daemon.StatusAddress + "/reports/r1/GLY-1042/..%2Fstore.db"))).StatusCode);
    }
}
