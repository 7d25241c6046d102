namespace SoftSensor.Daemon.Cli.Check;

/// <summary>What <c>softsensor check</c> found: the configuration per reactor and every problem (empty when usable).</summary>
internal sealed record CheckReport(string File, bool Usable, IReadOnlyList<string> Problems, IReadOnlyList<ReactorCheck> Reactors, IReadOnlyList<AlarmRuleLine> AlarmRules);

/// <summary>One reactor: its tag map, its model's structure (null without a model file) and the alarm rules that watch it.</summary>
internal sealed record ReactorCheck(string Id, string BatchId, TimeSpan CyclePeriod, IReadOnlyList<TagLine> Tags, ModelCheck? Model)
{
    /// <summary>The batch lifecycle from the plant (section batches and the batch tags).</summary>
    public BatchLifecycleLine? Batches { get; init; }
}

/// <summary>How a reactor follows the plant's batches: batch-id and phase tags, phase codes, fed-batch detection.</summary>
internal sealed record BatchLifecycleLine(string? BatchIdTag, string? PhaseTag, IReadOnlyDictionary<string, string> PhaseCodes, double? FedBatchFeedAboveLPerH, TimeSpan FedBatchHold, bool InitialVolumeFromTag);

/// <summary>One tag of the map: declared unit, the role's unit and the scaling between them.</summary>
internal sealed record TagLine(string Tag, string Role, string Unit, string RoleUnit, double Scale, double Offset, TimeSpan DeadTime, string Topic, bool UnitConverts);

/// <summary>
/// The model of one reactor with the measurements the tag map provides: element matrix (rows: balances,
/// columns: compounds), rank, degrees of freedom, calculable, not calculable and redundant rates.
/// </summary>
internal sealed record ModelCheck(
    string File,
    string Name,
    IReadOnlyList<string> Balances,
    IReadOnlyList<string> Compounds,
    IReadOnlyList<IReadOnlyList<double>> ElementMatrix,
    int Rank,
    int DegreesOfFreedom,
    IReadOnlyList<MeasuredRate> Measured,
    IReadOnlyList<string> Calculable,
    IReadOnlyList<string> NotCalculable,
    int Redundancy,
    IReadOnlyList<string> RedundantMeasurements);

/// <summary>A compound whose rate the tag map provides, and from what.</summary>
internal sealed record MeasuredRate(string Compound, string From);

/// <summary>One alarm rule as read, and where its signals come from.</summary>
internal sealed record AlarmRuleLine(string Id, string Kind, string Source, string? Reference, string Thresholds, string Priority, string Category);
