using System.Globalization;
using System.Text.Json;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Store;
using SoftSensor.Daemon.Tests.Fixtures;

namespace SoftSensor.Daemon.Tests.Integration;

/// <summary>The daemon end to end through a real mosquitto: tags in, estimates out.</summary>
public sealed class DaemonMqttTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>
{
    private static readonly TimeSpan Wait = TimeSpan.FromSeconds(10);

    internal static string Now() => DateTimeOffset.UtcNow.ToString("o", CultureInfo.InvariantCulture);

    internal static async Task PublishHandCaseAsync(TestMqttClient client, string clientId, double airNlPerMin = 10.0)
    {
        string t = Now();
        await client.PublishAsync($"plant/{clientId}/r1/fic101", $$"""{"value": {{airNlPerMin.ToString(CultureInfo.InvariantCulture)}}, "timestamp": "{{t}}", "quality": "good"}""");
        await client.PublishAsync($"plant/{clientId}/r1/qi201", $$"""{"value": 19.500, "timestamp": "{{t}}"}""");
        await client.PublishAsync($"plant/{clientId}/r1/qi202", $$"""{"value": 1.500, "timestamp": "{{t}}"}""");
        await client.PublishAsync($"plant/{clientId}/r1/li301", $$"""{"value": 10.0, "timestamp": "{{t}}"}""");
    }

    internal static bool IsGood(string payload) => payload.Contains("\"quality\":\"good\"", StringComparison.Ordinal);

    [Fact]
    public async Task Run_published_hand_case_tags_come_back_as_estimates_on_output_topics()
    {
        await using var daemon = await TestDaemon.StartAsync(TestConfigs.HandCase(broker.Port, "it-hand"));
        await using var client = await TestMqttClient.ConnectAsync(broker.Port, "it-hand-client");
        await client.SubscribeAsync(TestConfigs.Subtree("it-hand") + "/r1/estimate/#");
        await PublishHandCaseAsync(client, "it-hand");

        var (_, our) = await client.WaitForAsync((t, p) => t.EndsWith("/estimate/our", StringComparison.Ordinal) && IsGood(p), Wait, "a good OUR estimate");
        var (_, rq) = await client.WaitForAsync((t, p) => t.EndsWith("/estimate/rq", StringComparison.Ordinal) && IsGood(p), Wait, "a good RQ estimate");

        // docs/methods.md §6, the off-gas case worked by hand: OTR 38.629 mmol/(L·h), RQ 1.0105.
        using var ourDoc = JsonDocument.Parse(our);
        Assert.Equal(38.629, ourDoc.RootElement.GetProperty("value").GetDouble(), 0.0005);
        Assert.Equal("mmol/(L·h)", ourDoc.RootElement.GetProperty("unit").GetString());
        Assert.Equal(0u, ourDoc.RootElement.GetProperty("statusCode").GetUInt32());
        Assert.True(ourDoc.RootElement.TryGetProperty("timestamp", out _));
        using var rqDoc = JsonDocument.Parse(rq);
        Assert.Equal(1.0105, rqDoc.RootElement.GetProperty("value").GetDouble(), 0.00005);

        var store = daemon.Get<SqliteStore>();
        var rows = await store.QueryEstimatesAsync("r1", EstimateNames.Our, DateTimeOffset.UtcNow.AddMinutes(-1), DateTimeOffset.UtcNow.AddMinutes(1), 1000, default);
        var all = await store.QueryEstimatesAsync("r1", null, DateTimeOffset.UnixEpoch, DateTimeOffset.MaxValue, 1000, default);
        Assert.True(rows.Count > 0, $"no rows; all: {all.Count} first {(all.Count > 0 ? all[0].ToString() : "")} last {(all.Count > 0 ? all[^1].ToString() : "")}");
        Assert.Contains(rows, r => r.Quality == SampleQuality.Good && Math.Abs(r.Value - 38.629) < 0.0005);
    }

