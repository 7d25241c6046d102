using System.Buffers;
using System.Text;
using Microsoft.Extensions.Configuration;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Cli;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Mqtt;
using SoftSensor.Daemon.Tests.Fixtures;

namespace SoftSensor.Daemon.Tests.Batches;

/// <summary>The batch keys (reactors:N:batches, the BatchId and BatchPhaseCode tags): validation names each key; text payloads; check prints them.</summary>
public class BatchConfigurationTests
{
    private static SoftSensorOptions Bind(Dictionary<string, string?> keys)
    {
        var o = new SoftSensorOptions();
        new ConfigurationBuilder().AddInMemoryCollection(keys).Build().Bind(o);
        return o;
    }

    private static Dictionary<string, string?> WithBatchTags()
    {
        var keys = TestConfigs.HandCase(1883, "t");
        keys["reactors:0:tags:bid:role"] = "BatchId";
        keys["reactors:0:tags:bid:unit"] = "id";
        keys["reactors:0:tags:bid:topic"] = "plant/t/r1/batch";
        keys["reactors:0:tags:ph:role"] = "BatchPhaseCode";
        keys["reactors:0:tags:ph:unit"] = "code";
        keys["reactors:0:tags:ph:topic"] = "plant/t/r1/phase";
        keys["reactors:0:tags:feed:role"] = "FeedRateLPerH";
        keys["reactors:0:tags:feed:topic"] = "plant/t/r1/feed";
        keys["reactors:0:batches:phaseCodes:1"] = "batch";
        keys["reactors:0:batches:phaseCodes:2"] = "fed-batch";
        keys["reactors:0:batches:fedBatchFeedAboveLPerH"] = "0.05";
        return keys;
    }

    [Fact]
    public void Validate_batch_tags_with_codes_and_feed_detection_succeeds()
    {
        var result = new SoftSensorOptionsValidator().Validate(null, Bind(WithBatchTags()));
        Assert.True(result.Succeeded, result.FailureMessage);
    }

    [Fact]
    public void Validate_bad_batch_keys_lists_every_problem_naming_the_key()
    {
        var keys = WithBatchTags();
        keys["reactors:0:batches:phaseCodes:x"] = "harvest";
        keys["reactors:0:batches:phaseCodes:3"] = "stationary";
        keys["reactors:0:batches:fedBatchFeedAboveLPerH"] = "-1";
        keys["reactors:0:batches:fedBatchHold"] = "2.00:00:00";
        keys["reactors:0:tags:ph:scale"] = "10";
        var failures = new SoftSensorOptionsValidator().Validate(null, Bind(keys)).Failures!.ToList();

        Assert.Contains("reactors:0:batches:fedBatchFeedAboveLPerH is -1 (expected a feed rate of 0 or more L/h, or leave it out)", failures);
        Assert.Contains("reactors:0:batches:fedBatchHold is 2.00:00:00 (expected between 00:00:00 and 1.00:00:00)", failures);
        Assert.Contains("reactors:0:batches:phaseCodes:x is a code 'x' (expected an integer code as the controller sends it)", failures);
        Assert.Contains("reactors:0:batches:phaseCodes:3 is 'stationary' (expected one of batch, fed-batch, induced, harvest)", failures);
        Assert.Contains("reactors:0:tags:ph:scale/offset are 10/0 (expected 1/0: role BatchPhaseCode is an id or a code, not a measurement)", failures);
    }

    [Fact]
    public void Validate_phase_tag_without_codes_and_feed_detection_without_feed_tag_are_refused()
    {
        var keys = WithBatchTags();
        foreach (var k in keys.Keys.Where(k => k.StartsWith("reactors:0:batches:phaseCodes", StringComparison.Ordinal) || k.StartsWith("reactors:0:tags:feed", StringComparison.Ordinal)).ToList())
        {
            keys.Remove(k);
        }

        var failures = new SoftSensorOptionsValidator().Validate(null, Bind(keys)).Failures!.ToList();
        Assert.Contains("reactors:0:batches:phaseCodes is empty (expected code → phase pairs for the tag with role BatchPhaseCode, e.g. \"2\": \"fed-batch\")", failures);
        Assert.Contains("reactors:0:batches:fedBatchFeedAboveLPerH is 0.05 (expected a tag with role FeedRateLPerH to detect the feed from)", failures);
    }

    [Theory]
    [InlineData("""{"value": "GLY-1042", "timestamp": "2026-12-01T10:00:00Z"}""", "json", "GLY-1042")]
    [InlineData("""{"value": 1043}""", "json", "1043")]
    [InlineData("  B 7 ", "number", "B 7")]
    public void TryDecode_text_tag_keeps_a_string_or_a_number_as_text(string payload, string format, string expected)
    {
        bool ok = PayloadDecoder.TryDecode(new ReadOnlySequence<byte>(Encoding.UTF8.GetBytes(payload)), new PayloadOptions { Format = Enum.Parse<PayloadFormat>(format, ignoreCase: true) }, out var r, out var error, text: true);
        Assert.True(ok, error);
        Assert.Equal(expected, r.Text);
        Assert.Equal(SampleQuality.Good, r.Quality);
    }

    [Fact]
    public void TryDecode_text_tag_refuses_an_object_or_a_too_long_id_naming_the_path()
    {
        Assert.False(PayloadDecoder.TryDecode(new ReadOnlySequence<byte>("""{"value": {"id": 1}}"""u8.ToArray()), new PayloadOptions(), out _, out var e1, text: true));
        Assert.Equal("value at 'value' is {\"id\": 1} (expected a string or a number)", e1);
        string longId = new('x', 65);
        Assert.False(PayloadDecoder.TryDecode(new ReadOnlySequence<byte>(Encoding.UTF8.GetBytes($"{{\"value\": \"{longId}\"}}")), new PayloadOptions(), out _, out var e2, text: true));
        Assert.StartsWith("value at 'value' is 'xxxx", e2, StringComparison.Ordinal);
        Assert.EndsWith("(expected 1 to 64 printable characters)", e2, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Check_prints_the_batch_tags_codes_and_feed_detection()
    {
        string dir = Directory.CreateTempSubdirectory("softsensor-batchcheck-").FullName;
        try
        {
            var keys = WithBatchTags();
            var root = new System.Text.Json.Nodes.JsonObject();
            foreach (var (key, value) in keys)
            {
                var node = root;
                var parts = key.Split(':');
                for (int i = 0; i < parts.Length - 1; i++)
                {
                    node = (System.Text.Json.Nodes.JsonObject)(node[parts[i]] ??= new System.Text.Json.Nodes.JsonObject());
                }

                node[parts[^1]] = value;
            }

            // gas:liquidVolumeL is not needed: li301 is the volume tag of the hand case.
            string file = Path.Combine(dir, "softsensor.json");
            await File.WriteAllTextAsync(file, root.ToJsonString());
            using var output = new StringWriter();
            using var error = new StringWriter();
            var settings = new Hosting.DaemonHostSettings { ConfigFile = file, SystemFolder = Path.Combine(dir, "no-system-folder") };
            int code = CheckVerb.Run(settings, false, output, error);
            string stdout = output.ToString(), stderr = error.ToString();
            Assert.True(code == ExitCodes.Ok, stdout + stderr);
            Assert.Contains("batches: batch-id tag bid, phase tag ph, fed-batch detection feed above 0.05 L/h for 00:05:00", stdout, StringComparison.Ordinal);
            Assert.Contains("phase codes: 1 = batch, 2 = fed-batch", stdout, StringComparison.Ordinal);
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }
}
