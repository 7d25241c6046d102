using System.Buffers;
using System.Text;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Mqtt;

namespace SoftSensor.Daemon.Tests.Mqtt;

public class PayloadDecoderTests
{
    private static ReadOnlySequence<byte> Bytes(string s) => new(Encoding.UTF8.GetBytes(s));

    [Fact]
    public void TryDecode_default_json_layout_reads_value_time_quality_and_code()
    {
        bool ok = PayloadDecoder.TryDecode(Bytes("""{"value": 19.5, "timestamp": "2026-12-01T10:00:00Z", "quality": "uncertain", "statusCode": 1083310080}"""), new PayloadOptions(), out var r, out var error);

        Assert.True(ok, error);
        Assert.Equal(19.5, r.Value);
        Assert.Equal(new DateTimeOffset(2026, 12, 1, 10, 0, 0, TimeSpan.Zero), r.SourceTime);
        Assert.Equal(SampleQuality.Uncertain, r.Quality);
        Assert.Equal(0x40920000u, r.StatusCode);
    }

    [Theory]
    // ISO 8601-1:2019 date-time forms (from memory): Z, a time shift, fractions, and no shift (read as UTC, not as the machine's local time: our rule).
    [InlineData("2026-12-01T10:00:00Z", "2026-12-01T10:00:00+00:00")]
    [InlineData("2026-12-01T11:30:00+01:30", "2026-12-01T10:00:00+00:00")]
    [InlineData("2026-12-01T05:00:00.250-05:00", "2026-12-01T10:00:00.250+00:00")]
    [InlineData("2026-12-01T10:00:00", "2026-12-01T10:00:00+00:00")]
    [InlineData("2026-12-01 10:00:00Z", "2026-12-01T10:00:00+00:00")]
    public void TryDecode_iso_timestamps_are_read_as_utc_instants(string stamp, string expected)
    {
        bool ok = PayloadDecoder.TryDecode(Bytes($$"""{"value": 1, "timestamp": "{{stamp}}"}"""), new PayloadOptions(), out var r, out var error);

        Assert.True(ok, error);
        Assert.Equal(DateTimeOffset.Parse(expected, System.Globalization.CultureInfo.InvariantCulture), r.SourceTime);
        Assert.Equal(TimeSpan.Zero, r.SourceTime!.Value.Offset);
    }

    [Fact]
    public void TryDecode_nested_paths_and_unix_milliseconds_are_read()
    {
        var layout = new PayloadOptions { ValuePath = "d.v", TimestampPath = "d.t", QualityPath = "d.ok", StatusCodePath = "" };
        bool ok = PayloadDecoder.TryDecode(Bytes("""{"d": {"v": 10, "t": 1764583200000, "ok": false}}"""), layout, out var r, out var error);

        Assert.True(ok, error);
        Assert.Equal(10, r.Value);
        Assert.Equal(DateTimeOffset.FromUnixTimeMilliseconds(1764583200000), r.SourceTime);
        Assert.Equal(SampleQuality.Bad, r.Quality);
        Assert.Equal(0x80000000u, r.StatusCode);
    }

    [Fact]
    public void TryDecode_bad_status_code_makes_quality_bad_by_its_severity_bits()
    {
        // OPC UA Part 4 §7.39: the top two bits 10 mean Bad (0x80310000 BadNoCommunication).
        bool ok = PayloadDecoder.TryDecode(Bytes("""{"value": 1, "statusCode": 2150694912}"""), new PayloadOptions(), out var r, out _);
        Assert.True(ok);
        Assert.Equal(SampleQuality.Bad, r.Quality);
        Assert.Equal(0x80310000u, r.StatusCode);
    }

    [Fact]
    public void TryDecode_plain_number_without_timestamp_is_good()
    {
        bool ok = PayloadDecoder.TryDecode(Bytes(" 20.946\n"), new PayloadOptions { Format = PayloadFormat.Number }, out var r, out _);
        Assert.True(ok);
        Assert.Equal(20.946, r.Value);
        Assert.Null(r.SourceTime);
        Assert.Equal(SampleQuality.Good, r.Quality);
    }

    [Theory]
    [InlineData("json", "{\"value\": \"abc\"}", "value at 'value' is \"abc\" (expected a finite number)")]
    [InlineData("json", "{\"v\": 1}", "no value at 'value'")]
    [InlineData("json", "{\"value\": 1, \"timestamp\": \"yesterday\"}", "timestamp at 'timestamp' is \"yesterday\" (expected ISO 8601 text or Unix milliseconds)")]
    [InlineData("json", "{\"value\": 1, \"quality\": \"fine\"}", "quality at 'quality' is \"fine\" (expected good, uncertain, bad or a boolean)")]
    [InlineData("number", "NaN", "'NaN' is not a finite number")]
    [InlineData("number", "", "empty payload")]
    public void TryDecode_malformed_payload_fails_with_reason(string format, string payload, string expected)
    {
        bool ok = PayloadDecoder.TryDecode(Bytes(payload), new PayloadOptions { Format = Enum.Parse<PayloadFormat>(format, ignoreCase: true) }, out _, out var error);
        Assert.False(ok);
        Assert.Equal(expected, error);
    }

    [Fact]
    public void TryDecode_not_json_fails_and_names_it()
    {
        bool ok = PayloadDecoder.TryDecode(Bytes("{value: 1"), new PayloadOptions(), out _, out var error);
        Assert.False(ok);
        Assert.StartsWith("not JSON: ", error, StringComparison.Ordinal);
    }
}
