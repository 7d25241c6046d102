namespace SoftSensor.Core.Gas;

/// <summary>
/// The reference conditions a mass flow controller states its volume flow at ("normal" or
/// "standard" litres). They differ between vendors and regions (0 °C/101.325 kPa, 0 °C/100 kPa,
/// 15 °C, 20 °C, 21.1 °C ...): always configuration, never a constant (docs/methods.md §1.1).
/// </summary>
/// <param name="TemperatureK">Reference temperature, K.</param>
/// <param name="PressureKPa">Reference pressure, absolute, kPa.</param>
public readonly record struct ReferenceConditions(double TemperatureK, double PressureKPa)
{
    /// <summary>Molar gas constant R in J/(mol·K): exact since the 2019 SI revision (CODATA 2018).</summary>
    public const double MolarGasConstant = 8.314462618;

    /// <summary>0 °C = 273.15 K (exact by definition of the Celsius scale).</summary>
    public const double ZeroCelsiusK = 273.15;

    /// <summary>0 °C and 101.325 kPa (one standard atmosphere), the most common MFC reference.</summary>
    public static ReferenceConditions Normal { get; } = new(ZeroCelsiusK, 101.325);

    /// <summary>Reference conditions from a temperature in °C and a pressure in kPa.</summary>
    public static ReferenceConditions FromCelsius(double temperatureC, double pressureKPa) => new(temperatureC + ZeroCelsiusK, pressureKPa);

    /// <summary>True when both values are finite and positive.</summary>
    public bool IsValid => double.IsFinite(TemperatureK) && TemperatureK > 0 && double.IsFinite(PressureKPa) && PressureKPa > 0;

    /// <summary>
    /// Ideal-gas molar volume V_m = R T / p in L/mol (J/kPa = L). CODATA 2018: 22.413 969 54 L/mol at
    /// 273.15 K and 101.325 kPa, 22.710 954 64 L/mol at 273.15 K and 100 kPa.
    /// </summary>
    public double MolarVolumeLPerMol => MolarGasConstant * TemperatureK / PressureKPa;
}
