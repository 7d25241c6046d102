namespace SoftSensor.Core.Stoichiometry;

/// <summary>What a compound is in a black-box model (docs/methods.md §2). Roles name meaning; the sign of a rate says direction.</summary>
public enum CompoundRole
{
    /// <summary>A carbon and energy source that the cells take up.</summary>
    Substrate,

    /// <summary>A product that is part of the balance.</summary>
    Product,

    /// <summary>The cells (dry weight, possibly with ash).</summary>
    Biomass,

    /// <summary>Molecular oxygen.</summary>
    Oxygen,

    /// <summary>Carbon dioxide.</summary>
    CarbonDioxide,

    /// <summary>Water.</summary>
    Water,

    /// <summary>The nitrogen source (ammonia, ammonium).</summary>
    NitrogenSource,

    /// <summary>
    /// A product not in the balance unless it is measured or specified; the gross-error diagnosis offers
    /// it as the hypothesis "this product is missing" (van der Heijden et al. 1994).
    /// </summary>
    Candidate,
}
