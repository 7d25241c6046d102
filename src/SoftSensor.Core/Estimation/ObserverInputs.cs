namespace SoftSensor.Core.Estimation;

/// <summary>
/// What one cycle gives the biomass observers, kept in the history so that a late offline sample
/// can re-run them from its sampling time. Units in the names; NaN marks an unknown value.
/// </summary>
public struct ObserverInputs
{
    /// <summary>Time since the previous cycle, h.</summary>
    public double DtH { get; set; }

    /// <summary>Volumetric biomass production rate (dry weight, ash included), g/(L·h).</summary>
    public double GrowthGPerLh { get; set; }

    /// <summary>Standard uncertainty of <see cref="GrowthGPerLh"/>, g/(L·h).</summary>
    public double GrowthSigmaGPerLh { get; set; }

    /// <summary>Liquid volume at the end of the step, L.</summary>
    public double VolumeL { get; set; }

    /// <summary>Fraction of the broth removed (samples, harvest) during the step, 0..1.</summary>
    public double RemovedFraction { get; set; }

    /// <summary>Oxygen uptake rate, mmol/(L·h) (NaN when the gas balance gave none).</summary>
    public double OurMmolPerLh { get; set; }

    /// <summary>Standard uncertainty of <see cref="OurMmolPerLh"/>, mmol/(L·h).</summary>
    public double OurSigmaMmolPerLh { get; set; }
}
