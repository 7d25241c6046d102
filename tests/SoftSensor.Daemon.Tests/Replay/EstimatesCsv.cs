using System.Globalization;
using SoftSensor.Daemon.Replay;

namespace SoftSensor.Daemon.Tests.Replay;

/// <summary>Reads estimates.csv text back for the checks: one row per cycle.</summary>
internal sealed record EstimateRow(double H, double BiomassGPerL, double MuPerH, bool Inconsistent, string Suspect, string Quality);

internal static class EstimatesCsv
{
    public static (ReplayResult Result, List<EstimateRow> Rows) Replay(GlycerolReplayFixture f, string dir, ReplayOptions? options = null)
    {
        var text = new StringWriter(CultureInfo.InvariantCulture);
        ReplayResult result;
        using (var w = new EstimatesCsvWriter(text))
        {
            result = f.Replay(dir, options, w);
        }

        return (result, Parse(text.ToString(), f.Start));
    }

    public static List<EstimateRow> Parse(string csv, DateTimeOffset start)
    {
        var lines = csv.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        var head = lines[0].Split(',');
        int t = Array.IndexOf(head, "time"), x = Array.IndexOf(head, "biomass_g_per_l"), mu = Array.IndexOf(head, "mu_per_h");
        int inc = Array.IndexOf(head, "inconsistent"), sus = Array.IndexOf(head, "suspect"), q = Array.IndexOf(head, "quality");
        return lines.Skip(1).Select(l => l.Split(',')).Select(c => new EstimateRow(
            (DateTimeOffset.Parse(c[t], CultureInfo.InvariantCulture) - start).TotalHours,
            double.Parse(c[x], CultureInfo.InvariantCulture),
            double.Parse(c[mu], CultureInfo.InvariantCulture),
            c[inc] == "1",
            c[sus],
            c[q])).ToList();
    }
}
