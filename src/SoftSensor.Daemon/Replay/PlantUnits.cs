using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Replay;

/// <summary>
/// Conversion from a historian column's plant unit to the unit of its signal role, as a linear map
/// role_value = Factor × plant_value + Offset. Factors are exact unit definitions (SI brochure,
/// 9th ed.; 1 atm = 101.325 kPa, 1 psi = 6.894 757 293 kPa, NIST SP 811).
/// </summary>
internal static class PlantUnits
{
    /// <summary>The linear map from <paramref name="unit"/> to the role's unit; false when the unit does not fit the role.</summary>
    public static bool TryMap(SignalRole role, string unit, out double factor, out double offset)
    {
        offset = 0;
        string target = SignalRoles.UnitOf(role);
        string u = unit.Trim();
        factor = target switch
        {
            "NL/min" => u switch
            {
                "NL/min" or "SLPM" or "L/min" => 1,
                "NmL/min" or "mL/min" or "sccm" => 1e-3,
                "NL/h" or "L/h" => 1.0 / 60,
                "Nm3/h" or "m3/h" => 1000.0 / 60,
                _ => double.NaN,
            },
            "%" => u switch
            {
                "%" or "vol%" => 1,
                "fraction" or "1" => 100,
                "ppm" => 1e-4,
                _ => double.NaN,
            },
            "kPa" => u switch
            {
                "kPa" => 1,
                "Pa" => 1e-3,
                "bar" => 100,
                "mbar" or "hPa" => 0.1,
                "atm" => 101.325,
                "psi" => 6.894757293168,
                _ => double.NaN,
            },
            "°C" => u switch
            {
                "°C" or "degC" or "C" => 1,
                "K" => 1,
                "°F" or "degF" or "F" => 5.0 / 9,
                _ => double.NaN,
            },
            "L" => u switch
            {
                "L" => 1,
                "mL" => 1e-3,
                "m3" => 1000,
                _ => double.NaN,
            },
            "kg" => u switch
            {
                "kg" => 1,
                "g" => 1e-3,
                "t" => 1000,
                _ => double.NaN,
            },
            "L/h" => u switch
            {
                "L/h" => 1,
                "mL/h" => 1e-3,
                "mL/min" => 0.06,
                "L/min" => 60,
                _ => double.NaN,
            },
            "pH" => u is "pH" or "1" ? 1 : double.NaN,
            "1" => u is "1" or "bool" ? 1 : double.NaN,
            _ => double.NaN,
        };

        if (target == "°C")
        {
            offset = u switch
            {
                "K" => -273.15,
                "°F" or "degF" or "F" => -32.0 * 5 / 9,
                _ => 0,
            };
        }

        return double.IsFinite(factor);
    }

    /// <summary>Units accepted for a role, for error messages.</summary>
    public static string AcceptedFor(SignalRole role) => SignalRoles.UnitOf(role) switch
    {
        "NL/min" => "NL/min, SLPM, L/min, NmL/min, mL/min, sccm, NL/h, L/h, Nm3/h, m3/h",
        "%" => "%, vol%, fraction, 1, ppm",
        "kPa" => "kPa, Pa, bar, mbar, hPa, atm, psi (absolute; use offset for gauge)",
        "°C" => "°C, degC, C, K, °F, degF, F",
        "L" => "L, mL, m3",
        "kg" => "kg, g, t",
        "L/h" => "L/h, mL/h, mL/min, L/min",
        "pH" => "pH",
        _ => "1, bool",
    };
}
