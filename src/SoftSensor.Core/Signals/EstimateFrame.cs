namespace SoftSensor.Core.Signals;

/// <summary>One named estimate of one cycle, in the unit its name and <see cref="Unit"/> state.</summary>
/// <param name="Name">Stable id of the estimate, e.g. <c>our</c>, <c>mu_per_h</c> (see <see cref="EstimateNames"/>).</param>
/// <param name="Value">The value (NaN when it could not be computed; its quality is then Bad).</param>
/// <param name="Unit">Unit shown to users, e.g. <c>mmol/(L·h)</c>.</param>
/// <param name="Sigma">Standard uncertainty in the same unit (NaN when unknown).</param>
/// <param name="Quality">Quality of this value.</param>
/// <param name="StatusCode">OPC UA status code of this value (OPC UA Part 8 §7.3.2; 0 = Good).</param>
public readonly record struct EstimateValue(string Name, double Value, string Unit, double Sigma, SampleQuality Quality, uint StatusCode);

/// <summary>
/// Everything one cycle of one reactor produced, flattened for the sinks (store, time-series
/// database, MQTT, OPC UA write-back, status page). <see cref="Time"/> is the cycle's scheduled
/// time: strictly increasing per reactor (also across restarts), whole milliseconds, the one
/// timestamp every sink writes, so no two frames of a reactor share a time and a time-series
/// database keeps every one. The inputs' own times travel beside it as data (<see cref="InputTime"/>,
/// <see cref="InputAge"/>). <see cref="Quality"/> is the worst over the frame's inputs.
/// </summary>
public sealed record EstimateFrame(
    string Reactor,
    string BatchId,
    DateTimeOffset Time,
    SampleQuality Quality,
    IReadOnlyList<EstimateValue> Values)
{
    /// <summary>The newest input source timestamp the cycle used; null when it used none (no input fresh).</summary>
    public DateTimeOffset? InputTime { get; init; }

    /// <summary>How old the newest input was at the frame's time (<see cref="Time"/> − <see cref="InputTime"/>); null when no input was used.</summary>
    public TimeSpan? InputAge => InputTime is { } t ? Time - t : null;

    /// <summary>Why the frame is Bad when no value could be computed (e.g. no input fresh); empty otherwise.</summary>
    public string Reason { get; init; } = "";

    /// <summary>The batch's phase at this cycle (an id of <see cref="Batches.BatchPhases"/>; empty when no batch is open).</summary>
    public string Phase { get; init; } = "";
}

/// <summary>Stable ids of the estimates (used as MQTT topic leaves, line-protocol fields, CSV columns).</summary>
public static class EstimateNames
{
    public const string Our = "our";
    public const string Cer = "cer";
    public const string Rq = "rq";
    public const string OutletFlow = "outlet_flow_nl_per_min";
    public const string MuPerH = "mu_per_h";
    public const string MuRawPerH = "mu_raw_per_h";
    public const string BiomassGPerL = "biomass_g_per_l";
    public const string BiomassG = "biomass_g";
    public const string LiquidVolumeL = "volume_l";
    public const string ConsistencyH = "h";
    public const string ConsistencyCritical = "h_critical";
    public const string FeedAdvisoryLPerH = "feed_advisory_l_per_h";
    public const string FeedCapLPerH = "feed_cap_l_per_h";
    public const string Kla = "kla_per_h";
    public const string OurSigma = "our_sigma";
    public const string CerSigma = "cer_sigma";
    public const string MuEkfPerH = "mu_ekf_per_h";
    public const string BiomassSigmaGPerL = "biomass_sigma_g_per_l";
    public const string BiomassIntegratorGPerL = "biomass_integrator_g_per_l";
    public const string BiomassEkfGPerL = "biomass_ekf_g_per_l";
    public const string QO2 = "q_o2_mmol_per_g_h";
    public const string QCo2 = "q_co2_mmol_per_g_h";
    public const string QSubstrate = "q_s_g_per_g_h";
    public const string SubstrateGPerL = "substrate_g_per_l";
    public const string FeedSetpointLPerH = "feed_setpoint_l_per_h";
    public const string FeedOverflowCapLPerH = "feed_overflow_cap_l_per_h";
    public const string OtrMax = "otr_max_mmol_per_l_h";

    // The pathway model as a second estimator and the heat balance (docs/pathway.md).
    public const string PathwayMuPerH = "pathway_mu_per_h";
    public const string PathwayOur = "pathway_our";
    public const string PathwayCer = "pathway_cer";
    public const string PathwayStatistic = "pathway_h";
    public const string PathwayCritical = "pathway_h_critical";
    public const string PathwayOverflow = "pathway_overflow";
    public const string PathwayOverflowPrefix = "pathway_overflow_";
    public const string PoRatio = "po_ratio";
    public const string MaintenanceAtp = "m_atp_mmol_per_g_h";
    public const string HeatMetabolicW = "heat_metabolic_w";
    public const string HeatOur = "heat_our";
    public const string HeatStatistic = "heat_h";
    public const string HeatCritical = "heat_h_critical";
    public const string HeatRedundancy = "heat_redundancy";
    public const string HeatIsolated = "heat_isolated";
}
