using System.Globalization;

namespace SoftSensor.Daemon.Demo;

/// <summary>Durations on the command line: <c>90s</c>, <c>15m</c>, <c>6h</c>, <c>1.5h</c> or <c>hh:mm:ss</c>.</summary>
internal static class DurationText
{
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

        return TimeSpan.TryParse(text, CultureInfo.InvariantCulture, out duration) && duration > TimeSpan.Zero;
    }
}
