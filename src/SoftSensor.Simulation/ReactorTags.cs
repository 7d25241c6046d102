using SoftSensor.Core.Signals;

namespace SoftSensor.Simulation;

/// <summary>The tags of the virtual reactor, in history-column order. Plant units equal the roles' units.</summary>
public static class ReactorTags
{
    /// <summary>Tag suffixes in column order.</summary>
    internal static readonly (string Suffix, string Unit, SignalRole? Role, string Description)[] Layout =
    [
        ("AIR.FLOW", "NL/min", SignalRole.AirFlowNlPerMin, "air mass flow controller reading at its reference conditions"),
        ("O2.FLOW", "NL/min", SignalRole.OxygenFlowNlPerMin, "pure O2 (enrichment) mass flow controller reading"),
        ("INLET.O2", "%", SignalRole.InletO2Percent, "analyser reading of the inlet (reference) gas, O2, dry basis"),
        ("INLET.CO2", "%", SignalRole.InletCo2Percent, "analyser reading of the inlet (reference) gas, CO2, dry basis"),
        ("OFFGAS.O2", "%", SignalRole.OutletO2Percent, "off-gas analyser O2, dry basis (after the sample dryer)"),
        ("OFFGAS.CO2", "%", SignalRole.OutletCo2Percent, "off-gas analyser CO2, dry basis"),
        ("PRESSURE", "kPa", SignalRole.PressureKPa, "head pressure, absolute"),
        ("TEMP", "°C", SignalRole.TemperatureC, "broth temperature"),
        ("WEIGHT", "kg", SignalRole.WeightKg, "net weight of the broth (load cell)"),
        ("FEED.RATE", "L/h", SignalRole.FeedRateLPerH, "substrate feed pump flow"),
        ("BASE.RATE", "L/h", SignalRole.BaseRateLPerH, "ammonia (base and N source) pump flow"),
        ("DO", "%", SignalRole.DissolvedOxygenPercent, "dissolved O2, % of saturation with air at the start"),
        ("PH", "pH", SignalRole.Ph, "broth pH"),
    ];

    /// <summary>Position of each tag in <see cref="Layout"/>.</summary>
    internal const int AirFlow = 0, OxygenFlow = 1, InletO2 = 2, InletCo2 = 3, OffgasO2 = 4, OffgasCo2 = 5, Pressure = 6,
        Temperature = 7, Weight = 8, FeedRate = 9, BaseRate = 10, DissolvedOxygen = 11, Ph = 12;

    /// <summary>The jacket's tags, after <see cref="Layout"/> when the scenario has a jacket.</summary>
    internal static readonly (string Suffix, string Unit, SignalRole? Role, string Description)[] JacketLayout =
    [
        ("JACKET.FLOW", "L/h", SignalRole.CoolantFlowLPerH, "jacket coolant flow"),
        ("JACKET.TIN", "°C", SignalRole.CoolantInletTemperatureC, "jacket coolant inlet temperature"),
        ("JACKET.TOUT", "°C", SignalRole.CoolantOutletTemperatureC, "jacket coolant outlet temperature"),
        ("STIRRER.POWER", "W", SignalRole.StirrerPowerW, "stirrer shaft power"),
    ];

    /// <summary>Number of tags without a jacket (with one: plus <see cref="JacketLayout"/>).</summary>
    public static int Count => Layout.Length;

    /// <summary>The tag list with the prefix applied, with the jacket's tags when <paramref name="jacket"/>.</summary>
    public static IReadOnlyList<TagInfo> For(string prefix, bool jacket) =>
        (jacket ? Layout.Concat(JacketLayout) : Layout).Select(t => new TagInfo(prefix + "." + t.Suffix, t.Unit, t.Role, t.Description)).ToArray();

    /// <summary>The tag list with the prefix applied (e.g. R1.AIR.FLOW).</summary>
    public static IReadOnlyList<TagInfo> For(string prefix) =>
        Layout.Select(t => new TagInfo(prefix + "." + t.Suffix, t.Unit, t.Role, t.Description)).ToArray();
}
