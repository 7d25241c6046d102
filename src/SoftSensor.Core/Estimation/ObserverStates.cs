namespace SoftSensor.Core.Estimation;

/// <summary>
/// The states of both biomass observers after one cycle: the balance integrator (X·V and its
/// variance) and the Pirt extended Kalman filter ([X·V, mu] and its 2x2 covariance).
/// </summary>
public struct ObserverStates
{
    /// <summary>Integrated biomass in the vessel, g.</summary>
    public double BiomassG { get; set; }

    /// <summary>Variance of <see cref="BiomassG"/>, g².</summary>
    public double BiomassVarG2 { get; set; }

    /// <summary>Filter: biomass in the vessel, g.</summary>
    public double EkfBiomassG { get; set; }

    /// <summary>Filter: specific growth rate, 1/h.</summary>
    public double EkfMuPerH { get; set; }

    /// <summary>Filter covariance, element (X·V, X·V), g².</summary>
    public double EkfP00 { get; set; }

    /// <summary>Filter covariance, element (X·V, mu), g/h.</summary>
    public double EkfP01 { get; set; }

    /// <summary>Filter covariance, element (mu, mu), 1/h².</summary>
    public double EkfP11 { get; set; }
}
