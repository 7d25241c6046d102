namespace SoftSensor.Core.Gas;

/// <summary>
/// Saturation concentration of dissolved O2 (docs/methods.md §1.6) from Benson & Krause 1984 (Limnol.
/// Oceanogr. 29(3) 620-632; the form used by USGS and Standard Methods 4500-O):
///   ln C* [mg/L] = -139.34411 + 1.575701e5/T - 6.642308e7/T² + 1.243800e10/T³ - 8.621949e11/T⁴
/// for fresh water in equilibrium with water-saturated air at 1 atm; 9.09 (20 °C), 8.26 (25 °C),
/// 7.56 (30 °C), 6.73 mg/L (37 °C).
/// </summary>
public static class OxygenSolubility
{
    /// <summary>One standard atmosphere, kPa (exact by definition).</summary>
    public const double StandardAtmosphereKPa = 101.325;

    /// <summary>O2 mole fraction in dry air that the Benson & Krause equation refers to (0.20946, Benson & Krause 1984).</summary>
    public const double ReferenceO2Fraction = 0.20946;

    /// <summary>C* of fresh water at 1 atm of water-saturated air, mg/L; NaN outside 0-40 °C (the equation's range).</summary>
    public static double FreshWaterAtOneAtmosphereMgPerL(double temperatureC)
    {
        if (!(temperatureC >= 0 && temperatureC <= 40))
        {
            return double.NaN;
        }

        double t = temperatureC + ReferenceConditions.ZeroCelsiusK;
        double inv = 1.0 / t;
        double ln = -139.34411 + (1.575701e5 * inv) - (6.642308e7 * inv * inv) + (1.243800e10 * inv * inv * inv) - (8.621949e11 * inv * inv * inv * inv);
        return Math.Exp(ln);
    }

    /// <summary>
    /// C* scaled with the O2 partial pressure (Henry's law) for enriched gas or overpressure, times a
    /// salting-out factor of the broth (1 for fresh water; configuration):
    ///   C* = C*_BK(T) · pO2 / (0.20946 · (101.325 kPa - p_sat(T))) · factor.
    /// The small non-ideality term of Benson & Krause (theta, about 0.001 per atm) is neglected: below
    /// 0.5 % up to 3 atm (from memory).
    /// </summary>
    public static double SaturationMgPerL(double temperatureC, double o2PartialPressureKPa, double saltingOutFactor)
    {
        double pSat = WaterVapour.SaturationPressureKPa(temperatureC + ReferenceConditions.ZeroCelsiusK);
        double reference = ReferenceO2Fraction * (StandardAtmosphereKPa - pSat);
        return FreshWaterAtOneAtmosphereMgPerL(temperatureC) * o2PartialPressureKPa / reference * saltingOutFactor;
    }
}
