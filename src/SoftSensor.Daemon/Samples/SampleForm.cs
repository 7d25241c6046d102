using System.Globalization;
using System.Net;
using System.Text;
using System.Text.Json;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Samples;

/// <summary>
/// The operator's lab page on the status server: <c>GET /samples</c> shows, per reactor, a form for an
/// offline sample or a withdrawal and the inputs entered so far with their outcome (substrate and product
/// assays included); the form posts to <c>POST /samples/{reactor}</c>, which answers with the page and
/// the outcome. The form's fields are the payload's (<see cref="SamplePayload"/>); empty ones are left out.
/// </summary>
internal static class SampleForm
{
    private static readonly (string Name, string Label)[] Fields =
    [
        ("sampledAt", "Sampled at (UTC, e.g. 2026-03-01T10:00:00Z)"), ("valueGPerL", "Value, g/L (dcw, substrate, product)"),
        ("sigmaGPerL", "Its standard uncertainty, g/L"), ("od", "OD"), ("odSigma", "OD standard uncertainty"),
        ("factorGPerLPerOd", "Calibration, g/L per OD"), ("factorSigmaGPerLPerOd", "Calibration standard uncertainty"),
        ("withdrawnMl", "Withdrawn, mL"), ("analyte", "Analyte"),
    ];

    private static readonly string[] Numbers = ["valueGPerL", "sigmaGPerL", "od", "odSigma", "factorGPerLPerOd", "factorSigmaGPerLPerOd", "withdrawnMl"];

    public static void MapSampleForm(this IEndpointRouteBuilder app)
    {
        app.MapGet("/samples", (HttpContext context, SampleBook book, IOptions<SoftSensorOptions> o) => Page(context, book, o.Value, ""));
        app.MapPost("/samples/{reactor}", async (string reactor, HttpRequest request, SampleBook book, SampleIntake intake, IOptions<SoftSensorOptions> o) =>
        {
            var form = await request.ReadFormAsync(request.HttpContext.RequestAborted);
            var payload = new Dictionary<string, object>(StringComparer.Ordinal) { ["kind"] = form["kind"].ToString() };
            var problems = new List<string>();
            foreach (var (name, _) in Fields)
            {
                string text = form[name].ToString().Trim();
                if (text.Length == 0)
                {
                    continue;
                }

                if (Array.IndexOf(Numbers, name) < 0)
                {
                    payload[name] = text;
                }
                else if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v))
                {
                    payload[name] = v;
                }
                else
                {
                    problems.Add($"{name} is '{text}' (expected a number with a decimal point)");
                }
            }

            if (problems.Count > 0)
            {
                book.CountRejected(reactor);
                return Page(request.HttpContext, book, o.Value, "Refused: " + string.Join("; ", problems));
            }

            // The journal names the logged-in user, never a name typed into the form.
            var (record, refused) = intake.Enter(reactor, JsonSerializer.SerializeToUtf8Bytes(payload), "form", Access.AccessMiddleware.UserName(request.HttpContext));
            return Page(request.HttpContext, book, o.Value, record is null ? "Refused: " + string.Join("; ", refused) : $"Stored input {record.Id} on {reactor}: {record.Outcome}.");
        });
    }

    private static IResult Page(HttpContext context, SampleBook book, SoftSensorOptions o, string message)
    {
        var ci = CultureInfo.InvariantCulture;
        var h = new StringBuilder(Report.PageChrome.Top("Lab samples", "samples"));
        h.Append("<h2>Offline samples and removals</h2>");
        if (message.Length > 0)
        {
            h.Append("<p id=\"outcome\">").Append(WebUtility.HtmlEncode(message)).Append("</p>");
        }

        foreach (var r in o.Reactors)
        {
            string id = WebUtility.HtmlEncode(r.Id);
            h.Append("<section class=\"card\"><h2>Reactor ").Append(id).Append("</h2><form class=\"entry\" method=\"post\" action=\"/samples/").Append(id).Append("\">").Append(Access.AccessMiddleware.FormField(context));
            h.Append("<label>Kind <select name=\"kind\"><option>dcw</option><option>od</option><option>substrate</option><option>product</option><option>removal</option></select></label><br>");
            foreach (var (name, label) in Fields)
            {
                h.Append("<label>").Append(label).Append(" <input name=\"").Append(name).Append("\"></label><br>");
            }

            h.Append("<button>Enter</button></form>");
            h.Append("<table><tr><th>id</th><th>batch</th><th>kind</th><th>analyte</th><th>sampled</th><th>value g/L</th><th>± g/L</th><th>withdrawn mL</th><th>outcome</th><th>prior → posterior g/L</th><th>detail</th></tr>");
            foreach (var s in book.List(r.Id, null, 50))
            {
                string shift = s.PriorGPerL is { } a && s.PosteriorGPerL is { } b ? string.Create(ci, $"{a:0.###} → {b:0.###}") : "";
                h.Append(ci, $"<tr id=\"sample-{s.Id}\"><td>{s.Id}</td><td>{E(s.Batch)}</td><td>{s.Kind}</td><td>{E(s.Analyte)}</td><td>{s.SampledAt.UtcDateTime:yyyy-MM-ddTHH:mm:ssZ}</td>")
                 .Append(ci, $"<td>{s.ValueGPerL:0.####}</td><td>{s.SigmaGPerL:0.####}</td><td>{s.WithdrawnL * 1000:0.#}</td><td>{s.Outcome}</td><td>{shift}</td><td>{E(s.Detail)}</td></tr>");
            }

            h.Append("</table></section>");
        }

        return Results.Content(h.Append(Report.PageChrome.Bottom).ToString(), "text/html; charset=utf-8");
    }

    private static string E(string? s) => WebUtility.HtmlEncode(s ?? "");
}
