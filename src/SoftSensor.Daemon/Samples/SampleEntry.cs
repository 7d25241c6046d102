namespace SoftSensor.Daemon.Samples;

/// <summary>What an operator entered: an offline assay, a withdrawal of broth, or both.</summary>
internal enum SampleKind
{
    /// <summary>Dry cell weight, g/L.</summary>
    Dcw,

    /// <summary>Optical density through a calibration factor (stored as the dry weight it implies).</summary>
    Od,

    /// <summary>Substrate assay, g/L.</summary>
    Substrate,

    /// <summary>Product assay, g/L.</summary>
    Product,

    /// <summary>Broth withdrawn, without an assay.</summary>
    Removal,
}

/// <summary>
/// A validated operator input: when the broth was sampled (UTC), the measured concentration and its
/// standard uncertainty (g/L; for OD the dry weight of the calibration and its propagated uncertainty),
/// the broth withdrawn (L, 0 when none) and the payload as entered.
/// </summary>
internal sealed record SampleEntry(
    SampleKind Kind,
    DateTimeOffset SampledAt,
    double? ValueGPerL,
    double? SigmaGPerL,
    double WithdrawnL,
    string? Analyte,
    string? Operator,
    string Payload)
{
    /// <summary>True for the kinds the biomass observers take (DCW and OD).</summary>
    public bool IsBiomass => Kind is SampleKind.Dcw or SampleKind.Od;

    /// <summary>Wire name of a kind (as in the payload).</summary>
    public static string Name(SampleKind kind) => kind.ToString().ToLowerInvariant();
}

/// <summary>What became of an operator input (the <c>outcome</c> column and field).</summary>
internal static class SampleOutcomes
{
    /// <summary>Stored, waiting for the estimator to reach its sampling time.</summary>
    public const string Pending = "pending";

    /// <summary>Applied at its sampling time; the corrected trajectory is stored.</summary>
    public const string Applied = "applied";

    /// <summary>Stored and shown; the estimator has no state it corrects (substrate without variance, products).</summary>
    public const string Recorded = "recorded";

    /// <summary>Sampled before the oldest cycle the estimator keeps.</summary>
    public const string TooOld = "tooOld";

    /// <summary>The batch it was entered for ended before it could be applied.</summary>
    public const string BatchEnded = "batchEnded";

    /// <summary>The reactor runs no biomass estimator (off-gas only).</summary>
    public const string Unsupported = "unsupported";

    /// <summary>The estimator refused the values.</summary>
    public const string Invalid = "invalid";
}
