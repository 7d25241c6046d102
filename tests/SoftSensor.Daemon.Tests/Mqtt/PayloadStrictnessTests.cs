using System.Buffers;
using System.Text;
using CsCheck;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Mqtt;

namespace SoftSensor.Daemon.Tests.Mqtt;

/// <summary>
/// What a numeric tag refuses, and why (the reason is the metric's label). The rules are RFC 8259's
/// (§2: a JSON text is one value; §4: names SHOULD be unique) and the project's own (a boolean is not
/// a flow; a source timestamp far from the daemon's clock is not a reading of now).
/// </summary>
public sealed class PayloadStrictnessTests
{
    private static readonly DateTimeOffset Now = new(2026, 12, 2, 12, 0, 0, TimeSpan.Zero);
    private static readonly TimestampWindow Window = new(Now, TimeSpan.FromDays(1), TimeSpan.FromMinutes(5));

    /// <summary>10⁵ cases by default (the issue's minimum); SOFTSENSOR_FUZZ_CASES sets more.</summary>
    private static readonly long Cases = long.TryParse(Environment.GetEnvironmentVariable("SOFTSENSOR_FUZZ_CASES"), out long n) && n > 100_000 ? n : 100_000;

    private static ReadOnlySequence<byte> Bytes(string s) => new(Encoding.UTF8.GetBytes(s));

    [Theory]
    [InlineData("""{"value": true}""", "Boolean")]
    [InlineData("""{"value": false}""", "Boolean")]
    [InlineData("""{"value": "high"}""", "NotANumber")]
    [InlineData("""{"value": null}""", "NotANumber")]
    [InlineData("""{"value": [1]}""", "NotANumber")]
    [InlineData("""{"value": 1} garbage""", "TrailingData")]
    [InlineData("""{"value": 1}{"value": 2}""", "TrailingData")]
    [InlineData("""{"value": 1, "value": 50}""", "DuplicateKey")]
    [InlineData("""{"value": 1, "meta": {"a": 1, "a": 2}}""", "DuplicateKey")]
    [InlineData("""{"value": 1, "timestamp": "0001-01-01T00:00:00Z"}""", "TimestampOutsideWindow")]
    [InlineData("""{"value": 1, "timestamp": "1971-01-01T00:00:00Z"}""", "TimestampOutsideWindow")]
    [InlineData("""{"value": 1, "timestamp": "2100-01-01T00:00:00Z"}""", "TimestampOutsideWindow")]
    [InlineData("""{"value": 1, "timestamp": "9999-12-31T23:59:59Z"}""", "TimestampOutsideWindow")]
    [InlineData("""{"value": 1, "timestamp": 1000}""", "TimestampOutsideWindow")]
    [InlineData("""{"value": 1, "timestamp": "yesterday"}""", "BadTimestamp")]
    [InlineData("""{"value": 1, "statusCode": "0"}""", "BadStatusCode")]
    [InlineData("""{"value": 1, "quality": "fine"}""", "BadQuality")]
    [InlineData("""{"v": 1}""", "NoValue")]
    [InlineData("""{"value": 1""", "NotJson")]
    [InlineData("", "Empty")]
    public void A_numeric_tag_refuses_the_payload_with_its_reason(string payload, string expected)
    {
        bool ok = PayloadDecoder.TryDecode(Bytes(payload), new PayloadOptions(), Window, out _, out string error, out var reason);
        Assert.False(ok);
        Assert.Equal(expected, reason.ToString());
        Assert.NotEmpty(error);
    }

    [Theory]
    [InlineData("""{"value": 19.5}""", 19.5)]
    [InlineData("""{"value": "19.5"}""", 19.5)]
    [InlineData("""{"value": 19.5, "timestamp": "2026-12-02T11:00:00Z"}  """, 19.5)]
    [InlineData("""{"value": 2, "timestamp": "2026-12-02T12:04:00Z"}""", 2)]
    public void A_numeric_tag_accepts_a_number_a_numeric_string_and_a_stamp_inside_the_window(string payload, double expected)
    {
        Assert.True(PayloadDecoder.TryDecode(Bytes(payload), new PayloadOptions(), Window, out var r, out string error, out var reason), error);
        Assert.Equal(PayloadRejection.None, reason);
        Assert.Equal(expected, r.Value);
    }

