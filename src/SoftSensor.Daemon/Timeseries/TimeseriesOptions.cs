namespace SoftSensor.Daemon.Timeseries;

/// <summary>
/// Configuration section <c>timeseries</c>: where estimates go (an InfluxDB v2 write API) and how
/// the durable outbox behaves. Empty <see cref="Url"/> turns the sink off. The token comes from
/// <see cref="Token"/> or, when that is empty, the environment variable
/// <see cref="TokenEnvironmentVariable"/>; it is never logged and never shown by ToString.
/// </summary>
internal sealed class TimeseriesOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "timeseries";

    /// <summary>The environment variable that holds the API token.</summary>
    public const string TokenEnvironmentVariable = "SOFTSENSOR_INFLUX_TOKEN";

    /// <summary>Base URL of the database, e.g. <c>http://127.0.0.1:8086</c>.</summary>
    public string Url { get; set; } = "";

    /// <summary>InfluxDB organisation.</summary>
    public string Org { get; set; } = "softsensor";

    /// <summary>InfluxDB bucket.</summary>
    public string Bucket { get; set; } = "softsensor";

    /// <summary>API token (prefer the environment variable).</summary>
    public string? Token { get; set; }

    /// <summary>The <c>site</c> tag of every point.</summary>
    public string Site { get; set; } = "pilot";

    /// <summary>Prefix of every measurement name.</summary>
    public string MeasurementPrefix { get; set; } = "softsensor_";

    /// <summary>SQLite file of the outbox (default: the daemon's store file, <c>store:path</c>); table <c>ts_outbox</c>.</summary>
    public string OutboxPath { get; set; } = "softsensor.db";

    /// <summary>Most frames sent in one write.</summary>
    public int BatchSize { get; set; } = 200;

    /// <summary>Upper bound of the unsent payload held on disk, MB; frames beyond it are refused and counted.</summary>
    public double MaxOutboxMegabytes { get; set; } = 256;

    /// <summary>Fill level (% of the bound) at which the outbox raises its alarm.</summary>
    public double WarnAtPercent { get; set; } = 80;

    /// <summary>First retry delay after a failed write, s (doubled per failure, with jitter).</summary>
    public double RetryInitialSeconds { get; set; } = 1;

    /// <summary>Longest retry delay, s.</summary>
    public double RetryMaxSeconds { get; set; } = 60;

    /// <summary>Timeout of one write, s.</summary>
    public double TimeoutSeconds { get; set; } = 10;

    /// <summary>How often an idle sender looks for new rows when nobody rang, s.</summary>
    public double IdlePollSeconds { get; set; } = 5;

    /// <summary>How long the sender keeps draining at shutdown, s.</summary>
    public double ShutdownFlushSeconds { get; set; } = 5;

    /// <summary>True when a database is configured.</summary>
    public bool Enabled => !string.IsNullOrWhiteSpace(Url);

    /// <summary>The bound in bytes.</summary>
    public long MaxOutboxBytes => (long)(MaxOutboxMegabytes * 1024 * 1024);

    /// <summary>The token from configuration or the environment (empty when neither is set).</summary>
    public string ResolveToken(Func<string, string?> environment) =>
        !string.IsNullOrEmpty(Token) ? Token : environment(TokenEnvironmentVariable) ?? "";

    /// <summary>Shows the settings without the token.</summary>
    public override string ToString() =>
        $"url={Url} org={Org} bucket={Bucket} token={(string.IsNullOrEmpty(Token) ? "(env)" : "(set)")} outbox={OutboxPath}";
}
