namespace SoftSensor.Core.Estimation;

/// <summary>
/// An offline biomass measurement (dry cell weight, or OD through a calibration), entered with
/// the time the broth was sampled and the assay's standard uncertainty.
/// </summary>
/// <param name="SampledAt">When the broth was taken (UTC).</param>
/// <param name="BiomassGPerL">Measured dry weight, g/L.</param>
/// <param name="SigmaGPerL">Standard uncertainty of the assay, g/L (must be &gt; 0).</param>
public readonly record struct OfflineSample(DateTimeOffset SampledAt, double BiomassGPerL, double SigmaGPerL);

/// <summary>What became of an offline sample.</summary>
public enum OfflineSampleOutcome
{
    /// <summary>Applied at its sampling time; the observers were re-run to the present.</summary>
    Applied = 0,

    /// <summary>Value or uncertainty not a finite positive number; ignored.</summary>
    Invalid,

    /// <summary>Sampled before the oldest cycle kept in the history; ignored.</summary>
    TooOld,

    /// <summary>Sampled after the last cycle; hold it and offer it again after a later cycle.</summary>
    NotYetReached,
}
