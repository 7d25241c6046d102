namespace SoftSensor.Daemon.Configuration;

/// <summary>The measured set of the elemental balance besides OUR and CER.</summary>
internal sealed record BalanceConfig
{
    /// <summary>Count the feed (F·c_S / V) as measured substrate uptake while the feed runs.</summary>
    public bool SubstrateFromFeed { get; init; } = true;

    /// <summary>Relative standard uncertainty of the feed-derived substrate rate.</summary>
    public double SubstrateRelativeSigma { get; init; } = 0.03;

    /// <summary>Ammonia in the base, mol/L; null when the base is not counted as ammonia uptake.</summary>
    public double? BaseAmmoniaMolPerL { get; init; }

    /// <summary>Relative standard uncertainty of the base-derived ammonia rate.</summary>
    public double AmmoniaRelativeSigma { get; init; } = 0.05;

    /// <summary>Significance level of the consistency test.</summary>
    public double Alpha { get; init; } = 0.05;

    /// <summary><c>none</c>: CER = CTR; <c>dissolvedInorganicCarbon</c>: CER corrected for the inorganic carbon the broth accumulates (needs the Ph, TemperatureC and PressureKPa roles; docs/methods.md §1.5).</summary>
    public string CerCorrection { get; init; } = "none";

    /// <summary>Shift of pK1 for the medium (about -0.1 to -0.25; 0 for pure water).</summary>
    public double Pk1MediumShift { get; init; }

    /// <summary>Standard deviation of the pH signal's noise (for the uncertainty of the CER correction).</summary>
    public double PhSigma { get; init; } = 0.01;

    /// <summary>Time constant of the filter on the inorganic carbon before its derivative, minutes.</summary>
    public double TicFilterMinutes { get; init; } = 6;
}
