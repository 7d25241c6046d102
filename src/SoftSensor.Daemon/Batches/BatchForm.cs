using System.Globalization;
using System.Net;
using System.Text;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Batches;

/// <summary>
/// The operator's batch page on the status server: <c>GET /batches</c> shows each reactor's open batch
/// with a start form (initial conditions) and an end button; the forms post to
/// <c>POST /batches/{reactor}/start</c> and <c>/end</c>, which answer with the page and the outcome.
/// </summary>
internal static class BatchForm
{
    public static void MapBatchForm(this IEndpointRouteBuilder app)
    {
        app.MapGet("/batches", (HttpContext context, BatchBook book, IOptions<SoftSensorOptions> o) => Page(context, book, o.Value, ""));
        app.MapPost("/batches/{reactor}/start", async (string reactor, HttpRequest request, BatchBook book, IOptions<SoftSensorOptions> o) =>
        {
            var form = await request.ReadFormAsync(request.HttpContext.RequestAborted);
            double N(string key) => double.TryParse(form[key].ToString(), NumberStyles.Float, CultureInfo.InvariantCulture, out var v) ? v : double.NaN;
            var (run, problems) = book.Start(reactor, new BatchStart(form["batchId"].ToString(), N("initialVolumeL"), N("inoculumBiomassGPerL"), N("inoculumBiomassSigmaGPerL"), N("initialSubstrateGPerL"))
            {
                Source = Access.AccessMiddleware.UserName(request.HttpContext) ?? "operator",
            });
            return Page(request.HttpContext, book, o.Value, run is null ? "Refused: " + string.Join("; ", problems) : $"Started batch {run.BatchId} on {reactor}.");
        });
        app.MapPost("/batches/{reactor}/phase", async (string reactor, HttpRequest request, BatchBook book, IOptions<SoftSensorOptions> o) =>
        {
            var form = await request.ReadFormAsync(request.HttpContext.RequestAborted);
            var (run, problem) = book.SetPhase(reactor, form["phase"].ToString(), Access.AccessMiddleware.UserName(request.HttpContext) ?? "operator");
            return Page(request.HttpContext, book, o.Value, run is null ? "Refused: " + problem : $"Batch {run.BatchId} on {reactor} is now in phase {run.Phase}.");
        });
        app.MapPost("/batches/{reactor}/end", (string reactor, HttpContext context, BatchBook book, IOptions<SoftSensorOptions> o) =>
        {
            var (run, problem) = book.End(reactor);
            return Page(context, book, o.Value, run is null ? "Refused: " + problem : $"Ended batch {run.BatchId} on {reactor}.");
        });
    }

    private static IResult Page(HttpContext context, BatchBook book, SoftSensorOptions o, string message)
    {
        string csrf = Access.AccessMiddleware.FormField(context);
        var h = new StringBuilder(Report.PageChrome.Top("Batches", "batches"));
        h.Append("<h2>Batches</h2>");
        if (message.Length > 0)
        {
            h.Append("<p id=\"outcome\">").Append(WebUtility.HtmlEncode(message)).Append("</p>");
        }

        foreach (var r in o.Reactors)
        {
            string id = WebUtility.HtmlEncode(r.Id);
            h.Append("<section class=\"card\"><h2>Reactor ").Append(id).Append("</h2>");
            if (book.Current(r.Id) is { } run)
            {
                h.Append(CultureInfo.InvariantCulture, $"<p>Open batch <b>{WebUtility.HtmlEncode(run.BatchId)}</b> since {run.StartedAt:O}: {run.InitialVolumeL} L, inoculum {run.InoculumBiomassGPerL} ± {run.InoculumBiomassSigmaGPerL} g/L, substrate {run.InitialSubstrateGPerL} g/L.</p>");
                h.Append(CultureInfo.InvariantCulture, $"<p>Phase <b id=\"phase-{id}\">{WebUtility.HtmlEncode(run.Phase)}</b> since {run.PhaseSince:O}.</p>");
                h.Append("<form method=\"post\" action=\"/batches/").Append(id).Append("/phase\">").Append(csrf).Append("<select name=\"phase\">");
                foreach (var p in Core.Batches.BatchPhases.All)
                {
                    string pid = Core.Batches.BatchPhases.Id(p);
                    h.Append("<option").Append(pid == run.Phase ? " selected" : "").Append('>').Append(pid).Append("</option>");
                }

                h.Append("</select> <button>Set phase</button></form>");
                h.Append("<form method=\"post\" action=\"/batches/").Append(id).Append("/end\">").Append(csrf).Append("<button>End batch</button></form>");
            }
            else
            {
                h.Append("<form class=\"entry\" method=\"post\" action=\"/batches/").Append(id).Append("/start\">").Append(csrf);
                foreach (var (name, label) in new[] { ("batchId", "Batch id"), ("initialVolumeL", "Initial volume, L"), ("inoculumBiomassGPerL", "Inoculum biomass, g/L"), ("inoculumBiomassSigmaGPerL", "Its standard uncertainty, g/L"), ("initialSubstrateGPerL", "Initial substrate, g/L") })
                {
                    h.Append("<label>").Append(label).Append(" <input name=\"").Append(name).Append("\"></label><br>");
                }

                h.Append("<button>Start batch</button></form>");
            }

            h.Append("</section>");
        }

        return Results.Content(h.Append(Report.PageChrome.Bottom).ToString(), "text/html; charset=utf-8");
    }
}
