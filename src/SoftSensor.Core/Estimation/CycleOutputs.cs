using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// The estimates of one cycle, preallocated by the caller and overwritten by each cycle
/// (allocation-free); <see cref="EstimateFrames"/> flattens them for the sinks. Units in the names.
/// </summary>
public sealed class CycleOutputs
{
    /// <summary>The cycle's time (UTC).</summary>
    public DateTimeOffset Time { get; set; }

    /// <summary>The balances' rates, as used.</summary>
    public BalanceRates Rates { get; set; }

    /// <summary>Liquid volume, L, and where it came from.</summary>
    public double VolumeL { get; set; }

    /// <inheritdoc cref="VolumeL"/>
    public VolumeSource VolumeSource { get; set; }

    /// <summary>Published biomass (of the configured observer), g/L, its standard uncertainty and quality.</summary>
    public double BiomassGPerL { get; set; }

    /// <inheritdoc cref="BiomassGPerL"/>
    public double BiomassSigmaGPerL { get; set; }

    /// <inheritdoc cref="BiomassGPerL"/>
    public SampleQuality BiomassQuality { get; set; }

    /// <summary>Biomass of the balance integrator, g/L, and of the Pirt filter, g/L.</summary>
    public double IntegratorBiomassGPerL { get; set; }

    /// <inheritdoc cref="IntegratorBiomassGPerL"/>
    public double EkfBiomassGPerL { get; set; }

    /// <summary>Growth rate: raw (r_X / X), smoothed, and the Pirt filter's, 1/h.</summary>
    public double MuRawPerH { get; set; }

    /// <inheritdoc cref="MuRawPerH"/>
    public double MuPerH { get; set; }

    /// <inheritdoc cref="MuRawPerH"/>
    public double EkfMuPerH { get; set; }

    /// <summary>Specific rates: O2 uptake and CO2 production, mmol/(g·h); substrate uptake, g/(g·h).</summary>
    public double QO2MmolPerGh { get; set; }

    /// <inheritdoc cref="QO2MmolPerGh"/>
    public double QCo2MmolPerGh { get; set; }

    /// <inheritdoc cref="QO2MmolPerGh"/>
    public double QSubstrateGPerGh { get; set; }

    /// <summary>Residual substrate estimated from feed minus consumption, g/L.</summary>
    public double SubstrateGPerL { get; set; }

    /// <summary>The feed advisory.</summary>
    public FeedAdvice Feed { get; set; }

    /// <summary>The pathway model's estimates (all NaN when the reactor names none).</summary>
    public Flux.PathwayOutputs Pathway { get; set; } = Flux.PathwayOutputs.Empty;

    /// <summary>The heat balance (not configured when the reactor has none).</summary>
    public HeatOutputs Heat { get; set; } = HeatOutputs.Empty;

    /// <summary>Id of the pathway model's overflow product (e.g. <c>ethanol</c>), or null without an overflow branch.</summary>
    public string? OverflowProduct { get; set; }

    /// <summary>Worst quality over the frame.</summary>
    public SampleQuality Quality { get; set; }

    /// <summary>OPC UA status code of the biomass estimate (Part 8 §7.3.2).</summary>
    public uint BiomassStatusCode { get; set; }
}

/// <summary>Where the liquid volume came from (docs/methods.md §1.7).</summary>
public enum VolumeSource
{
    /// <summary>The controller's volume signal.</summary>
    Measured = 0,

    /// <summary>The load cell and the broth density.</summary>
    Weight,

    /// <summary>Integrated from the initial volume, additions and removals.</summary>
    Integrated,
}
