namespace SoftSensor.Simulation.Gas;

/// <summary>Dissolved CO2, bicarbonate and carbonate at a fixed pH (docs/methods.md §1.5).</summary>
public static class CarbonateEquilibrium
{
    /// <summary>pK1 of carbonic acid in water: 3404.71/T - 14.8435 + 0.032786 T (Harned &amp; Davis 1943, J. Am. Chem. Soc. 65).</summary>
    public static double Pk1(double temperatureK) => (3404.71 / temperatureK) - 14.8435 + (0.032786 * temperatureK);

    /// <summary>pK2 of carbonic acid, 10.33 at 25 °C (Harned &amp; Scholes 1941, from memory); its temperature dependence is neglected.</summary>
    public const double Pk2 = 10.33;

    /// <summary>Henry coefficient of CO2, mmol/(L·kPa): 3.3e-4 mol/(m3·Pa) at 298.15 K, d ln H/d(1/T) = 2400 K (Sander 2015, Atmos. Chem. Phys. 15).</summary>
    public static double HenryMmolPerLkPa(double temperatureK) => 0.33 * Math.Exp(2400 * ((1 / temperatureK) - (1 / 298.15)));

    /// <summary>Total inorganic carbon per dissolved CO2: 1 + K1/[H+] + K1 K2/[H+]^2.</summary>
    public static double TicPerDissolvedCo2(double temperatureK, double ph, double pk1Shift)
    {
        double h = Math.Pow(10, -ph);
        double k1 = Math.Pow(10, -(Pk1(temperatureK) + pk1Shift));
        double k2 = Math.Pow(10, -Pk2);
        return 1 + (k1 / h) + (k1 * k2 / (h * h));
    }
}
