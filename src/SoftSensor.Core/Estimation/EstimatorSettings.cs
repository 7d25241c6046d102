namespace SoftSensor.Core.Estimation;

/// <summary>
/// Configuration of the estimator: initial culture, biomass composition, smoothing, observers and
/// feed advisory. Units are in the names. <see cref="Validate"/> lists every fault in one message.
/// </summary>
public sealed record EstimatorSettings
{
    /// <summary>Biomass at the start of the batch (dry weight, ash included), g/L.</summary>
    public double InitialBiomassGPerL { get; init; } = 0.5;

    /// <summary>Standard uncertainty of <see cref="InitialBiomassGPerL"/>, g/L.</summary>
    public double InitialBiomassSigmaGPerL { get; init; } = 0.1;

    /// <summary>Liquid volume at the start, L (used when no volume or weight signal is present).</summary>
    public double InitialVolumeL { get; init; } = 100;

    /// <summary>Broth density, kg/L, to turn a load-cell weight into a volume (about 1.0-1.05; common practice).</summary>
    public double BrothDensityKgPerL { get; init; } = 1.02;

    /// <summary>Water carried off by the off-gas, L/h, for the integrated volume when no volume or weight signal is present.</summary>
    public double EvaporationLPerH { get; init; }

    /// <summary>Residual substrate at the start, g/L.</summary>
    public double InitialSubstrateGPerL { get; init; }

    /// <summary>Molar mass of the organic part of biomass, g per C-mol (CH1.8O0.5N0.2: 24.6; docs/methods.md §2.1).</summary>
    public double BiomassGPerCMol { get; init; } = 24.63;

    /// <summary>Ash as a fraction of dry weight (typically 0.05-0.10, docs/methods.md §2.1).</summary>
    public double AshFraction { get; init; } = 0.06;

    /// <summary>Time constant of the first-order filter that smooths mu, h.</summary>
    public double MuSmoothingTimeConstantH { get; init; } = 0.5;

    /// <summary>Random-walk drift of the integrated biomass, relative per square root of an hour (process noise of the offline-sample update).</summary>
    public double BiomassDriftRelPerSqrtH { get; init; } = 0.02;

    /// <summary>Capacity of the ring buffer of past cycles kept for late offline samples.</summary>
    public int HistoryCapacity { get; init; } = 1024;

    /// <summary>The observer whose biomass is published.</summary>
    public ObserverKind Observer { get; init; } = ObserverKind.BalanceIntegrator;

    /// <summary>Pirt observer: biomass yield on oxygen, g biomass per mmol O2.</summary>
    public double YieldXOGPerMmol { get; init; } = 0.035;

    /// <summary>Pirt observer: maintenance oxygen demand, mmol O2/(g·h).</summary>
    public double MaintenanceOMmolPerGh { get; init; } = 0.4;

    /// <summary>Pirt observer: random-walk intensity of mu, 1/h per square root of an hour.</summary>
    public double EkfMuNoisePerHSqrtH { get; init; } = 0.02;

    /// <summary>Pirt observer: smallest standard uncertainty of OUR it assumes, mmol/(L·h) (covers the Pirt model's own error).</summary>
    public double EkfOurSigmaFloorMmolPerLh { get; init; } = 1.0;

    /// <summary>Pirt observer: initial mu, 1/h, and its standard uncertainty.</summary>
    public double EkfInitialMuPerH { get; init; } = 0.1;

    /// <inheritdoc cref="EkfInitialMuPerH"/>
    public double EkfInitialMuSigmaPerH { get; init; } = 0.1;

    /// <summary>Molar mass of the substrate per C-mol, g/C-mol (glycerol C3H8O3: 30.70).</summary>
    public double SubstrateGPerCMol { get; init; } = 30.697;

    /// <summary>Substrate concentration in the feed, g/L.</summary>
    public double FeedSubstrateGPerL { get; init; } = 500;

    /// <summary>Feed advisory.</summary>
    public FeedAdvisorySettings Feed { get; init; } = new();

    /// <summary>Analyser dead time (sample line, dryer), s; the caller shifts outlet readings by it.</summary>
    public double AnalyserDeadTimeS { get; init; }

    /// <summary>Biomass mass per C-mol including ash, g/C-mol.</summary>
    public double BiomassWithAshGPerCMol => BiomassGPerCMol / (1.0 - AshFraction);

    /// <summary>Every fault of these settings (empty when valid), each naming the field, the value and the expectation.</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>();
        Positive(errors, nameof(InitialBiomassGPerL), InitialBiomassGPerL);
        Positive(errors, nameof(InitialBiomassSigmaGPerL), InitialBiomassSigmaGPerL);
        Positive(errors, nameof(InitialVolumeL), InitialVolumeL);
        Positive(errors, nameof(BiomassGPerCMol), BiomassGPerCMol);
        Positive(errors, nameof(BrothDensityKgPerL), BrothDensityKgPerL);
        NonNegative(errors, nameof(EvaporationLPerH), EvaporationLPerH);
        NonNegative(errors, nameof(InitialSubstrateGPerL), InitialSubstrateGPerL);
        if (!(AshFraction >= 0 && AshFraction < 0.5))
        {
            errors.Add($"{nameof(AshFraction)} is {AshFraction}; expected a fraction in [0, 0.5)");
        }

        Positive(errors, nameof(MuSmoothingTimeConstantH), MuSmoothingTimeConstantH);
        NonNegative(errors, nameof(BiomassDriftRelPerSqrtH), BiomassDriftRelPerSqrtH);
        if (HistoryCapacity < 2 || HistoryCapacity > 1_000_000)
        {
            errors.Add($"{nameof(HistoryCapacity)} is {HistoryCapacity}; expected 2 to 1000000 cycles");
        }

        Positive(errors, nameof(YieldXOGPerMmol), YieldXOGPerMmol);
        NonNegative(errors, nameof(MaintenanceOMmolPerGh), MaintenanceOMmolPerGh);
        NonNegative(errors, nameof(EkfMuNoisePerHSqrtH), EkfMuNoisePerHSqrtH);
        Positive(errors, nameof(EkfInitialMuSigmaPerH), EkfInitialMuSigmaPerH);
        Positive(errors, nameof(EkfOurSigmaFloorMmolPerLh), EkfOurSigmaFloorMmolPerLh);
        Positive(errors, nameof(SubstrateGPerCMol), SubstrateGPerCMol);
        Positive(errors, nameof(FeedSubstrateGPerL), FeedSubstrateGPerL);
        NonNegative(errors, nameof(AnalyserDeadTimeS), AnalyserDeadTimeS);
        Feed.Validate(errors);
        return errors;
    }

    internal static void Positive(List<string> errors, string name, double value)
    {
        if (!(value > 0 && double.IsFinite(value)))
        {
            errors.Add($"{name} is {value}; expected a finite number > 0");
        }
    }

    internal static void NonNegative(List<string> errors, string name, double value)
    {
        if (!(value >= 0 && double.IsFinite(value)))
        {
            errors.Add($"{name} is {value}; expected a finite number >= 0");
        }
    }
}
