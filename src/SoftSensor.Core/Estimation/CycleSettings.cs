using SoftSensor.Core.Gas;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// How the cycle turns aligned inputs into balance measurements: the gas balance, which further
/// rates count as measured (substrate from the feed, ammonia from the base) and their
/// uncertainties, and the estimator settings.
/// </summary>
public sealed record CycleSettings
{
    /// <summary>Gas balance over the aligned inputs (the cycle supplies the liquid volume it tracks).</summary>
    public AlignedGasBalanceSettings Gas { get; init; } = AlignedGasBalanceSettings.Default;

    /// <summary>Biomass, observers, feed advisory.</summary>
    public EstimatorSettings Estimator { get; init; } = new();

    /// <summary>Count the substrate feed (F·c_S / V, no accumulation) as a measured substrate uptake when the feed runs.</summary>
    public bool SubstrateFromFeed { get; init; } = true;

    /// <summary>Relative standard uncertainty of the feed-derived substrate rate (pump and concentration).</summary>
    public double SubstrateRelativeSigma { get; init; } = 0.03;

    /// <summary>Ammonia in the base, mol/L, to count the base addition as measured ammonia uptake; NaN when the base is not the N source.</summary>
    public double BaseAmmoniaMolPerL { get; init; } = double.NaN;

    /// <summary>Relative standard uncertainty of the base-derived ammonia rate (pump, concentration, acid neutralised).</summary>
    public double AmmoniaRelativeSigma { get; init; } = 0.05;

    /// <summary>Smallest relative standard uncertainty given to OUR and CER (keeps Psi positive definite when no accuracy is configured).</summary>
    public double MinimumGasRelativeSigma { get; init; } = 0.005;

    /// <summary>Below this feed the substrate is not counted as measured, L/h.</summary>
    public double MinimumFeedLPerH { get; init; } = 1e-6;

    /// <summary>Which CER the balance uses: the CO2 transfer rate, or corrected for the inorganic carbon the broth accumulates (docs/methods.md §1.5; needs the Ph, TemperatureC and PressureKPa roles).</summary>
    public CerCorrection CerCorrection { get; init; } = CerCorrection.None;

    /// <summary>Shift of pK1 for the medium's ionic strength (docs/methods.md §1.5: about -0.1 to -0.25; 0 for pure water).</summary>
    public double Pk1MediumShift { get; init; }

    /// <summary>Standard deviation of the pH signal's noise, for the uncertainty the CER correction adds (0.01: a typical glass electrode's noise, common practice).</summary>
    public double PhSigma { get; init; } = 0.01;

    /// <summary>Time constant of the filter on the total inorganic carbon before its derivative is taken, h.</summary>
    public double TicFilterTimeConstantH { get; init; } = 0.1;

    /// <summary>Significance level of the consistency test (0.05: the 95 % χ² quantile).</summary>
    public double Alpha { get; init; } = 0.05;

    /// <summary>Every fault (empty when valid), each naming the field, the value and the expectation.</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>(Estimator.Validate());
        EstimatorSettings.Positive(errors, nameof(SubstrateRelativeSigma), SubstrateRelativeSigma);
        if (!double.IsNaN(BaseAmmoniaMolPerL))
        {
            EstimatorSettings.Positive(errors, nameof(BaseAmmoniaMolPerL), BaseAmmoniaMolPerL);
        }

        EstimatorSettings.Positive(errors, nameof(AmmoniaRelativeSigma), AmmoniaRelativeSigma);
        EstimatorSettings.Positive(errors, nameof(MinimumGasRelativeSigma), MinimumGasRelativeSigma);
        EstimatorSettings.NonNegative(errors, nameof(MinimumFeedLPerH), MinimumFeedLPerH);
        EstimatorSettings.Positive(errors, nameof(TicFilterTimeConstantH), TicFilterTimeConstantH);
        EstimatorSettings.NonNegative(errors, nameof(PhSigma), PhSigma);
        if (!(Pk1MediumShift >= -1 && Pk1MediumShift <= 1))
        {
            errors.Add($"{nameof(Pk1MediumShift)} is {Pk1MediumShift}; expected a pK1 shift between -1 and 1 (docs/methods.md §1.5: about -0.1 to -0.25)");
        }

        if (!Enum.IsDefined(CerCorrection))
        {
            errors.Add($"{nameof(CerCorrection)} is {CerCorrection}; expected None or DissolvedInorganicCarbon");
        }
        if (!(Alpha > 0 && Alpha < 0.5))
        {
            errors.Add($"{nameof(Alpha)} is {Alpha}; expected a significance level in (0, 0.5)");
        }

        return errors;
    }
}
