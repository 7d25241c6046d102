namespace SoftSensor.Daemon.Tests.Fixtures;

/// <summary>Configurations used by the tests, as flat configuration keys.</summary>
internal static class TestConfigs
{
    /// <summary>
    /// Reactor r1 with the tags of the hand-worked off-gas case of docs/methods.md §6: an air MFC
    /// at 0 °C/101.325 kPa, a dry analyser, a fixed inlet 20.946/0.042 %, the volume as a tag.
    /// </summary>
    public static Dictionary<string, string?> HandCase(int brokerPort, string clientId, TimeSpan? maxAge = null, string cyclePeriod = "00:00:00.2")
    {
        string age = (maxAge ?? TimeSpan.FromSeconds(30)).ToString();
        var c = new Dictionary<string, string?>(StringComparer.OrdinalIgnoreCase)
        {
            ["site"] = "pilot",
            ["area"] = clientId,
            ["mqtt:host"] = "127.0.0.1",
            ["mqtt:port"] = brokerPort.ToString(System.Globalization.CultureInfo.InvariantCulture),
            ["mqtt:clientId"] = clientId,
            ["mqtt:topicPrefix"] = "softsensor",
            ["mqtt:pingInterval"] = "00:00:00.5",
            ["mqtt:reconnectMinDelay"] = "00:00:00.2",
            ["mqtt:reconnectMaxDelay"] = "00:00:01",
            ["reactors:0:id"] = "r1",
            ["reactors:0:batchId"] = "b-001",
            ["reactors:0:cyclePeriod"] = cyclePeriod,
            ["reactors:0:gas:inlet"] = "fixed",
            ["reactors:0:gas:inletO2Percent"] = "20.946",
            ["reactors:0:gas:inletCo2Percent"] = "0.042",
        };
        Tag(c, "fic101", "AirFlowNlPerMin", $"plant/{clientId}/r1/fic101", age);
        Tag(c, "qi201", "OutletO2Percent", $"plant/{clientId}/r1/qi201", age);
        Tag(c, "qi202", "OutletCo2Percent", $"plant/{clientId}/r1/qi202", age);
        Tag(c, "li301", "LiquidVolumeL", $"plant/{clientId}/r1/li301", age);
        return c;
    }

    /// <summary>The output topic subtree of a <see cref="HandCase"/> daemon (its area is the client id, so tests sharing a broker never see each other's retained estimates).</summary>
    public static string Subtree(string clientId) => $"softsensor/pilot/{clientId}";

    private static void Tag(Dictionary<string, string?> c, string tag, string role, string topic, string maxAge)
    {
        c[$"reactors:0:tags:{tag}:role"] = role;
        c[$"reactors:0:tags:{tag}:topic"] = topic;
        c[$"reactors:0:tags:{tag}:maxAge"] = maxAge;
    }
}
