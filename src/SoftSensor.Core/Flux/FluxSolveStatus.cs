namespace SoftSensor.Core.Flux;

/// <summary>Outcome of one flux solve: everyday results, not exceptions.</summary>
public enum FluxSolveStatus
{
    /// <summary>Every flux and every exchange rate follows from the constraints and the basis.</summary>
    Determined,

    /// <summary>Some fluxes are not fixed by the basis (listed by the solver); those are NaN, the rest hold.</summary>
    PartlyDetermined,

    /// <summary>The basis values contradict the network (more given than it allows, and not in agreement).</summary>
    Inconsistent,

    /// <summary>The model has a maintenance demand and no finite biomass concentration was given.</summary>
    BiomassConcentrationMissing,

    /// <summary>A basis value is NaN or infinite.</summary>
    BasisNotFinite,
}
