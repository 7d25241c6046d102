namespace SoftSensor.Simulation.Gas;

/// <summary>O2 solubility in water (Benson &amp; Krause 1984, Limnol. Oceanogr. 29, 620-632).</summary>
public static class OxygenSolubility
{
    /// <summary>Molar mass of O2, g/mol (IUPAC 2021: 2 × 15.999).</summary>
    public const double O2GPerMol = 31.998;

    /// <summary>Standard atmosphere, kPa.</summary>
    public const double AtmosphereKPa = 101.325;

    /// <summary>
    /// Saturation concentration in fresh water under 1 atm of water-saturated air, mg/L:
    /// ln C = -139.34411 + 1.575701e5/T - 6.642308e7/T^2 + 1.243800e10/T^3 - 8.621949e11/T^4
    /// (Benson &amp; Krause 1984, as used by USGS and Standard Methods 4500-O).
    /// </summary>
    public static double AirSaturatedFreshWaterMgPerL(double temperatureK)
    {
        double t = temperatureK;
        double ln = -139.34411 + (1.575701e5 / t) - (6.642308e7 / (t * t)) + (1.243800e10 / (t * t * t)) - (8.621949e11 / (t * t * t * t));
        return Math.Exp(ln);
    }

    /// <summary>
    /// Henry coefficient in mmol/(L·kPa) of O2 partial pressure, from the Benson–Krause value and
    /// the O2 partial pressure of moist air at 1 atm: (101.325 - p_w) × 0.20946 (dry-air O2 fraction
    /// as used by Benson &amp; Krause).
    /// </summary>
    public static double HenryMmolPerLkPa(double temperatureK)
    {
        double pw = WaterVapour.SaturationPressureKPa(temperatureK);
        double cMmol = AirSaturatedFreshWaterMgPerL(temperatureK) / O2GPerMol;
        return cMmol / ((AtmosphereKPa - pw) * 0.20946);
    }
}
