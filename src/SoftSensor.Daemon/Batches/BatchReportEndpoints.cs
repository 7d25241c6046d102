using System.Net;
using System.Text;
using System.Text.RegularExpressions;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;

namespace SoftSensor.Daemon.Batches;

/// <summary>
/// The batch reports on the status server: <c>GET /reports</c> lists them per reactor,
/// <c>GET /reports/{reactor}/{batch}/{file}</c> serves a report's <c>report.html</c> or one of its PNG
/// figures (nothing else: no other names, no paths). Everything is served from the data folder; no CDN.
/// </summary>
internal static partial class BatchReportEndpoints
{
    public static void MapBatchReports(this IEndpointRouteBuilder app)
    {
        app.MapGet("/reports", (BatchReports reports) =>
        {
            var h = new StringBuilder(Report.PageChrome.Top("Batch reports", "reports"));
            h.Append("<h2>Batch reports</h2>");
            var list = reports.List();
            if (list.Count == 0)
            {
                h.Append("<p>No batch has ended yet.</p>");
            }

            foreach (var reactor in list.GroupBy(r => r.Reactor))
            {
                h.Append("<section class=\"card\"><h3>Reactor ").Append(E(reactor.Key)).Append("</h3><ul>");
                foreach (var (r, b, written) in reactor)
                {
                    h.Append("<li><a href=\"/reports/").Append(Uri.EscapeDataString(r)).Append('/').Append(Uri.EscapeDataString(b)).Append("/report.html\">")
                     .Append(E(b)).Append("</a> (written ").Append(E(written.ToString("O", System.Globalization.CultureInfo.InvariantCulture))).Append(")</li>");
                }

                h.Append("</ul></section>");
            }

            return Results.Content(h.Append(Report.PageChrome.Bottom).ToString(), "text/html; charset=utf-8");
        });
        app.MapGet("/reports/{reactor}/{batch}/{file}", (string reactor, string batch, string file, BatchReports reports) =>
        {
            if (!SafeName().IsMatch(reactor) || !SafeName().IsMatch(batch) || !(file == "report.html" || FigureName().IsMatch(file)))
            {
                return Results.NotFound();
            }

            string path = Path.Combine(reports.Root, reactor, batch, file);
            return File.Exists(path)
                ? Results.File(path, file.EndsWith(".png", StringComparison.Ordinal) ? "image/png" : "text/html; charset=utf-8")
                : Results.NotFound();
        });
    }

    private static string E(string s) => WebUtility.HtmlEncode(s);

    [GeneratedRegex("^[A-Za-z0-9_-][A-Za-z0-9._-]{0,127}$")]
    private static partial Regex SafeName();

    [GeneratedRegex("^[a-z0-9_-]{1,64}\\.png$")]
    private static partial Regex FigureName();
}
