using System.Globalization;
using System.Net;
using System.Text;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Replay;

namespace SoftSensor.Daemon.Report;

/// <summary>Writes DIR/report.html: summary, figures (PNG beside it), inconsistency intervals with the diagnosis, skipped rows, cautions.</summary>
internal static class ReportWriter
{
    /// <summary>Writes the report; <paramref name="extraHtml"/> (already encoded) goes before the methods, e.g. a live batch's phases and alarms.</summary>
    public static void Write(string dir, string title, ReplayResult result, IReadOnlyList<(string File, string Caption)> figures, string? extraHtml = null)
    {
        var s = result.Series;
        var ci = CultureInfo.InvariantCulture;
        var h = new StringBuilder();
        h.Append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>").Append(E(title)).Append("</title>\n")
         .Append("<style>body{font-family:sans-serif;max-width:1000px;margin:1em auto;color:#222}table{border-collapse:collapse}")
         .Append("td,th{border:1px solid #bbb;padding:2px 8px;text-align:left}.caution{background:#fff4e0;padding:0.5em 1em;border-left:4px solid #e0a000}</style>")
         .Append("</head><body>\n<h1>").Append(E(title)).Append("</h1>\n");
        h.Append("<p class=\"caution\">Advisory estimates only. SoftSensor is not a safety instrumented system; its flags never replace the plant's ")
         .Append("interlocks, relief devices or operating procedures, and it defers to local codes and licensed practice.</p>\n");

        h.Append("<h2>Summary</h2>\n<table>\n");
        Row(h, "rows read", result.Rows.ToString(ci));
        Row(h, "rows skipped", result.SkippedRows.ToString(ci));
        Row(h, "cycles", result.Cycles.ToString(ci));
        Row(h, "quality good / uncertain / bad", string.Create(ci, $"{s.CountOf(SampleQuality.Good)} / {s.CountOf(SampleQuality.Uncertain)} / {s.CountOf(SampleQuality.Bad)}"));
        Row(h, "offline samples applied", string.Create(ci, $"{result.SamplesApplied} of {result.Samples.Count}"));
        if (s.Biomass.Count > 0)
        {
            Row(h, "final biomass", string.Create(ci, $"{s.Biomass[^1]:F3} ± {s.BiomassSigma[^1]:F3} g/L"));
            Row(h, "final mu", string.Create(ci, $"{s.Mu[^1]:F4} 1/h"));
        }

        Row(h, "cycles with a failed consistency test", s.InconsistentCycles.ToString(ci));
        h.Append("</table>\n");

        if (s.Suspects.Count > 0)
        {
            h.Append("<h2>Diagnosis of failed tests</h2>\n<table><tr><th>hypothesis that restores consistency</th><th>cycles</th></tr>\n");
            foreach (var (suspect, n) in s.Suspects.OrderByDescending(x => x.Value))
            {
                h.Append("<tr><td>").Append(E(suspect)).Append("</td><td>").Append(n.ToString(ci)).Append("</td></tr>\n");
            }

            h.Append("</table>\n");
        }

        foreach (var (file, caption) in figures)
        {
            h.Append("<figure><img src=\"").Append(E(file)).Append("\" alt=\"").Append(E(caption)).Append("\" width=\"960\"><figcaption>")
             .Append(E(caption)).Append("</figcaption></figure>\n");
        }

        h.Append("<h2>Flags: intervals with an inconsistent balance</h2>\n");
        if (s.InconsistentIntervals.Count == 0)
        {
            h.Append("<p>None.</p>\n");
        }
        else
        {
            h.Append("<table><tr><th>from, h</th><th>to, h</th><th>first diagnosis</th></tr>\n");
            foreach (var (from, to, suspect) in s.InconsistentIntervals.Take(200))
            {
                h.Append(string.Create(ci, $"<tr><td>{from:F2}</td><td>{to:F2}</td><td>")).Append(E(suspect)).Append("</td></tr>\n");
            }

            h.Append("</table>\n");
        }

        h.Append("<h2>Skipped input rows</h2>\n");
        if (result.SkippedRows == 0)
        {
            h.Append("<p>None.</p>\n");
        }
        else
        {
            h.Append(string.Create(ci, $"<p>{result.SkippedRows} rows skipped; the first {result.FirstSkipped.Count}:</p>\n<table><tr><th>file</th><th>line</th><th>reason</th></tr>\n"));
            foreach (var r in result.FirstSkipped)
            {
                h.Append("<tr><td>").Append(E(Path.GetFileName(r.File))).Append("</td><td>").Append(r.Line.ToString(ci)).Append("</td><td>")
                 .Append(E(r.Reason)).Append("</td></tr>\n");
            }

            h.Append("</table>\n");
        }

        h.Append(extraHtml ?? string.Empty);
        h.Append("<h2>Methods</h2>\n<p>OUR and CER from the inert-gas balance (CER is the CO2 transfer rate; no dissolved-CO2 correction); ")
         .Append("reconciliation and the χ² consistency test of the elemental balances (Wang &amp; Stephanopoulos 1983; van der Heijden et al. 1994); ")
         .Append("biomass by integrating the reconciled growth rate, corrected by offline samples with a Kalman update; a second observer: ")
         .Append("an extended Kalman filter with Pirt's law for OUR (Jenzsch et al. 2006). See docs/replay.md.</p>\n</body></html>\n");
        File.WriteAllText(Path.Combine(dir, "report.html"), h.ToString(), new UTF8Encoding(false));
    }

    private static void Row(StringBuilder h, string name, string value) =>
        h.Append("<tr><th>").Append(E(name)).Append("</th><td>").Append(E(value)).Append("</td></tr>\n");

    private static string E(string s) => WebUtility.HtmlEncode(s);
}
