namespace SoftSensor.Core.Estimation;

/// <summary>
/// What the operator (or the plant) states at inoculation: the liquid volume, the inoculum biomass
/// with its standard uncertainty (the observers' initial covariance P0 = sigma², docs/methods.md
/// section 4) and the residual substrate. A state made from them (<see cref="Cycle.NewState(in BatchInitialConditions)"/>)
/// starts its integrals from these values at its first cycle instead of the configured defaults.
/// </summary>
/// <param name="VolumeL">Liquid volume at inoculation, L (a volume or weight signal, when present, still wins).</param>
/// <param name="BiomassGPerL">Inoculum biomass (dry weight, ash included), g/L.</param>
/// <param name="BiomassSigmaGPerL">Standard uncertainty of <paramref name="BiomassGPerL"/>, g/L.</param>
/// <param name="SubstrateGPerL">Residual substrate at inoculation, g/L.</param>
public readonly record struct BatchInitialConditions(double VolumeL, double BiomassGPerL, double BiomassSigmaGPerL, double SubstrateGPerL)
{
    /// <summary>The defaults of the estimator settings.</summary>
    public static BatchInitialConditions From(EstimatorSettings settings) =>
        new(settings.InitialVolumeL, settings.InitialBiomassGPerL, settings.InitialBiomassSigmaGPerL, settings.InitialSubstrateGPerL);

    /// <summary>Every fault (empty when valid), each naming the field, the value and the expectation.</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>();
        EstimatorSettings.Positive(errors, nameof(VolumeL), VolumeL);
        EstimatorSettings.NonNegative(errors, nameof(BiomassGPerL), BiomassGPerL);
        EstimatorSettings.Positive(errors, nameof(BiomassSigmaGPerL), BiomassSigmaGPerL);
        EstimatorSettings.NonNegative(errors, nameof(SubstrateGPerL), SubstrateGPerL);
        return errors;
    }
}
