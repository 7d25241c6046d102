using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Configuration;

/// <summary>
/// The one table of plant units: for each quantity, the units a tag may be in and the linear map
/// role_value = Factor × plant_value + Offset into its role's unit (<see cref="SignalRoles.UnitOf"/>).
/// Factors are exact unit definitions (SI brochure, 9th ed.; NIST SP 811 appendix B: 1 bar = 100 kPa,
/// 1 psi = 6.894 757 293 168 kPa, 1 °F = 5/9 K, 0 °C = 273.15 K). Normal gas flows (NL, Nm³, SLPM,
/// NmL) are taken at the mass flow controller's own reference (gas:mfcReference*), which the gas
/// balance converts. A gauge pressure adds the tag's explicit atmospheric reference.
/// A volume role also takes a mass unit at 1 kg = 1 L (and a weight role a volume unit at 1 L = 1 kg),
/// the broth's density going into the tag's scale (a load cell read as volume, common practice).
/// </summary>
internal static class PlantUnits
{
    /// <summary>A unit of a quantity: the factor and offset to the quantity's role unit, and whether it is a gauge pressure.</summary>
    private readonly record struct Entry(string Unit, string Quantity, double Factor, double Offset, bool Gauge = false);

    private const double Psi = 6.894757293168;

    private static readonly Entry[] Table =
    [
        // normal gas flow → NL/min
        new("NL/min", "normal gas flow", 1, 0), new("SLPM", "normal gas flow", 1, 0),
        new("NL/h", "normal gas flow", 1.0 / 60, 0), new("Nm³/h", "normal gas flow", 1000.0 / 60, 0),
        new("Nm3/h", "normal gas flow", 1000.0 / 60, 0), new("mL/min", "normal gas flow", 1e-3, 0),
        new("NmL/min", "normal gas flow", 1e-3, 0), new("sccm", "normal gas flow", 1e-3, 0),
        // pressure → kPa absolute
        new("kPa", "pressure", 1, 0), new("Pa", "pressure", 1e-3, 0), new("bar", "pressure", 100, 0),
        new("mbar", "pressure", 0.1, 0), new("hPa", "pressure", 0.1, 0), new("psi", "pressure", Psi, 0),
        new("psia", "pressure", Psi, 0), new("bara", "pressure", 100, 0), new("bar(a)", "pressure", 100, 0),
        new("kPa(a)", "pressure", 1, 0),
        new("kPa(g)", "pressure", 1, 0, true), new("kPag", "pressure", 1, 0, true),
        new("bar(g)", "pressure", 100, 0, true), new("barg", "pressure", 100, 0, true),
        new("mbar(g)", "pressure", 0.1, 0, true), new("mbarg", "pressure", 0.1, 0, true),
        new("psig", "pressure", Psi, 0, true),
        // temperature → °C
        new("°C", "temperature", 1, 0), new("degC", "temperature", 1, 0), new("K", "temperature", 1, -273.15),
        new("°F", "temperature", 5.0 / 9, -32.0 * 5 / 9), new("degF", "temperature", 5.0 / 9, -32.0 * 5 / 9),
        // volume → L, mass → kg
        new("L", "volume", 1, 0), new("mL", "volume", 1e-3, 0), new("m³", "volume", 1000, 0), new("m3", "volume", 1000, 0),
        new("kg", "mass", 1, 0), new("g", "mass", 1e-3, 0),
        // liquid flow → L/h
        new("L/h", "liquid flow", 1, 0), new("mL/h", "liquid flow", 1e-3, 0), new("L/min", "liquid flow", 60, 0),
        new("mL/min", "liquid flow", 0.06, 0),
        // fraction → %
        new("%", "fraction", 1, 0), new("vol%", "fraction", 1, 0), new("fraction", "fraction", 100, 0), new("ppm", "fraction", 1e-4, 0),
        new("pH", "pH", 1, 0),
        new("1", "state", 1, 0), new("bool", "state", 1, 0),
        new("id", "identifier", 1, 0), new("text", "identifier", 1, 0),
        new("code", "phase code", 1, 0),
    ];

    /// <summary>The quantities a role's tag may be in (the first is the role's own).</summary>
    private static string[] QuantitiesOf(SignalRole role) => SignalRoles.UnitOf(role) switch
    {
        "NL/min" => ["normal gas flow"],
        "%" => ["fraction"],
        "kPa" => ["pressure"],
        "°C" => ["temperature"],
        "L" => ["volume", "mass"],
        "kg" => ["mass", "volume"],
        "L/h" => ["liquid flow"],
        "pH" => ["pH"],
        "1" => ["state"],
        "id" => ["identifier"],
        _ => ["phase code"],
    };

    /// <summary>The quantity of a unit text, or null when the table does not know it.</summary>
    public static string? QuantityOf(string unit) => Table.FirstOrDefault(e => e.Unit == unit.Trim()).Quantity;

    private static Entry? Find(SignalRole role, string unit)
    {
        var q = QuantitiesOf(role);
        foreach (var e in Table)
        {
            if (e.Unit == unit && q.Contains(e.Quantity))
            {
                return e;
            }
        }

        return null;
    }

    /// <summary>True when <paramref name="unit"/> is a gauge pressure (needs an atmospheric reference).</summary>
    public static bool IsGauge(string unit) => Table.Any(e => e.Unit == unit.Trim() && e.Gauge);

    /// <summary>
    /// The problem with <paramref name="unit"/> for <paramref name="role"/>, or null when it converts.
    /// An empty unit means the role's own unit.
    /// </summary>
    public static string? Problem(SignalRole role, string unit)
    {
        string u = unit.Trim();
        if (u.Length == 0)
        {
            return null;
        }

        var accepted = QuantitiesOf(role);
        if (Find(role, u) is not null)
        {
            return null;
        }

        return QuantityOf(u) is { } other
            ? $"'{unit}' is a unit of {other} (expected a unit of {accepted[0]} for role {role}: {AcceptedFor(role)})"
            : $"'{unit}' is not a unit the daemon knows (expected one of {AcceptedFor(role)}, for role {role} in {SignalRoles.UnitOf(role)})";
    }

    /// <summary>
    /// The linear map from <paramref name="unit"/> to the role's unit; <paramref name="atmosphereKPa"/>
    /// is added for a gauge pressure. Throws <see cref="ArgumentException"/> for a unit that <see cref="Problem"/> refuses.
    /// </summary>
    public static (double Factor, double Offset) Map(SignalRole role, string unit, double atmosphereKPa = double.NaN)
    {
        if (Problem(role, unit) is { } problem)
        {
            throw new ArgumentException(problem, nameof(unit));
        }

        if (unit.Trim().Length == 0)
        {
            return (1, 0);
        }

        var e = Find(role, unit.Trim())!.Value;
        return e.Gauge ? (e.Factor, e.Offset + atmosphereKPa) : (e.Factor, e.Offset);
    }

    /// <summary>Units accepted for a role, for messages.</summary>
    public static string AcceptedFor(SignalRole role)
    {
        var q = QuantitiesOf(role);
        return string.Join(", ", Table.Where(e => q.Contains(e.Quantity)).Select(e => e.Unit).Distinct());
    }
}
