namespace SoftSensor.Simulation.Gas;

/// <summary>Physical constants of the gas model.</summary>
public static class GasConstants
{
    /// <summary>Molar gas constant, J/(mol·K) (exact, SI 2019 / CODATA 2018).</summary>
    public const double R = 8.314462618;

    /// <summary>0 °C in kelvin.</summary>
    public const double ZeroCelsiusK = 273.15;

    /// <summary>Molar mass of water, g/mol (IUPAC 2021: 2 × 1.008 + 15.999).</summary>
    public const double WaterGPerMol = 18.015;

    /// <summary>Molar volume at a reference state, L/mol: V_m = R T / p (docs/methods.md §1.1).</summary>
    public static double MolarVolumeLPerMol(double temperatureC, double pressureKPa) =>
        R * (temperatureC + ZeroCelsiusK) / pressureKPa;
}
