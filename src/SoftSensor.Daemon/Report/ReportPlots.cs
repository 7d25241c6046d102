using ScottPlot;
using SoftSensor.Daemon.Replay;

namespace SoftSensor.Daemon.Report;

/// <summary>The report's figures, drawn with ScottPlot 5 and saved as PNG files in the output folder.</summary>
internal static class ReportPlots
{
    private const int Width = 960;
    private const int Height = 380;

    /// <summary>
    /// Draws every figure into <paramref name="dir"/>; returns the file names with their captions. The time
    /// axis is in hours since <paramref name="batchStart"/> (batch hours) when given, else since the first row.
    /// </summary>
    public static IReadOnlyList<(string File, string Caption)> Draw(string dir, ReplaySeries s, IReadOnlyList<ScheduledSample> samples, DateTimeOffset? batchStart = null)
    {
        var figures = new List<(string, string)>();
        var origin = batchStart ?? s.Start;
        double shift = (s.Start - origin).TotalHours;
        string axis = batchStart is null ? "time since the first row of the export, h" : "batch time, h (since the batch started)";
        double[] t = [.. s.TimeH.Select(x => x + shift)];

        using (var p = new Plot())
        {
            Line(p, t, s.Our, "OUR, mmol/(L·h)");
            Line(p, t, s.Cer, "CER, mmol/(L·h)");
            var rq = Line(p, t, s.Rq, "RQ (right axis)");
            rq.Axes.YAxis = p.Axes.Right;
            p.Axes.Right.Label.Text = "RQ";
            Finish(p, "Off-gas rates and respiratory quotient", "mmol/(L·h)", axis);
            figures.Add(Save(p, dir, "rates.png", "OUR and CER from the inert-gas balance, RQ = CER / OUR."));
        }

        using (var p = new Plot())
        {
            Line(p, t, s.Biomass, "published biomass");
            Line(p, t, s.BiomassIntegrator, "balance integrator");
            Line(p, t, s.BiomassEkf, "Pirt filter");
            if (samples.Count > 0)
            {
                double[] st = [.. samples.Select(x => (x.Sample.SampledAt - origin).TotalHours)];
                double[] sv = [.. samples.Select(x => x.Sample.BiomassGPerL)];
                double[] se = [.. samples.Select(x => x.Sample.SigmaGPerL)];
                var bars = p.Add.ErrorBar(st, sv, se);
                bars.LineWidth = 1.5f;
                var dots = p.Add.Scatter(st, sv);
                dots.LineWidth = 0;
                dots.MarkerSize = 8;
                dots.LegendText = "offline samples (dry weight ± σ)";
            }

            Finish(p, "Biomass", "g/L", axis);
            figures.Add(Save(p, dir, "biomass.png", "Biomass of both observers with the offline samples applied, each with its standard uncertainty σ (applied at its sampling time when its result arrived)."));
        }

        using (var p = new Plot())
        {
            Line(p, t, s.MuRaw, "mu raw").LineWidth = 1;
            Line(p, t, s.Mu, "mu published");
            Finish(p, "Specific growth rate", "1/h", axis);
            figures.Add(Save(p, dir, "mu.png", "Specific growth rate: raw (r_X / X) and the published (smoothed or filter) value."));
        }

        using (var p = new Plot())
        {
            Line(p, t, s.H, "h");
            Line(p, t, s.HCritical, "critical value");
            Spans(p, s, shift);
            Finish(p, "Consistency test", "h (χ²)", axis);
            // Large h after a step of the process would flatten the rest: show up to the 99th percentile or 4 × critical.
            var finite = s.H.Where(double.IsFinite).Order().ToList();
            double crit = s.HCritical.Where(double.IsFinite).DefaultIfEmpty(6).Max();
            double top = Math.Max(4 * crit, finite.Count > 0 ? finite[(int)(0.99 * (finite.Count - 1))] : 0);
            p.Axes.SetLimitsY(0, top * 1.1);
            figures.Add(Save(p, dir, "consistency.png", "Test statistic h of the elemental balances against its χ² critical value; shaded where the test failed."));
        }

        using (var p = new Plot())
        {
            Line(p, t, s.FeedActual, "feed (measured)");
            Line(p, t, s.FeedAdvised, "feed advisory");
            Spans(p, s, shift);
            Finish(p, "Feed and advisory flags", "L/h", axis);
            figures.Add(Save(p, dir, "alarms.png", "Measured feed against the advisory; shaded intervals are those in which the balance was inconsistent."));
        }

        return figures;
    }

    private static ScottPlot.Plottables.Scatter Line(Plot p, double[] t, List<double> y, string label)
    {
        double[] ys = [.. y.Select(v => double.IsFinite(v) ? v : double.NaN)];
        var line = p.Add.Scatter(t, ys);
        line.MarkerSize = 0;
        line.LineWidth = 2;
        line.LegendText = label;
        return line;
    }

    private static void Spans(Plot p, ReplaySeries s, double shift)
    {
        foreach (var (from, to, _) in s.InconsistentIntervals)
        {
            var span = p.Add.HorizontalSpan(from + shift, Math.Max(to, from + 0.01) + shift);
            span.FillStyle.Color = Colors.Red.WithAlpha(0.15);
            span.LineStyle.Width = 0;
        }
    }

    private static void Finish(Plot p, string title, string yLabel, string xLabel)
    {
        p.Title(title);
        p.Axes.Bottom.Label.Text = xLabel;
        p.Axes.Left.Label.Text = yLabel;
        p.ShowLegend(Alignment.UpperLeft);
    }

    private static (string, string) Save(Plot p, string dir, string file, string caption)
    {
        p.SavePng(Path.Combine(dir, file), Width, Height);
        return (file, caption);
    }
}
