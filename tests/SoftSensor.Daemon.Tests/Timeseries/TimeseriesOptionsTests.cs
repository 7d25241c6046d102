using SoftSensor.Daemon.Timeseries;

namespace SoftSensor.Daemon.Tests.Timeseries;

public class TimeseriesOptionsTests
{
    [Fact]
    public void Validate_EveryBadValue_ListedInOneMessage()
    {
        var o = new TimeseriesOptions { Url = "ftp://x", Org = "", BatchSize = 0, MaxOutboxMegabytes = 0, WarnAtPercent = 100, RetryInitialSeconds = 5, RetryMaxSeconds = 1 };
        var r = new TimeseriesOptionsValidator().Validate(null, o);
        Assert.True(r.Failed);
        Assert.Equal(
        [
            "timeseries:url is 'ftp://x', expected an absolute http:// or https:// URL",
            "timeseries:org is empty, expected the InfluxDB organisation",
            "timeseries:batchSize is 0, expected 1 to 100000",
            "timeseries:maxOutboxMegabytes is 0, expected above 0 and below 1000000",
            "timeseries:warnAtPercent is 100, expected above 0 and below 100",
            "timeseries:retryMaxSeconds is 1, expected at least retryInitialSeconds (5) and at most 86400",
        ], r.Failures);
    }

    [Fact]
    public void Validate_NoUrl_IsTheSinkOffAndValid()
    {
        Assert.True(new TimeseriesOptionsValidator().Validate(null, new TimeseriesOptions { BatchSize = -1 }).Succeeded);
    }

    [Fact]
    public void ResolveToken_EmptyInConfiguration_ComesFromTheEnvironment_AndNeverShows()
    {
        var o = new TimeseriesOptions { Url = "http://127.0.0.1:8086" };
        Assert.Equal("s3cret", o.ResolveToken(n => n == TimeseriesOptions.TokenEnvironmentVariable ? "s3cret" : null));
        o.Token = "from-config";
        Assert.Equal("from-config", o.ResolveToken(_ => "s3cret"));
        Assert.DoesNotContain("from-config", o.ToString(), StringComparison.Ordinal);
    }
}
