namespace SoftSensor.Core.Gas;

/// <summary>The gas lines a vessel has; an installed line whose flow is missing makes the balance bad.</summary>
[Flags]
public enum InstalledGasLines
{
    None = 0,
    Air = 1,
    Oxygen = 2,
    Nitrogen = 4,
    CarbonDioxide = 8,
}

/// <summary>
/// How <see cref="GasBalance.Compute(Signals.AlignedInputs, in AlignedGasBalanceSettings)"/> reads a
/// cycle's inputs: which lines exist, where the inlet composition comes from, the analyser basis, and
/// how old an input may be.
/// </summary>
/// <param name="Balance">The balance settings proper.</param>
/// <param name="Lines">Installed gas lines (their flow roles are required).</param>
/// <param name="Inlet">Gas-line mix, or measured inlet (the InletO2Percent and InletCo2Percent roles, dry).</param>
/// <param name="AirCo2Fraction">CO2 mole fraction of the air line when the inlet is the gas-line mix.</param>
/// <param name="AnalyserBasis">Dry, or saturated at AnalyserTemperatureC (measured humidity has no role yet).</param>
/// <param name="AnalyserPressureKPa">Absolute pressure in the analyser cell; NaN means use the PressureKPa role.</param>
/// <param name="MaxInputAge">Largest age of a required input at the cycle time.</param>
public readonly record struct AlignedGasBalanceSettings(
    GasBalanceSettings Balance,
    InstalledGasLines Lines,
    InletSource Inlet,
    double AirCo2Fraction,
    AnalyserBasis AnalyserBasis,
    double AnalyserPressureKPa,
    TimeSpan MaxInputAge)
{
    /// <summary>
    /// The same settings with the inlet given as an <see cref="InletComposition"/> (the first shape of
    /// this record, still used by callers): its source counts, and its air CO2 fraction when the
    /// inlet is the gas-line mix; a measured inlet's values come from the roles.
    /// </summary>
    public AlignedGasBalanceSettings(
        GasBalanceSettings balance, InstalledGasLines lines, InletComposition inlet, AnalyserBasis analyserBasis, double analyserPressureKPa, TimeSpan maxInputAge)
        : this(
            balance,
            lines,
            inlet.Source,
            inlet.Source == InletSource.GasLines ? inlet.AirCo2Fraction : DryAir.DefaultCo2Fraction,
            analyserBasis,
            analyserPressureKPa,
            maxInputAge)
    {
    }

    /// <summary>An air line, inlet mixed from the lines, dry analyser, inputs at most 60 s old.</summary>
    public static AlignedGasBalanceSettings Default { get; } = new(
        GasBalanceSettings.Default, InstalledGasLines.Air, InletSource.GasLines, DryAir.DefaultCo2Fraction, AnalyserBasis.Dry, double.NaN, TimeSpan.FromSeconds(60));
}
