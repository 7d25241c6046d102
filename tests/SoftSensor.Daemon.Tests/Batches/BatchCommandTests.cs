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
