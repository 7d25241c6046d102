namespace SoftSensor.Core.Gas;

/// <summary>Composition of dry air used when the inlet is mixed from gas lines (docs/methods.md §1.2).</summary>
public static class DryAir
{
    /// <summary>
    /// O2 mole fraction of dry air, 0.209476 (U.S. Standard Atmosphere 1976, NOAA/NASA/USAF, table 3).
    /// The same table gives N2 0.78084 and Ar 0.00934; both are inert to the culture.
    /// </summary>
    public const double O2Fraction = 0.209476;

    /// <summary>
    /// Default CO2 mole fraction of dry air, 0.00042: NOAA's global mean was about 420 ppm in 2024
    /// (from memory). CO2 rises every year, so it is configurable (or use a measured inlet reading).
    /// </summary>
    public const double DefaultCo2Fraction = 0.00042;
}
