namespace SoftSensor.Daemon.Configuration;

/// <summary>
/// The daemon's configuration (bound from the configuration's root). The shape is the project's own and is
/// documented in the README ("Running the daemon"): a plant hierarchy (site, area), the reactors with
/// their tag maps, and one section per adapter.
/// </summary>
internal sealed class SoftSensorOptions
{
    /// <summary>Site name: first level of the MQTT topic hierarchy (lowercase, no '/', '+' or '#').</summary>
    public string Site { get; set; } = "";

    /// <summary>Area (building, suite, line) inside the site: second level of the hierarchy.</summary>
    public string Area { get; set; } = "";

    /// <summary>What the tags of every reactor share unless the reactor or the tag says otherwise.</summary>
    public TagDefaults Defaults { get; set; } = new();

    /// <summary>The reactors this daemon serves, one pipeline each.</summary>
    public List<ReactorOptions> Reactors { get; set; } = [];

    /// <summary>The MQTT broker link.</summary>
    public MqttOptions Mqtt { get; set; } = new();

    /// <summary>The embedded store.</summary>
    public StoreOptions Store { get; set; } = new();

    /// <summary>The status page.</summary>
    public StatusOptions Status { get; set; } = new();

    /// <summary>The OPC UA server (section <c>opcUa</c>; the adapter binds it too), checked here against the tags that use it.</summary>
    public OpcUaOptions OpcUa { get; set; } = new();

    /// <summary>Who may use the status server (section <c>access</c>, docs/security.md).</summary>
    public AccessOptions Access { get; set; } = new();
}

/// <summary>Section <c>store</c>: the embedded SQLite store.</summary>
internal sealed class StoreOptions
{
    /// <summary>Path of the SQLite file (created with its folder when missing).</summary>
    public string Path { get; set; } = "data/softsensor.db";

    /// <summary>A state checkpoint is written every this many cycles (and on stop).</summary>
    public int CheckpointEveryCycles { get; set; } = 10;

    /// <summary>
    /// How long frames, their estimates and unsent outbox rows are kept (older ones are deleted in small
    /// batches off the cycle path). Default 365 days: about 3 GB per reactor at a 10 s cycle (docs/store.md).
    /// </summary>
    public TimeSpan Retention { get; set; } = TimeSpan.FromDays(365);

    /// <summary>Checkpoints kept per reactor (the newest; a resume needs one, the others cover a torn last write).</summary>
    public int CheckpointsKept { get; set; } = 3;

    /// <summary>Below this much free space on the store's disk the daemon raises <c>disk_low</c> and deletes the oldest data first, keeping the newest.</summary>
    public double MinFreeDiskMegabytes { get; set; } = 1024;

    /// <summary>Seconds (real time) between two maintenance passes: retention, checkpoint pruning, incremental vacuum, disk check.</summary>
    public double MaintenanceIntervalSeconds { get; set; } = 60;
}

/// <summary>Section <c>status</c>: the status page and metrics endpoint.</summary>
internal sealed class StatusOptions
{
    /// <summary>Listen URL; loopback by default. Port 0 picks a free port.</summary>
    public string Url { get; set; } = "http://127.0.0.1:8470";

    /// <summary>Hours of trend shown on the status page.</summary>
    public double TrendHours { get; set; } = 12;
}
