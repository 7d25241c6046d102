using System.CommandLine;

namespace SoftSensor.Daemon.Cli.Offgas;

/// <summary>
/// The flags of <c>softsensor offgas</c>. Names are fixed so that scripts can rely on them. Values
/// are read as text and checked by <see cref="OffgasRequestReader"/>, so that every malformed value
/// gets one message naming the flag, the value and the expectation.
/// </summary>
internal sealed class OffgasOptions
{
    public Option<string?> Air { get; } = Flag("--air", "air line flow, NL/min at the reference conditions (default 0)");
    public Option<string?> Oxygen { get; } = Flag("--o2", "pure O2 line flow, NL/min (default 0)");
    public Option<string?> Nitrogen { get; } = Flag("--n2", "pure N2 line flow, NL/min (default 0)");
    public Option<string?> CarbonDioxide { get; } = Flag("--co2", "pure CO2 line flow, NL/min (default 0)");
    public Option<string?> RefTemp { get; } = Flag("--ref-temp", "MFC reference temperature, °C (default 0)");
    public Option<string?> RefPressure { get; } = Flag("--ref-pressure", "MFC reference pressure, kPa absolute (default 101.325)");
    public Option<string?> InletO2 { get; } = Flag("--inlet-o2", "measured inlet O2, % dry (default: mix of the gas lines, air 20.9476 % O2)");
    public Option<string?> InletCo2 { get; } = Flag("--inlet-co2", "inlet CO2, % dry: of the measured inlet with --inlet-o2, else of the air line (default 0.042)");
    public Option<string?> OutletO2 { get; } = Flag("--outlet-o2", "off-gas O2 as read, % (required)");
    public Option<string?> OutletCo2 { get; } = Flag("--outlet-co2", "off-gas CO2 as read, % (required)");
    public Option<string?> AnalyserBasis { get; } = Flag("--analyser-basis", "dry | saturated (saturated with water at --analyser-temp and --analyser-pressure; default dry)");
    public Option<string?> AnalyserTemp { get; } = Flag("--analyser-temp", "analyser cell temperature, °C (required with --analyser-basis saturated)");
    public Option<string?> AnalyserPressure { get; } = Flag("--analyser-pressure", "analyser cell pressure, kPa absolute (default 101.325)");
    public Option<string?> Humidity { get; } = Flag("--humidity", "measured H2O in the analysed gas, % by volume (instead of --analyser-basis)");
    public Option<string?> Volume { get; } = Flag("--volume", "liquid volume, L (required)");
    public Option<string?> O2Accuracy { get; } = Flag("--o2-accuracy", "O2 analyser standard uncertainty, %-abs");
    public Option<string?> Co2Accuracy { get; } = Flag("--co2-accuracy", "CO2 analyser standard uncertainty, %-abs");
    public Option<string?> FlowAccuracy { get; } = Flag("--flow-accuracy", "mass flow controller standard uncertainty, % of reading");
    public Option<string?> MinAeration { get; } = Flag("--min-aeration", "total inlet flow below which the balance is flagged bad, NL/min (default 0)");
    public Option<bool> Json { get; } = new("--json") { Description = "print one JSON document instead of the table" };

    /// <summary>Every option, in help order.</summary>
    public IEnumerable<Option> All =>
    [
        Air, Oxygen, Nitrogen, CarbonDioxide, RefTemp, RefPressure, InletO2, InletCo2, OutletO2, OutletCo2,
        AnalyserBasis, AnalyserTemp, AnalyserPressure, Humidity, Volume, O2Accuracy, Co2Accuracy, FlowAccuracy, MinAeration, Json,
    ];

    private static Option<string?> Flag(string name, string description) => new(name) { Description = description, HelpName = "value" };
}
