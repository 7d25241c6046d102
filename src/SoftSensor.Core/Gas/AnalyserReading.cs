namespace SoftSensor.Core.Gas;

/// <summary>On what basis the off-gas analyser reads (docs/methods.md §1.3).</summary>
public enum AnalyserBasis
{
    /// <summary>The sample is dried before the cell: readings are dry mole fractions.</summary>
    Dry = 0,

    /// <summary>The sample is saturated with water at the cell temperature and pressure: y_H2O = p_sat(T) / p.</summary>
    Saturated = 1,

    /// <summary>The water content of the sample is measured (humidity sensor): y_H2O is given.</summary>
    MeasuredHumidity = 2,
}

/// <summary>
/// One off-gas analyser reading: O2 and CO2 mole fractions (0..1) as read, and what is needed to
/// convert them to a dry basis (y_dry = y_read / (1 - y_H2O)).
/// </summary>
/// <param name="O2Fraction">O2 mole fraction as read.</param>
/// <param name="Co2Fraction">CO2 mole fraction as read.</param>
/// <param name="Basis">Dry, saturated at the cell, or with a measured humidity.</param>
/// <param name="CellTemperatureC">Cell (or condenser) temperature, °C; used when saturated.</param>
/// <param name="CellPressureKPa">Cell pressure, absolute, kPa; used when saturated.</param>
/// <param name="WaterFraction">Measured H2O mole fraction (0..1); used with a measured humidity.</param>
public readonly record struct AnalyserReading(
    double O2Fraction,
    double Co2Fraction,
    AnalyserBasis Basis,
    double CellTemperatureC,
    double CellPressureKPa,
    double WaterFraction)
{
    /// <summary>A reading on a dry basis.</summary>
    public static AnalyserReading Dry(double o2Fraction, double co2Fraction) =>
        new(o2Fraction, co2Fraction, AnalyserBasis.Dry, double.NaN, double.NaN, 0);

    /// <summary>A reading of a gas saturated with water at the cell's temperature and pressure.</summary>
    public static AnalyserReading Saturated(double o2Fraction, double co2Fraction, double cellTemperatureC, double cellPressureKPa) =>
        new(o2Fraction, co2Fraction, AnalyserBasis.Saturated, cellTemperatureC, cellPressureKPa, double.NaN);

    /// <summary>A reading of a gas whose H2O mole fraction was measured.</summary>
    public static AnalyserReading WithHumidity(double o2Fraction, double co2Fraction, double waterFraction) =>
        new(o2Fraction, co2Fraction, AnalyserBasis.MeasuredHumidity, double.NaN, double.NaN, waterFraction);

    /// <summary>
    /// The H2O mole fraction of the sample: 0 when dry, p_sat(T)/p when saturated (IAPWS-IF97),
    /// the measured value otherwise. NaN when the cell conditions are outside the equation's range.
    /// </summary>
    public double WaterMoleFraction => Basis switch
    {
        AnalyserBasis.Dry => 0,
        AnalyserBasis.Saturated => CellPressureKPa > 0 && double.IsFinite(CellPressureKPa)
            ? WaterVapour.SaturationPressureKPa(CellTemperatureC + ReferenceConditions.ZeroCelsiusK) / CellPressureKPa
            : double.NaN,
        _ => WaterFraction,
    };
}
