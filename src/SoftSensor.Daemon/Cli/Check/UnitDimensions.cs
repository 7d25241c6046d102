using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Cli.Check;

/// <summary>
/// The physical quantity a unit text measures, so that <c>check</c> can tell whether a tag's declared
/// plant unit can be scaled into its role's unit (<see cref="SignalRoles.UnitOf"/>). Mass and volume
/// count as one quantity for liquid volume and weight (a load cell read as volume through the broth
/// density is common practice), and likewise mass and volume flows for the pumps.
/// </summary>
internal static class UnitDimensions
{
    private static readonly Dictionary<string, string> Known = Build();

    /// <summary>The quantity of a unit text, or null when the unit is not one <c>check</c> knows.</summary>
    public static string? Of(string unit) => Known.TryGetValue(unit.Trim(), out var d) ? d : null;

    /// <summary>The quantity of a role's own unit.</summary>
    public static string OfRole(SignalRole role) => Of(SignalRoles.UnitOf(role))
        ?? throw new InvalidOperationException($"role {role}: unit '{SignalRoles.UnitOf(role)}' missing from the unit table");

    /// <summary>Every unit text known, for error messages.</summary>
    public static IEnumerable<string> UnitsOf(string dimension) => Known.Where(k => k.Value == dimension).Select(k => k.Key);

    private static Dictionary<string, string> Build()
    {
        var d = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);
        Add(d, "normal gas flow", "NL/min", "Nl/min", "SLPM", "NL/h", "Nm3/h", "Nm³/h", "sccm", "SL/min");
        Add(d, "fraction", "%", "vol%", "%vol", "% v/v", "ppm", "mol/mol", "fraction", "% sat", "%sat", "% air saturation");
        Add(d, "pressure", "kPa", "Pa", "hPa", "MPa", "bar", "bar(a)", "bara", "bar(g)", "barg", "mbar", "mbar(g)", "psi", "psia", "psig", "atm", "kPa(a)", "kPa(g)", "mmHg", "Torr");
        Add(d, "temperature", "°C", "degC", "K", "°F", "degF");
        Add(d, "amount of liquid", "L", "mL", "m3", "m³", "kg", "g", "t");
        Add(d, "liquid flow", "L/h", "mL/h", "mL/min", "L/min", "kg/h", "g/h", "g/min");
        Add(d, "pH", "pH");
        Add(d, "state", "1", "bool", "0/1");
        Add(d, "identifier", "id", "text");
        Add(d, "phase code", "code");
        return d;
    }

    private static void Add(Dictionary<string, string> d, string dimension, params string[] units)
    {
        foreach (var u in units)
        {
            d[u] = dimension;
        }
    }
}
