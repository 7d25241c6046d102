namespace SoftSensor.Core.Gas;

/// <summary>
/// Inlet flows of the gas lines as their mass flow controllers report them, NL/min at the MFC
/// reference conditions (<see cref="ReferenceConditions"/>). A line that is not installed is 0.
/// </summary>
/// <param name="AirNlPerMin">Dry air line.</param>
/// <param name="OxygenNlPerMin">Pure O2 line (enrichment).</param>
/// <param name="NitrogenNlPerMin">Pure N2 line.</param>
/// <param name="CarbonDioxideNlPerMin">Pure CO2 line.</param>
public readonly record struct GasLineFlows(double AirNlPerMin, double OxygenNlPerMin, double NitrogenNlPerMin, double CarbonDioxideNlPerMin)
{
    /// <summary>Only an air line.</summary>
    public static GasLineFlows AirOnly(double airNlPerMin) => new(airNlPerMin, 0, 0, 0);

    /// <summary>Sum of the lines, NL/min.</summary>
    public double TotalNlPerMin => AirNlPerMin + OxygenNlPerMin + NitrogenNlPerMin + CarbonDioxideNlPerMin;

    /// <summary>True when every line is finite and not negative.</summary>
    public bool IsValid => IsFlow(AirNlPerMin) && IsFlow(OxygenNlPerMin) && IsFlow(NitrogenNlPerMin) && IsFlow(CarbonDioxideNlPerMin);

    private static bool IsFlow(double f) => double.IsFinite(f) && f >= 0;
}
