using System.Globalization;

namespace SoftSensor.Daemon.Demo;

/// <summary>
/// Durations on the command line: a number with a unit (<c>90s</c>, <c>15m</c>, <c>6h</c>,
/// <c>1.5h</c>) or clock text <c>hh:mm:ss</c>. A bare number is refused: its unit would be a guess
/// (.NET's own parser reads <c>90</c> as 90 days).
/// </summary>
internal static class DurationText
{
    /// <summary>The accepted forms, as the messages and the help name them.</summary>
    public const string Forms = "a number with a unit s, m or h (90s, 30m, 2h, 1.5h) or hh:mm:ss (01:30:00)";

    public static bool TryParse(string text, out TimeSpan duration)
    {
        duration = default;
        text = text.Trim();
        if (text.Length > 1 && "smh".Contains(text[^1], StringComparison.Ordinal)
            && double.TryParse(text[..^1], NumberStyles.Float, CultureInfo.InvariantCulture, out double n) && n > 0 && double.IsFinite(n))
        {
            duration = text[^1] switch { 's' => TimeSpan.FromSeconds(n), 'm' => TimeSpan.FromMinutes(n), _ => TimeSpan.FromHours(n) };
            return true;
        }

        return text.Contains(':', StringComparison.Ordinal)
            && TimeSpan.TryParse(text, CultureInfo.InvariantCulture, out duration) && duration > TimeSpan.Zero;
    }

    /// <summary>Null when <paramref name="text"/> is a duration; else the message naming the flag, the value and the accepted forms.</summary>
    public static string? Problem(string flag, string text)
    {
        if (TryParse(text, out _))
        {
            return null;
        }

        string t = text.Trim();
        return double.TryParse(t, NumberStyles.Float, CultureInfo.InvariantCulture, out _)
            ? $"{flag} is '{text}': a number needs a unit (expected {Forms}; e.g. {t}s, {t}m or {t}h)"
            : $"{flag} is '{text}' (expected {Forms})";
    }
}
