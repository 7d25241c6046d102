namespace SoftSensor.Core.Gas;

/// <summary>
/// Dissolved inorganic carbon in equilibrium with gaseous CO2 (docs/methods.md §1.5), for pure water;
/// culture media with their ionic strength read pK1 about 0.1-0.25 lower (docs/methods.md §1.5).
/// </summary>
public static class CarbonateEquilibrium
{
    /// <summary>
    /// pK1 of CO2(aq) + H2O = H+ + HCO3-: 3404.71/T - 14.8435 + 0.032786 T (Harned & Davis 1943,
    /// J. Am. Chem. Soc. 65, 2030); 6.351 at 25 °C, 6.303 at 37 °C.
    /// </summary>
    public static double Pk1(double temperatureK) => (3404.71 / temperatureK) - 14.8435 + (0.032786 * temperatureK);

    /// <summary>
    /// pK2 of HCO3- = H+ + CO3--: 2902.39/T - 6.4980 + 0.02379 T (Harned & Scholes 1941, J. Am.
    /// Chem. Soc. 63, 1706; coefficients written from memory and matched against a secondary
    /// tabulation of Harned's constants); 10.33 at 25 °C.
    /// </summary>
    public static double Pk2(double temperatureK) => (2902.39 / temperatureK) - 6.4980 + (0.02379 * temperatureK);

    /// <summary>Henry's law solubility of CO2 at 298.15 K, mol/(m³·Pa) (Sander's compilation of Henry's law constants).</summary>
    public const double HenryAt298MolPerM3Pa = 3.3e-4;

    /// <summary>Temperature dependence d ln H / d(1/T) of CO2, K (Sander's compilation).</summary>
    public const double HenryTemperatureK = 2400;

    /// <summary>H_CO2(T) = 3.3e-4 exp(2400 (1/T - 1/298.15)) mol/(m³·Pa) (van 't Hoff form, Sander).</summary>
    public static double HenryMolPerM3Pa(double temperatureK) =>
        HenryAt298MolPerM3Pa * Math.Exp(HenryTemperatureK * ((1.0 / temperatureK) - (1.0 / 298.15)));

    /// <summary>
    /// Total inorganic carbon C_TIC in mmol/L (= mol/m³):
    ///   C_TIC = [CO2(aq)] (1 + K1/[H+] + K1 K2/[H+]²),  [CO2(aq)] = H_CO2(T) p_CO2.
    /// NaN when an input is not finite or the temperature or the CO2 partial pressure is out of range.
    /// </summary>
    /// <param name="ph">Broth pH.</param>
    /// <param name="temperatureC">Broth temperature, °C.</param>
    /// <param name="co2PartialPressureKPa">CO2 partial pressure over the broth, kPa (outlet CO2 fraction times head pressure).</param>
    /// <param name="pk1Shift">Added to pK1 for the medium (docs/methods.md §1.5: media read about 0.1-0.25 lower; 0 for pure water).</param>
    public static double TotalInorganicCarbonMmolPerL(double ph, double temperatureC, double co2PartialPressureKPa, double pk1Shift = 0)
    {
        double t = temperatureC + ReferenceConditions.ZeroCelsiusK;
        if (!double.IsFinite(ph) || !(t > 0) || !double.IsFinite(t) || !(co2PartialPressureKPa >= 0) || !double.IsFinite(co2PartialPressureKPa))
        {
            return double.NaN;
        }

        double dissolved = HenryMolPerM3Pa(t) * co2PartialPressureKPa * 1000.0;
        double h = Math.Pow(10, -ph);
        double k1 = Math.Pow(10, -(Pk1(t) + pk1Shift));
        double k2 = Math.Pow(10, -Pk2(t));
        return dissolved * (1 + (k1 / h) + (k1 * k2 / (h * h)));
    }
}
