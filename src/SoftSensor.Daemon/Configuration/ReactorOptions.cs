namespace SoftSensor.Daemon.Configuration;

/// <summary>One reactor (section <c>reactors:N</c>): its own cycle, tag map, gas settings and model.</summary>
internal sealed class ReactorOptions
{
    /// <summary>Reactor id: a topic level and the store's key (lowercase letters, digits, '-', '_').</summary>
    public string Id { get; set; } = "";

    /// <summary>Batch id written with every estimate (free text; empty when unknown).</summary>
    public string BatchId { get; set; } = "";

    /// <summary>Cycle period, e.g. <c>00:00:10</c>.</summary>
    public TimeSpan CyclePeriod { get; set; } = TimeSpan.FromSeconds(10);

    /// <summary>
    /// A tag of the map whose arrival runs the cycle at once (e.g. the off-gas analyser's last
    /// channel of a reading); the cycle then also runs one <see cref="CyclePeriod"/> after the
    /// previous one when the tag stays away, so stale inputs still turn the estimates Bad. Empty:
    /// the cycle runs on the period only.
    /// </summary>
    public string CycleTrigger { get; set; } = "";

    /// <summary>Tag map: plant tag name → how to read it and what it means.</summary>
    public Dictionary<string, TagOptions> Tags { get; set; } = new(StringComparer.Ordinal);

    /// <summary>Gas balance settings.</summary>
    public GasOptions Gas { get; set; } = new();

    /// <summary>Process/organism model file (JSON) used by the full estimator; empty for off-gas only.</summary>
    public string ModelFile { get; set; } = "";

    /// <summary>Estimator settings (used when <see cref="ModelFile"/> is set; keys as in the replay configuration's estimator section).</summary>
    public Core.Estimation.EstimatorSettings Estimator { get; set; } = new();

    /// <summary>Which rates besides OUR and CER enter the elemental balance (used when <see cref="ModelFile"/> is set).</summary>
    public BalanceConfig Balance { get; set; } = new();

    /// <summary>Batch lifecycle from the plant: fed-batch detection, phase codes, initial conditions of tag-started batches.</summary>
    public ReactorBatchOptions Batches { get; set; } = new();
}

/// <summary>
/// Section <c>reactors:N:batches</c>. The batch-id and phase tags themselves are tags of the map with
/// roles <c>BatchId</c> and <c>BatchPhaseCode</c>.
/// </summary>
internal sealed class ReactorBatchOptions
{
    /// <summary>The open batch enters <c>fed-batch</c> when the feed stays above this, L/h, for <see cref="FedBatchHold"/>; NaN (absent) turns detection off.</summary>
    public double FedBatchFeedAboveLPerH { get; set; } = double.NaN;

    /// <summary>How long the feed must stay above <see cref="FedBatchFeedAboveLPerH"/>.</summary>
    public TimeSpan FedBatchHold { get; set; } = TimeSpan.FromMinutes(5);

    /// <summary>Phase tag: the controller's numeric code (as text, e.g. <c>"2"</c>) → phase id (batch, fed-batch, induced, harvest).</summary>
    public Dictionary<string, string> PhaseCodes { get; set; } = new(StringComparer.Ordinal);

    /// <summary>
    /// A batch started by the batch-id tag takes its volume from the volume or weight tag at that moment
    /// when true (the estimator's <c>initialVolumeL</c> when no such reading is usable); its inoculum and
    /// substrate come from the estimator section (<c>initialBiomassGPerL</c>, <c>initialBiomassSigmaGPerL</c>,
    /// <c>initialSubstrateGPerL</c>).
    /// </summary>
    public bool InitialVolumeFromTag { get; set; } = true;
}

/// <summary>One plant tag of a reactor's tag map.</summary>
internal sealed class TagOptions
{
    /// <summary>What the tag means to the cycle (a <see cref="Core.Signals.SignalRole"/> name).</summary>
    public string Role { get; set; } = "";

    /// <summary>The tag's plant unit (documentation and the status page); the scaled value is in the role's unit.</summary>
    public string Unit { get; set; } = "";

    /// <summary>value in the role's unit = raw × Scale + Offset.</summary>
    public double Scale { get; set; } = 1.0;

    /// <summary>See <see cref="Scale"/>.</summary>
    public double Offset { get; set; }

    /// <summary>A value older than this at cycle time is stale (the estimate turns Bad).</summary>
    public TimeSpan MaxAge { get; set; } = TimeSpan.FromSeconds(60);

    /// <summary>Transport delay to undo: the cycle at time t uses this tag's value from t − DeadTime (off-gas analyser).</summary>
    public TimeSpan DeadTime { get; set; } = TimeSpan.Zero;

    /// <summary>MQTT topic the tag arrives on (exact topic, no wildcards); empty when it comes over OPC UA.</summary>
    public string Topic { get; set; } = "";

    /// <summary>OPC UA node the tag is read from (<c>nsu=URI;s=Id</c> or a browse path such as <c>Objects/Reactor1/OffgasO2</c>); empty for MQTT.</summary>
    public string OpcUaNode { get; set; } = "";

    /// <summary>How the payload is laid out.</summary>
    public PayloadOptions Payload { get; set; } = new();
}

/// <summary>Payload layout of a tag's MQTT messages.</summary>
internal sealed class PayloadOptions
{
    /// <summary><c>json</c> (an object read through the paths below) or <c>number</c> (the payload is the number as text).</summary>
    public string Format { get; set; } = "json";

    /// <summary>Dotted path of the value, e.g. <c>value</c> or <c>data.v</c>.</summary>
    public string ValuePath { get; set; } = "value";

    /// <summary>Dotted path of the source timestamp (ISO 8601 text or Unix milliseconds); empty: arrival time.</summary>
    public string TimestampPath { get; set; } = "timestamp";

    /// <summary>Dotted path of the quality (good/uncertain/bad, or a boolean); empty: good.</summary>
    public string QualityPath { get; set; } = "quality";

    /// <summary>Dotted path of a numeric OPC UA status code; empty when the gateway sends none.</summary>
    public string StatusCodePath { get; set; } = "statusCode";
}
