using System.Text.Json;
using SoftSensor.Daemon.Cli;
using SoftSensor.Daemon.Samples;
using SoftSensor.Daemon.Tests.Cli;
using SoftSensor.Daemon.Tests.Fixtures;

namespace SoftSensor.Daemon.Tests.Samples;

/// <summary>The other two ways in (real mosquitto for the daemon's link): `softsensor sample` against a running daemon, and the lab form.</summary>
public sealed class SampleEntryPathsTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>
{
    [Fact]
    public async Task SampleVerb_add_od_and_list_against_a_running_daemon_and_refusal_names_the_field()
    {
        await using var daemon = await TestDaemon.StartAsync(TestConfigs.HandCase(broker.Port, "samplecli"));
        string url = daemon.StatusAddress;
        var (code, output, error) = await Task.Run(() => CliRunner.Run("sample", "add", "--json", "--url", url, "--reactor", "r1", "--kind", "od",
            "--sampled-at", DateTimeOffset.UtcNow.AddHours(-2).ToString("yyyy-MM-ddTHH:mm:ssZ", System.Globalization.CultureInfo.InvariantCulture),
            "--od", "10", "--od-sigma", "0.2", "--factor-g-per-l-per-od", "0.38", "--factor-sigma-g-per-l-per-od", "0.02", "--withdrawn-ml", "40"));
        Assert.True(code == ExitCodes.Ok, error);
        using (var doc = JsonDocument.Parse(output))
        {
            var s = doc.RootElement.GetProperty("sample");
            // JCGM 100:2008 eq. (10): u = sqrt((0.38·0.2)² + (10·0.02)²) g/L (invented values).
            Assert.Equal(3.8, s.GetProperty("valueGPerL").GetDouble(), 12);
            Assert.Equal(Math.Sqrt((0.076 * 0.076) + 0.04), s.GetProperty("sigmaGPerL").GetDouble(), 12);
            Assert.Equal(0.04, s.GetProperty("withdrawnL").GetDouble(), 12);
            Assert.Equal("b-001", s.GetProperty("batch").GetString());
        }

        // The hand-case reactor runs no biomass estimator: the cycle closes the sample as unsupported, and says why.
        var book = daemon.Get<SampleBook>();
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(10);
        while (book.List("r1")[0].Outcome == SampleOutcomes.Pending)
        {
            Assert.True(DateTime.UtcNow < until, "sample not resolved by a cycle");
            await Task.Delay(20);
        }

        Assert.Equal(SampleOutcomes.Unsupported, book.List("r1")[0].Outcome);
        var (listed, list, _) = await Task.Run(() => CliRunner.Run("sample", "list", "--json", "--url", url, "--reactor", "r1"));
        Assert.Equal(ExitCodes.Ok, listed);
        Assert.Contains("\"outcome\":\"unsupported\"", list, StringComparison.Ordinal);

        var (refused, _, why) = await Task.Run(() => CliRunner.Run("sample", "add", "--url", url, "--reactor", "r1", "--kind", "dcw", "--sampled-at", "yesterday", "--value-g-per-l", "4"));
        Assert.Equal(ExitCodes.BadInput, refused);
        Assert.Contains("sampledAt is 'yesterday' (expected ISO 8601", why, StringComparison.Ordinal);
        Assert.Contains("sigmaGPerL is missing", why, StringComparison.Ordinal);
    }

    [Fact]
    public async Task SampleCommand_over_mqtt_refused_answers_every_problem_on_the_result_topic_and_counts_it()
    {
        await using var daemon = await TestDaemon.StartAsync(TestConfigs.HandCase(broker.Port, "samplemqtt"));
        await using var client = await TestMqttClient.ConnectAsync(broker.Port, "samplemqtt-test");
        string topic = "softsensor/pilot/samplemqtt/r1/command/sample";
        await client.SubscribeAsync(topic + "/result");
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(10);
        while (!daemon.Get<Daemon.Mqtt.MqttLink>().IsSubscribed(topic))
        {
            Assert.True(DateTime.UtcNow < until, "sample command topic not subscribed");
            await Task.Delay(20);
        }

        await client.PublishAsync(topic, """{"kind":"od","sampledAt":"2026-03-01T10:00:00Z","od":-2,"odSigma":0.1,"factorGPerLPerOd":0.38}""");
        var (_, reply) = await client.WaitForAsync((t, _) => t == topic + "/result", TimeSpan.FromSeconds(5), "refusal");
        using var doc = JsonDocument.Parse(reply);
        Assert.False(doc.RootElement.GetProperty("accepted").GetBoolean());
        var problems = doc.RootElement.GetProperty("problems").EnumerateArray().Select(p => p.GetString()).ToList();
        Assert.Contains("od is -2 (expected 0 or more OD units)", problems);
        Assert.Contains("factorSigmaGPerLPerOd is missing (expected 0 or more g/L per OD unit)", problems);
        Assert.Empty(daemon.Get<SampleBook>().List("r1"));
        Assert.Contains("softsensor_operator_inputs_rejected_total{reactor=\"r1\"}", daemon.Get<Daemon.Status.PrometheusExporter>().Render(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task SampleForm_post_stores_a_substrate_assay_and_the_page_lists_it_as_recorded()
    {
        await using var daemon = await TestDaemon.StartAsync(TestConfigs.HandCase(broker.Port, "sampleform"));
        using var http = TestAccess.OperatorClient(daemon.StatusAddress);
        Assert.Contains("Offline samples and removals", await http.GetStringAsync(new Uri("/samples", UriKind.Relative)), StringComparison.Ordinal);

        using var bad = new FormUrlEncodedContent(new Dictionary<string, string> { ["kind"] = "substrate", ["sampledAt"] = "2026-03-01T10:00:00Z", ["valueGPerL"] = "2,1" });
        string refused = await (await http.PostAsync(new Uri("/samples/r1", UriKind.Relative), bad)).Content.ReadAsStringAsync();
        Assert.Contains("valueGPerL is &#39;2,1&#39; (expected a number with a decimal point)", refused, StringComparison.Ordinal);

        string at = DateTimeOffset.UtcNow.AddMinutes(-30).ToString("yyyy-MM-ddTHH:mm:ssZ", System.Globalization.CultureInfo.InvariantCulture);
        using var good = new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["kind"] = "substrate", ["sampledAt"] = at, ["valueGPerL"] = "2.1", ["sigmaGPerL"] = "0.1", ["analyte"] = "glycerol", ["od"] = "",
        });
        string page = await (await http.PostAsync(new Uri("/samples/r1", UriKind.Relative), good)).Content.ReadAsStringAsync();
        Assert.Contains(": recorded.", page, StringComparison.Ordinal);
        Assert.Contains("<td>glycerol</td>", page, StringComparison.Ordinal);
        var stored = Assert.Single(daemon.Get<SampleBook>().List("r1"));
        Assert.Equal(("substrate", 2.1, SampleOutcomes.Recorded), (stored.Kind, stored.ValueGPerL!.Value, stored.Outcome));
    }
}
