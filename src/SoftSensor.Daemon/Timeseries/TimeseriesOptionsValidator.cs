using Microsoft.Extensions.Options;

namespace SoftSensor.Daemon.Timeseries;

/// <summary>Checks <see cref="TimeseriesOptions"/> at start; every problem in one message, each naming the key, the value and the expectation.</summary>
internal sealed class TimeseriesOptionsValidator : IValidateOptions<TimeseriesOptions>
{
    public ValidateOptionsResult Validate(string? name, TimeseriesOptions options)
    {
        var errors = Problems(options);
        return errors.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(errors);
    }

    /// <summary>The problems (empty when the options are usable or the sink is off).</summary>
    public static List<string> Problems(TimeseriesOptions o)
    {
        var errors = new List<string>();
        if (!o.Enabled)
        {
            return errors;
        }

        const string s = TimeseriesOptions.Section;
        if (!Uri.TryCreate(o.Url, UriKind.Absolute, out var uri) || (uri.Scheme != Uri.UriSchemeHttp && uri.Scheme != Uri.UriSchemeHttps))
        {
            errors.Add($"{s}:url is '{o.Url}', expected an absolute http:// or https:// URL");
        }

        Require(errors, !string.IsNullOrWhiteSpace(o.Org), $"{s}:org is empty, expected the InfluxDB organisation");
        Require(errors, !string.IsNullOrWhiteSpace(o.Bucket), $"{s}:bucket is empty, expected the InfluxDB bucket");
        Require(errors, !string.IsNullOrWhiteSpace(o.OutboxPath), $"{s}:outboxPath is empty, expected a SQLite file path");
        Require(errors, o.BatchSize is >= 1 and <= 100_000, $"{s}:batchSize is {o.BatchSize}, expected 1 to 100000");
        Require(errors, o.MaxOutboxMegabytes is > 0 and < 1_000_000, $"{s}:maxOutboxMegabytes is {o.MaxOutboxMegabytes}, expected above 0 and below 1000000");
        Require(errors, o.WarnAtPercent is > 0 and < 100, $"{s}:warnAtPercent is {o.WarnAtPercent}, expected above 0 and below 100");
        Require(errors, o.RetryInitialSeconds is > 0 and <= 3600, $"{s}:retryInitialSeconds is {o.RetryInitialSeconds}, expected above 0 and at most 3600");
        Require(errors, o.RetryMaxSeconds >= o.RetryInitialSeconds && o.RetryMaxSeconds <= 86400, $"{s}:retryMaxSeconds is {o.RetryMaxSeconds}, expected at least retryInitialSeconds ({o.RetryInitialSeconds}) and at most 86400");
        Require(errors, o.TimeoutSeconds is > 0 and <= 600, $"{s}:timeoutSeconds is {o.TimeoutSeconds}, expected above 0 and at most 600");
        Require(errors, o.IdlePollSeconds is > 0 and <= 3600, $"{s}:idlePollSeconds is {o.IdlePollSeconds}, expected above 0 and at most 3600");
        Require(errors, o.ShutdownFlushSeconds is >= 0 and <= 600, $"{s}:shutdownFlushSeconds is {o.ShutdownFlushSeconds}, expected 0 to 600");
        return errors;
    }

    private static void Require(List<string> errors, bool ok, string message)
    {
        if (!ok)
        {
            errors.Add(message);
        }
    }
}
