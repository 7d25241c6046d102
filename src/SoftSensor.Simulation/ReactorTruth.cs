namespace SoftSensor.Simulation;

/// <summary>
/// What really happens in the virtual vessel at one instant (the truth file's row). Rates are
/// volumetric, mmol/(L·h); OUR/CER are the cells' uptake and production, OTR/CTR what crosses the
/// gas-liquid interface (they differ while dissolved O2 or inorganic carbon change).
/// </summary>
public sealed record ReactorTruth
{
    public DateTimeOffset Time { get; init; }
    public double ElapsedH { get; init; }
    public double BiomassGPerL { get; init; }
    public double BiomassG { get; init; }
    public double MuPerH { get; init; }
    public double VolumeL { get; init; }
    public double OurMmolPerLh { get; init; }
    public double CerMmolPerLh { get; init; }
    public double OtrMmolPerLh { get; init; }
    public double CtrMmolPerLh { get; init; }
    public double Rq { get; init; }
    public double SubstrateGPerL { get; init; }
    public double ByproductGPerL { get; init; }
    public double OverflowGPerL { get; init; }
    public double QsGPerGH { get; init; }
    public double DissolvedOxygenMmolPerL { get; init; }
    public double DissolvedOxygenPercent { get; init; }
    public double DissolvedCo2MmolPerL { get; init; }
    public double KlaPerH { get; init; }
    public double FeedLPerH { get; init; }
    public double BaseLPerH { get; init; }
    public double EvaporationLPerH { get; init; }
    public double InletMolPerH { get; init; }
    public double OutletMolPerH { get; init; }
    public double HeadspaceO2Percent { get; init; }
    public double HeadspaceCo2Percent { get; init; }
    /// <summary>(carbon in the vessel + CO2 out + carbon sampled) / (carbon at start + carbon fed).</summary>
    public double CarbonRecovery { get; init; }
    /// <summary>Inert gas in minus out minus the headspace's inert change, mmol (zero when N2 + Ar are conserved).</summary>
    public double InertImbalanceMmol { get; init; }
    /// <summary>Inert gas that entered over the run, mmol (scale for <see cref="InertImbalanceMmol"/>).</summary>
    public double InertInMmol { get; init; }
    public double FeedTotalL { get; init; }
    public double BaseTotalL { get; init; }
    public double EvaporatedTotalL { get; init; }
    public double SampledTotalL { get; init; }
    public bool FaultActive { get; init; }
    /// <summary>The culture's heat from its enthalpy balance, W (NaN without a jacket).</summary>
    public double MetabolicHeatW { get; init; } = double.NaN;
    /// <summary>The culture's P/O ratio (NaN without an energy budget).</summary>
    public double PoRatio { get; init; } = double.NaN;
    /// <summary>True overflow product rate, C-mmol/(L·h) (production &gt; 0).</summary>
    public double OverflowCmmolPerLh { get; init; } = double.NaN;
}
