using System.Globalization;

namespace SoftSensor.Simulation.Output;

/// <summary>How the simulator writes numbers and times: invariant culture, ISO 8601 UTC with a Z.</summary>
internal static class CsvFormat
{
    public static string Time(DateTimeOffset t) => t.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture);

    /// <summary>A tag value as a plant historian would store it (7 significant digits).</summary>
    public static string Tag(double v) => double.IsFinite(v) ? v.ToString("G7", CultureInfo.InvariantCulture) : string.Empty;

    /// <summary>A truth value (10 significant digits; empty when undefined, e.g. RQ with zero OUR).</summary>
    public static string Truth(double v) => double.IsFinite(v) ? v.ToString("G10", CultureInfo.InvariantCulture) : string.Empty;
}
