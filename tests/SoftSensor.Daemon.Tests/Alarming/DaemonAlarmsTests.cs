using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using SoftSensor.Daemon.Alarming;
using SoftSensor.Daemon.Store;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.Daemon.Tests.Integration;
using SoftSensor.Daemon.Tests.Timeseries;

namespace SoftSensor.Daemon.Tests.Alarming;

/// <summary>
/// Alarms and the time-series sink in the running daemon, against a real mosquitto and a real
/// VictoriaMetrics: the hand-worked off-gas case (RQ 1.0105, docs/methods.md §6) trips an RQ
/// rule; the alarm is published retained, acknowledged over MQTT, shelved from the status page,
/// journaled; the estimates reach the database.
/// </summary>
public sealed class DaemonAlarmsTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>, IAsyncLifetime
{
    private static readonly TimeSpan Wait = TimeSpan.FromSeconds(10);
    private readonly VictoriaMetricsServer _vm = new(dedup: false);
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-da-").FullName;

    public Task InitializeAsync() => _vm.StartAsync();

    public async Task DisposeAsync()
    {
        await _vm.DisposeAsync();
        Directory.Delete(_dir, recursive: true);
    }

    internal static string RuleFile(string dir)
    {
        string path = Path.Combine(dir, "rules.json");
        File.WriteAllText(path, """
            { "rules": [
              { "id": "rq_high", "kind": "high", "source": "rq", "limit": 1.005, "priority": "high", "message": "RQ above 1.005" },
              { "id": "offgas_o2_enriched", "kind": "high", "source": "input:OutletO2Percent", "limit": 23.5, "priority": "urgent", "category": "safety", "message": "O2 above 23.5 %" }
            ] }
            """);
        return path;
    }

    [Fact]
    public async Task Run_RqRule_PublishedAcknowledgedOverMqttShelvedOverHttpJournaledAndEstimatesStored()
    {
        var config = TestConfigs.HandCase(broker.Port, "it-alarms");
        config["alarms:ruleFiles:0"] = RuleFile(_dir);
        config["timeseries:url"] = _vm.Url;
        config["timeseries:outboxPath"] = Path.Combine(_dir, "outbox.db");
        await using var daemon = await TestDaemon.StartAsync(config);
        await using var client = await TestMqttClient.ConnectAsync(broker.Port, "it-alarms-client");
        string subtree = TestConfigs.Subtree("it-alarms");
        await client.SubscribeAsync(subtree + "/r1/alarm/#");
        await client.SubscribeAsync(subtree + "/r1/command/alarm/result");
        await DaemonMqttTests.PublishHandCaseAsync(client, "it-alarms");

        var (_, state) = await client.WaitForAsync((t, p) => t == subtree + "/r1/alarm/rq_high" && p.Contains("\"state\":\"unacknowledged\"", StringComparison.Ordinal), Wait, "rq_high unacknowledged, retained");
        using (var doc = JsonDocument.Parse(state))
        {
            Assert.Equal(1.0105, doc.RootElement.GetProperty("value").GetDouble(), 0.0001);
            Assert.Equal("high", doc.RootElement.GetProperty("priority").GetString());
        }

        await client.WaitForAsync((t, p) => t == subtree + "/r1/alarm/rq_high/event" && p.Contains("\"to\":\"unacknowledged\"", StringComparison.Ordinal), Wait, "the event of the alarm coming up");

        await client.PublishAsync(subtree + "/r1/command/alarm", """{"command":"acknowledge","alarm":"rq_high","operator":"anna"}""");
        await client.WaitForAsync((t, p) => t == subtree + "/r1/alarm/rq_high" && p.Contains("\"state\":\"acknowledged\"", StringComparison.Ordinal), Wait, "rq_high acknowledged");
        await client.WaitForAsync((t, p) => t.EndsWith("/result", StringComparison.Ordinal) && p.Contains("\"applied\":true", StringComparison.Ordinal), Wait, "the command result");

        using var http = TestAccess.OperatorClient(daemon.StatusAddress);
        using var shelve = new StringContent("""{"command":"shelve","alarm":"rq_high","operator":"ben","shelveMinutes":15,"reactor":"r1"}""", Encoding.UTF8, "application/json");
        using (var r = await http.PostAsync(new Uri("/api/alarm-commands", UriKind.Relative), shelve))
        {
            Assert.Equal(200, (int)r.StatusCode);
        }

        using var again = new StringContent("""{"command":"acknowledge","alarm":"rq_high","operator":"ben","reactor":"r1"}""", Encoding.UTF8, "application/json");
        using (var r = await http.PostAsync(new Uri("/api/alarm-commands", UriKind.Relative), again))
        {
            Assert.Equal(409, (int)r.StatusCode);
            Assert.Contains("is shelved: nothing to acknowledge", await r.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        }

        var states = await http.GetFromJsonAsync<List<AlarmStateDocument>>(new Uri("/api/alarm-states", UriKind.Relative));
        Assert.Equal("shelved", states!.Single(s => s.Alarm == "rq_high").State);
        Assert.Equal("normal", states!.Single(s => s.Alarm == "offgas_o2_enriched").State);

        var journal = daemon.Get<AlarmService>().Journal.Recent("r1", 10);
        // Newest first; before the first good cycle the RQ was bad, so the alarm came up from suppressed.
        Assert.Equal(["shelved", "acknowledged"], journal.Take(2).Select(e => AlarmPayloads.CauseId(e.Transition.Cause)));
        // Over HTTP the journal names the authenticated token's owner, not the body's "ben"; over MQTT the payload's operator.
        Assert.Equal(["ci-operator", "anna"], journal.Take(2).Select(e => e.Transition.Operator));
        Assert.Equal("unacknowledged", Core.Alarms.AlarmStates.Id(journal[2].Transition.To));
        var store = daemon.Get<SqliteStore>();
        var mirrored = await store.QueryAlarmsAsync("r1", DateTimeOffset.UtcNow.AddMinutes(-5), DateTimeOffset.UtcNow.AddMinutes(5), 100, default);
        Assert.Contains(mirrored, a => a.AlarmId == "rq_high" && a.State == "acknowledged" && a.Active);
        Assert.DoesNotContain(await store.ActiveAlarmsAsync(default), a => a.AlarmId == "rq_high"); // shelved: off the active list

        var stored = await _vm.ExportWhenCompleteAsync("softsensor_gas_rq", 1, 1);
        Assert.Contains(stored, kv => kv.Key.Contains("unit=r1", StringComparison.Ordinal) && kv.Key.Contains("batch=b-001", StringComparison.Ordinal));
    }
}