    [Fact]
    public async Task Run_estimates_are_retained_for_a_late_subscriber()
    {
        await using var daemon = await TestDaemon.StartAsync(TestConfigs.HandCase(broker.Port, "it-retain"));
        await using var publisher = await TestMqttClient.ConnectAsync(broker.Port, "it-retain-pub");
        await publisher.SubscribeAsync(TestConfigs.Subtree("it-retain") + "/r1/estimate/our");
        await PublishHandCaseAsync(publisher, "it-retain");
        await publisher.WaitForAsync((_, p) => IsGood(p), Wait, "a good OUR estimate");

        await using var late = await TestMqttClient.ConnectAsync(broker.Port, "it-retain-late");
        await late.SubscribeAsync(TestConfigs.Subtree("it-retain") + "/r1/estimate/our");
        await late.WaitForAsync((_, p) => p.Contains("\"value\":", StringComparison.Ordinal), Wait, "the retained OUR");
    }

    [Fact]
    public async Task Run_malformed_payloads_are_dropped_and_counted_and_the_pipeline_keeps_running()
    {
        await using var daemon = await TestDaemon.StartAsync(TestConfigs.HandCase(broker.Port, "it-bad"));
        await using var client = await TestMqttClient.ConnectAsync(broker.Port, "it-bad-client");
        await client.SubscribeAsync(TestConfigs.Subtree("it-bad") + "/r1/estimate/our");
        string[] garbage = ["not json", "{\"value\": \"abc\"}", "{\"value\": 1e999}", "", "{\"value\": 1, \"timestamp\": []}", new string('[', 5000)];
        foreach (var g in garbage)
        {
            await client.PublishAsync("plant/it-bad/r1/qi201", g);
        }

        await PublishHandCaseAsync(client, "it-bad");
        var (_, our) = await client.WaitForAsync((_, p) => IsGood(p), Wait, "a good OUR after malformed payloads");
        using var doc = JsonDocument.Parse(our);
        Assert.Equal(38.629, doc.RootElement.GetProperty("value").GetDouble(), 0.0005);

        // The counters are read as the exporter collects them: wait for the expected lines (generous timeout), do not sleep.
        using var http = new HttpClient();
        string rejected = $"softsensor_samples_rejected_total{{reactor=\"r1\"}} {garbage.Length}";
        string accepted = "softsensor_samples_in_total{reactor=\"r1\"} 4";
        string metrics = "";
        var deadline = DateTime.UtcNow + Wait;
        while (DateTime.UtcNow < deadline)
        {
            metrics = await http.GetStringAsync(daemon.StatusAddress + "/metrics");
            if (metrics.Contains(rejected, StringComparison.Ordinal) && metrics.Contains(accepted, StringComparison.Ordinal))
            {
                break;
            }

            await Task.Delay(50);
        }

        Assert.Contains(rejected, metrics, StringComparison.Ordinal);
        Assert.Contains(accepted, metrics, StringComparison.Ordinal);
        Assert.Contains("# TYPE softsensor_cycle_seconds histogram", metrics, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Run_input_that_stops_arriving_turns_the_estimate_bad_within_one_cycle()
    {
        var config = TestConfigs.HandCase(broker.Port, "it-stale", maxAge: TimeSpan.FromSeconds(1));
        await using var daemon = await TestDaemon.StartAsync(config);
        await using var client = await TestMqttClient.ConnectAsync(broker.Port, "it-stale-client");
        await client.SubscribeAsync(TestConfigs.Subtree("it-stale") + "/r1/estimate/our");
        await PublishHandCaseAsync(client, "it-stale");
        await client.WaitForAsync((_, p) => IsGood(p), Wait, "a good OUR");
        var goodAt = DateTimeOffset.UtcNow;

        var (_, bad) = await client.WaitForAsync((_, p) => p.Contains("\"quality\":\"bad\"", StringComparison.Ordinal), Wait, "a bad OUR once the inputs are stale");

        // Max age 1 s plus one cycle (0.2 s) plus delivery: well inside 2 s of the last good one.
        Assert.InRange((DateTimeOffset.UtcNow - goodAt).TotalSeconds, 0, 2.0);
        using var doc = JsonDocument.Parse(bad);
        Assert.Equal(0x80310000u, doc.RootElement.GetProperty("statusCode").GetUInt32());
        Assert.Equal(JsonValueKind.Number, doc.RootElement.GetProperty("value").ValueKind);
    }
}