    [Fact]
    public void A_payload_above_64_KiB_is_refused_by_size()
    {
        var big = Bytes("{\"value\": 1, \"pad\": \"" + new string('x', 70_000) + "\"}");
        Assert.False(PayloadDecoder.TryDecode(big, new PayloadOptions(), Window, out _, out string error, out var reason));
        Assert.Equal(PayloadRejection.TooLarge, reason);
        Assert.DoesNotContain("xxxx", error, StringComparison.Ordinal);
    }

    private static readonly string[] Pieces =
    [
        "{", "}", "[", "]", ",", ":", "\"value\"", "\"value\":", "\"timestamp\":", "\"quality\":", "\"statusCode\":", "\"d\"", "1", "-0.5", "1e308", "1e999",
        "true", "false", "null", "\"12\"", "\"x\"", "\"2026-12-02T11:59:00Z\"", "\"0001-01-01T00:00:00Z\"", "\"9999-12-31T23:59:59Z\"", "1764676800000", "NaN",
        " ", "\n", "\\", "\"", "\u00e9", "\uffff", "\ud800", "4294967296", "\"good\"", "\"bad\"",
    ];

    /// <summary>Payloads made of JSON-ish pieces around a valid core, and raw bytes: every kind of refusal turns up.</summary>
    private static readonly Gen<byte[]> Payloads = Gen.OneOf(
        Gen.Byte.Array[0, 64],
        Gen.Int[0, Pieces.Length - 1].Array[0, 12].Select(ix => Encoding.UTF8.GetBytes(string.Concat(ix.Select(i => Pieces[i])))),
        Gen.Select(Gen.Int[0, Pieces.Length - 1].Array[0, 3], Gen.Int[0, Pieces.Length - 1].Array[0, 3], Gen.Int[0, 5],
            (a, b, shape) => Encoding.UTF8.GetBytes(shape switch
            {
                0 => "{\"value\": " + string.Concat(a.Select(i => Pieces[i])) + "}",
                1 => "{\"value\": 1, \"timestamp\": " + string.Concat(a.Select(i => Pieces[i])) + "}",
                2 => "{\"value\": 1}" + string.Concat(a.Select(i => Pieces[i])),
                3 => "{\"value\": 1, " + string.Concat(a.Select(i => Pieces[i])) + "\"value\": 2}",
                4 => "{\"value\": " + string.Concat(a.Select(i => Pieces[i])) + ", \"quality\": " + string.Concat(b.Select(i => Pieces[i])) + "}",
                _ => "{\"value\": 1, \"statusCode\": " + string.Concat(b.Select(i => Pieces[i])) + "}",
            })));

    [Fact]
    public void Fuzz_the_decoder_never_throws_and_counts_every_refusal_by_reason()
    {
        var counts = new System.Collections.Concurrent.ConcurrentDictionary<PayloadRejection, long>();
        long cases = 0, accepted = 0;
        var layouts = new[] { new PayloadOptions(), new PayloadOptions { Format = PayloadFormat.Number } };
        Payloads.Sample(bytes =>
        {
            Interlocked.Increment(ref cases);
            var layout = layouts[bytes.Length % 2 == 0 || bytes.Length == 0 ? 0 : 1];
            bool ok = PayloadDecoder.TryDecode(new ReadOnlySequence<byte>(bytes), layout, Window, out var r, out string error, out var reason);
            if (ok)
            {
                Interlocked.Increment(ref accepted);
                Assert.Equal(PayloadRejection.None, reason);
                Assert.True(double.IsFinite(r.Value));
                Assert.True(r.SourceTime is null || Window.Contains(r.SourceTime.Value));
            }
            else
            {
                Assert.NotEqual(PayloadRejection.None, reason);
                Assert.False(string.IsNullOrEmpty(error));
                Assert.NotEmpty(PayloadRejections.Id(reason));
                counts.AddOrUpdate(reason, 1, (_, c) => c + 1);
            }
        }, iter: Cases, threads: 1);

        Assert.True(cases >= 100_000, $"only {cases} cases ran");
        Assert.Equal(cases - accepted, counts.Values.Sum());
        foreach (var must in new[] { PayloadRejection.Boolean, PayloadRejection.NotANumber, PayloadRejection.TrailingData, PayloadRejection.DuplicateKey,
            PayloadRejection.TimestampOutsideWindow, PayloadRejection.NotJson, PayloadRejection.Empty })
        {
            Assert.True(counts.GetValueOrDefault(must) > 0, $"no case was refused as {must}: {string.Join(", ", counts.Select(kv => $"{kv.Key} {kv.Value}"))}");
        }

        Assert.True(accepted > 0, "no case was accepted");
    }
}
