using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace SoftSensor.LoadTest;

/// <summary>
/// The daemon configuration of one load step: N copies of the demo reactor (config/demo.json, full
/// estimator, invented demo scenario), each with 19 tags (every signal role there is) and its cycle run
/// by the arrival of its trigger tag, the last of each reactor's burst of 20 tags per second.
/// </summary>
internal static class LoadConfig
{
    public const string Site = "load";
    public const string Area = "hall";

    /// <summary>The tag whose arrival runs the cycle; published last in each burst.</summary>
    public const string TriggerTag = "R1.AIR.FLOW";

    /// <summary>Tags added to the demo's 13 so that every role is mapped (constant values, see <see cref="LoadPublisher"/>).</summary>
    public static readonly (string Tag, string Role, string Unit)[] ExtraTags =
    [
        ("R1.N2.FLOW", "NitrogenFlowNlPerMin", "NL/min"),
        ("R1.CO2.FLOW", "CarbonDioxideFlowNlPerMin", "NL/min"),
        ("R1.ANALYSER.TEMP", "AnalyserTemperatureC", "°C"),
        ("R1.ANALYSER.CAL", "AnalyserCalibrating", "1"),
        ("R1.REMOVED", "RemovedVolumeL", "L"),
        ("R1.WEIGHT.KG", "WeightKg", "kg"),
    ];

    /// <summary>The 20th tag of each burst: published, but on no topic the daemon maps (a plant signal it does not use).</summary>
    public const string SpareTag = "R1.SPARE";

    public static string ReactorId(int i) => "r" + i.ToString("D4", CultureInfo.InvariantCulture);

    public static string Topic(int i, string tag) => $"load/{ReactorId(i)}/{tag.ToLowerInvariant()}";

    public static string EstimateFilter => $"softsensor/{Site}/{Area}/+/estimate/our";

    /// <summary>Writes the configuration file; returns the demo reactor's tag names in burst order (trigger last, spare excluded).</summary>
    public static IReadOnlyList<string> Write(string path, string demoConfig, int reactors, int brokerPort, int statusPort, string storePath)
    {
        var demo = JsonNode.Parse(File.ReadAllText(demoConfig))!.AsObject();
        var template = demo["reactors"]![0]!.AsObject();
        string modelFile = Path.Combine(Path.GetDirectoryName(Path.GetFullPath(demoConfig))!, template["modelFile"]!.GetValue<string>());
        var tagNames = template["tags"]!.AsObject().Select(kv => kv.Key).Concat(ExtraTags.Select(t => t.Tag)).ToList();
        tagNames.Remove(TriggerTag);
        tagNames.Add(TriggerTag);

        var list = new JsonArray();
        for (int i = 0; i < reactors; i++)
        {
            var r = template.DeepClone().AsObject();
            r["id"] = ReactorId(i);
            r["batchId"] = "load";
            r["modelFile"] = modelFile;
            r["cyclePeriod"] = "00:00:05"; // the fallback when the trigger stays away; every second the trigger comes first
            r["cycleTrigger"] = TriggerTag;
            var tags = r["tags"]!.AsObject();
            foreach (var (tag, role, unit) in ExtraTags)
            {
                tags[tag] = new JsonObject { ["role"] = role, ["unit"] = unit, ["maxAge"] = "00:01:00" };
            }

            foreach (var (tag, node) in tags)
            {
                node!["topic"] = Topic(i, tag);
                node.AsObject().Remove("deadTime"); // no analyser delay: every cycle uses the burst that triggered it
            }

            list.Add(r);
        }

        var config = new JsonObject
        {
            ["site"] = Site,
            ["area"] = Area,
            ["reactors"] = list,
            ["mqtt"] = new JsonObject { ["host"] = "127.0.0.1", ["port"] = brokerPort, ["clientId"] = "softsensor-load", ["topicPrefix"] = "softsensor" },
            ["store"] = new JsonObject { ["path"] = storePath, ["checkpointEveryCycles"] = 60 },
            ["status"] = new JsonObject { ["url"] = $"http://127.0.0.1:{statusPort}" },
            ["Logging"] = new JsonObject { ["LogLevel"] = new JsonObject { ["Default"] = "Warning" } },
        };
        File.WriteAllText(path, config.ToJsonString(new JsonSerializerOptions { WriteIndented = false }));
        return tagNames;
    }
}
