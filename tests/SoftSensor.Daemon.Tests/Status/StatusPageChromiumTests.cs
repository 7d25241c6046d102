using System.Globalization;
using System.Text.RegularExpressions;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.Daemon.Tests.Integration;

namespace SoftSensor.Daemon.Tests.Status;

/// <summary>The status page as a browser shows it: headless Chromium against a running daemon.</summary>
public sealed partial class StatusPageChromiumTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>
{
    [Fact]
    public async Task StatusPage_in_headless_chromium_shows_the_current_OUR()
    {
        await using var daemon = await TestDaemon.StartAsync(TestConfigs.HandCase(broker.Port, "it-page"));
        await using var client = await TestMqttClient.ConnectAsync(broker.Port, "it-page-client");
        await client.SubscribeAsync(TestConfigs.Subtree("it-page") + "/r1/estimate/our");
        await DaemonMqttTests.PublishHandCaseAsync(client, "it-page");
        await client.WaitForAsync((_, p) => DaemonMqttTests.IsGood(p), TimeSpan.FromSeconds(10), "a good OUR");

        string dom = await HeadlessChromium.DumpDomAsync(daemon.StatusAddress + "/");

        // The page formats values of 1 to 1000 with three decimals: the hand-worked OUR 38.629 mmol/(L·h) (docs/methods.md §6).
        var m = OurCell().Match(dom);
        Assert.True(m.Success, "no OUR cell in the page: " + dom[..Math.Min(dom.Length, 2000)]);
        Assert.Equal(38.629, double.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture), 0.0015);
        Assert.Contains("card-r1-our", dom, StringComparison.Ordinal);
        Assert.Contains("value q-good", dom, StringComparison.Ordinal);
        Assert.Contains("input-r1-fic101", dom, StringComparison.Ordinal);
        Assert.DoesNotContain("http://", dom.Replace(daemon.StatusAddress, "", StringComparison.Ordinal).Replace("http://www.w3.org/2000/svg", "", StringComparison.Ordinal), StringComparison.Ordinal);
    }

    [GeneratedRegex("id=\"est-r1-our\">([0-9.]+)<")]
    private static partial Regex OurCell();
}
