namespace SoftSensor.Core.Flux;

/// <summary>Outcome of a live growth estimate from measured exchange rates.</summary>
public enum FluxEstimateStatus
{
    /// <summary>The biomass rate was estimated.</summary>
    Estimated,

    /// <summary>No measurement had a finite value with a positive finite sigma that responds to growth.</summary>
    NoInformation,

    /// <summary>The model has a maintenance demand and the biomass concentration is not a finite value &gt;= 0.</summary>
    BiomassConcentrationMissing,
}

/// <summary>
/// One live estimate (docs/methods.md §3, live use): the biomass formation rate that best explains the
/// measured exchange rates in the weighted least-squares sense, with no yield specified.
/// </summary>
/// <param name="Status">Outcome.</param>
/// <param name="BiomassRateCmmolPerLh">r_X, C-mmol/(L·h).</param>
/// <param name="BiomassRateSigmaCmmolPerLh">Standard uncertainty of r_X from the measurement sigmas (first order).</param>
/// <param name="MuPerH">Specific growth rate r_X / X in 1/h (NaN when X is not &gt; 0).</param>
/// <param name="ChiSquare">Sum of squared weighted gaps; chi-square with <paramref name="DegreesOfFreedom"/> dof when model and data agree.</param>
/// <param name="DegreesOfFreedom">Measurements used minus one.</param>
/// <param name="MeasurementsUsed">How many measurements entered.</param>
public readonly record struct FluxEstimate(
    FluxEstimateStatus Status,
    double BiomassRateCmmolPerLh,
    double BiomassRateSigmaCmmolPerLh,
    double MuPerH,
    double ChiSquare,
    int DegreesOfFreedom,
    int MeasurementsUsed);
