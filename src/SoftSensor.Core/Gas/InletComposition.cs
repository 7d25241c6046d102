namespace SoftSensor.Core.Gas;

/// <summary>Where the inlet composition comes from (docs/methods.md §1.2).</summary>
public enum InletSource
{
    /// <summary>Flow-weighted mix of the gas lines: air (dry air, configured CO2), pure O2, N2, CO2.</summary>
    GasLines = 0,

    /// <summary>A measured reading of the inlet (reference) stream, dry basis.</summary>
    Measured = 1,
}

/// <summary>
/// The inlet composition: either mixed from the gas lines (air at <see cref="DryAir.O2Fraction"/>
/// and <see cref="AirCo2Fraction"/>) or a measured reference reading (<see cref="O2Fraction"/>,
/// <see cref="Co2Fraction"/>, dry mole fractions 0..1).
/// </summary>
public readonly record struct InletComposition(InletSource Source, double O2Fraction, double Co2Fraction, double AirCo2Fraction)
{
    /// <summary>Inlet mixed from the gas lines; the air line carries <paramref name="airCo2Fraction"/> CO2.</summary>
    public static InletComposition FromGasLines(double airCo2Fraction = DryAir.DefaultCo2Fraction) =>
        new(InletSource.GasLines, double.NaN, double.NaN, airCo2Fraction);

    /// <summary>Inlet from a measured reference reading (dry mole fractions).</summary>
    public static InletComposition Measured(double o2Fraction, double co2Fraction) =>
        new(InletSource.Measured, o2Fraction, co2Fraction, double.NaN);
}
