using System.Collections.Concurrent;
using Microsoft.Extensions.DependencyInjection;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Cli;
using SoftSensor.Daemon.Sinks;
using SoftSensor.Daemon.Tests.Fixtures;

namespace SoftSensor.Daemon.Tests.Batches;

/// <summary>`softsensor batch` against a running daemon (real mosquitto): frames carry the started batch id; a restart resumes it.</summary>
public sealed class BatchCommandTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>
{
    [Fact]
    public async Task BatchStart_over_status_api_frames_carry_batch_id_and_restart_resumes_it()
    {
        string dir = Directory.CreateTempSubdirectory("softsensor-batchcmd-").FullName;
        var config = TestConfigs.HandCase(broker.Port, "batchcmd");
        config["store:path"] = Path.Combine(dir, "store.db");
        var frames = new ConcurrentQueue<EstimateFrame>();
        void Capture(IServiceCollection s) => s.AddSingleton<IEstimateSink>(new CaptureSink(frames));
        try
        {
            await using (var daemon = await TestDaemon.StartAsync(new(config, StringComparer.OrdinalIgnoreCase), Capture))
            {
                using var output = new StringWriter();
                using var error = new StringWriter();
                int code = await BatchVerb.SendAsync(daemon.StatusAddress, "/api/batches/r1/start",
                    new Daemon.Batches.BatchStart("gly-007", 30, 0.3, 0.05, 20), output, error, CancellationToken.None);
                Assert.True(code == ExitCodes.Ok, error.ToString());
                await WaitForAsync(frames, "gly-007");

                int refused = await BatchVerb.SendAsync(daemon.StatusAddress, "/api/batches/r1/start",
                    new Daemon.Batches.BatchStart("gly-008", 30, 0.3, 0.05, 20), output, error, CancellationToken.None);
                Assert.Equal(ExitCodes.BadInput, refused);
                Assert.Contains("has batch 'gly-007' open", error.ToString(), StringComparison.Ordinal);
            }

            frames.Clear();
            await using (var daemon = await TestDaemon.StartAsync(new(config, StringComparer.OrdinalIgnoreCase), Capture))
            {
                await WaitForAsync(frames, "gly-007");
                using var output = new StringWriter();
                using var error = new StringWriter();
                Assert.Equal(ExitCodes.Ok, await BatchVerb.SendAsync(daemon.StatusAddress, "/api/batches/r1", null, output, error, CancellationToken.None));
                Assert.Contains("\"batchId\":\"gly-007\"", output.ToString(), StringComparison.Ordinal);
                Assert.Equal(ExitCodes.Ok, await BatchVerb.SendAsync(daemon.StatusAddress, "/api/batches/r1/end", new { }, output, error, CancellationToken.None));
                frames.Clear();
                await WaitForAsync(frames, "b-001"); // back to the configured id once the batch ended
            }
        }
        finally
        {
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public async Task BatchCommand_over_mqtt_starts_and_ends_batch_and_answers_on_result_topic()
    {
        var config = TestConfigs.HandCase(broker.Port, "batchmqtt");
        var frames = new ConcurrentQueue<EstimateFrame>();
        await using var daemon = await TestDaemon.StartAsync(config, s => s.AddSingleton<IEstimateSink>(new CaptureSink(frames)));
        await using var client = await TestMqttClient.ConnectAsync(broker.Port, "batchmqtt-test");
        string topic = "softsensor/pilot/batchmqtt/r1/command/batch";
        await client.SubscribeAsync(topic + "/result");
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(10);
        while (!daemon.Get<SoftSensor.Daemon.Mqtt.MqttLink>().IsSubscribed(topic))
        {
            Assert.True(DateTime.UtcNow < until, "command topic not subscribed");
            await Task.Delay(20);
        }

        await client.PublishAsync(topic, "{\"command\":\"start\",\"batchId\":\"yeast-3\",\"initialVolumeL\":30,\"inoculumBiomassGPerL\":0.3,\"inoculumBiomassSigmaGPerL\":0.05,\"initialSubstrateGPerL\":20}");
        var (_, started) = await client.WaitForAsync((t, p) => t.EndsWith("/result", StringComparison.Ordinal), TimeSpan.FromSeconds(5), "start result");
        Assert.Contains("\"applied\":true", started, StringComparison.Ordinal);
        await WaitForAsync(frames, "yeast-3");

        client.Clear();
        await client.PublishAsync(topic, "{\"command\":\"pause\"}");
        var (_, refused) = await client.WaitForAsync((t, p) => t.EndsWith("/result", StringComparison.Ordinal), TimeSpan.FromSeconds(5), "refusal");
        Assert.Contains("expected start, phase or end", refused, StringComparison.Ordinal);

        client.Clear();
        await client.PublishAsync(topic, "{\"command\":\"phase\",\"phase\":\"harvest\"}");
        var (_, phased) = await client.WaitForAsync((t, p) => t.EndsWith("/result", StringComparison.Ordinal), TimeSpan.FromSeconds(5), "phase result");
        Assert.Contains("\"phase\":\"harvest\"", phased, StringComparison.Ordinal);

        // Frames carry the phase, and the retained batch topic shows it.
        await client.SubscribeAsync("softsensor/pilot/batchmqtt/r1/batch");
        await client.WaitForAsync((t, p) => t.EndsWith("/r1/batch", StringComparison.Ordinal) && p.Contains("\"phase\":\"harvest\"", StringComparison.Ordinal), TimeSpan.FromSeconds(5), "retained batch topic in harvest");

        client.Clear();
        await client.PublishAsync(topic, "{\"command\":\"end\"}");
        var (_, ended) = await client.WaitForAsync((t, p) => t.EndsWith("/result", StringComparison.Ordinal), TimeSpan.FromSeconds(5), "end result");
        Assert.Contains("\"applied\":true", ended, StringComparison.Ordinal);
        Assert.Null(daemon.Get<Daemon.Batches.BatchBook>().Current("r1"));
    }

    [Fact]
    public async Task BatchForm_post_starts_batch_and_page_shows_it()
    {
        var config = TestConfigs.HandCase(broker.Port, "batchform");
        await using var daemon = await TestDaemon.StartAsync(config);
        using var http = TestAccess.OperatorClient(daemon.StatusAddress);
        Assert.Contains("Start batch", await http.GetStringAsync(new Uri("/batches", UriKind.Relative)), StringComparison.Ordinal);

        using var bad = new FormUrlEncodedContent(new Dictionary<string, string> { ["batchId"] = "f-1", ["initialVolumeL"] = "x" });
        string refused = await (await http.PostAsync(new Uri("/batches/r1/start", UriKind.Relative), bad)).Content.ReadAsStringAsync();
        Assert.Contains("initialVolumeL is NaN", refused, StringComparison.Ordinal);

        using var good = new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["batchId"] = "f-1", ["initialVolumeL"] = "30", ["inoculumBiomassGPerL"] = "0.3", ["inoculumBiomassSigmaGPerL"] = "0.05", ["initialSubstrateGPerL"] = "20",
        });
        string page = await (await http.PostAsync(new Uri("/batches/r1/start", UriKind.Relative), good)).Content.ReadAsStringAsync();
        Assert.Contains("Open batch <b>f-1</b>", page, StringComparison.Ordinal);
        using var phase = new FormUrlEncodedContent(new Dictionary<string, string> { ["phase"] = "fed-batch" });
        string moved = await (await http.PostAsync(new Uri("/batches/r1/phase", UriKind.Relative), phase)).Content.ReadAsStringAsync();
        Assert.Contains("id=\"phase-r1\">fed-batch</b>", moved, StringComparison.Ordinal);
        Assert.Equal("f-1", daemon.Get<Daemon.Batches.BatchBook>().Current("r1")!.BatchId);
    }

    private static async Task WaitForAsync(ConcurrentQueue<EstimateFrame> frames, string batchId)
    {
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(10);
        while (!frames.Any(f => f.BatchId == batchId))
        {
            Assert.True(DateTime.UtcNow < until, $"no frame with batch id '{batchId}' within 10 s");
            await Task.Delay(20);
        }
    }

    private sealed class CaptureSink(ConcurrentQueue<EstimateFrame> frames) : IEstimateSink
    {
        public string Name => "capture";

        public ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken)
        {
            frames.Enqueue(frame);
            return ValueTask.CompletedTask;
        }
    }
}
