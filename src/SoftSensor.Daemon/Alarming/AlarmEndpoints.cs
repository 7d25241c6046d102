using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;
using SoftSensor.Core.Alarms;

namespace SoftSensor.Daemon.Alarming;

/// <summary>
/// The status page's alarm API: <c>GET /api/alarm-states</c> (every alarm of every reactor with its
/// ISA-18.2 state), <c>GET /api/alarm-journal?reactor=&amp;limit=</c> (newest transitions first),
/// <c>POST /api/alarm-commands</c> (the command JSON of <see cref="AlarmCommandPayload"/>; 200 when
/// applied, 409 with the reason when refused, 400 for a malformed command).
/// </summary>
internal static class AlarmEndpoints
{
    /// <summary>The status page's alarm panel script (embedded resource).</summary>
    private static readonly Lazy<string> Panel = new(() =>
    {
        using var s = typeof(AlarmEndpoints).Assembly.GetManifestResourceStream("SoftSensor.Daemon.Alarming.AlarmPanel.js")
            ?? throw new InvalidOperationException("embedded resource SoftSensor.Daemon.Alarming.AlarmPanel.js is missing from the build");
        using var r = new StreamReader(s);
        return r.ReadToEnd();
    });

    public static void MapAlarmEndpoints(this IEndpointRouteBuilder app)
    {
        if (app.ServiceProvider.GetService<AlarmService>() is null)
        {
            return; // no rules configured
        }

        app.MapGet("/alarm-panel.js", () => Results.Text(Panel.Value, "text/javascript; charset=utf-8"));
        app.MapGet("/api/alarm-states", (AlarmService alarms) => Results.Json(alarms.Engine.States(), AlarmPayloads.Json));
        app.MapGet("/api/alarm-journal", (string? reactor, int? limit, AlarmService alarms) =>
            Results.Json(alarms.Journal.Recent(reactor, Math.Clamp(limit ?? 100, 1, 10_000))
                .Select(e => AlarmPayloads.Event(e.Reactor, alarms.Engine.Rules.FirstOrDefault(r => r.Id == e.Transition.RuleId)
                    ?? new AlarmRule { Id = e.Transition.RuleId, Kind = AlarmConditionKind.BadQuality, Source = default, Message = e.Message }, e.Transition)).ToList(),
                AlarmPayloads.Json));
        app.MapPost("/api/alarm-commands", async (HttpRequest request, AlarmService alarms, CancellationToken ct) =>
        {
            using var body = new MemoryStream();
            await request.Body.CopyToAsync(body, ct);
            if (body.Length > 4096)
            {
                return Results.Json(new AlarmCommandReply(false, "alarm command: body above 4096 bytes", []), AlarmPayloads.Json, statusCode: 400);
            }

            var result = await alarms.CommandAsync(body.ToArray(), null, ct, Access.AccessMiddleware.UserName(request.HttpContext));
            var reply = new AlarmCommandReply(result.Applied, result.Message,
                [.. result.Transitions.Select(t => new AlarmCommandReplyItem(t.RuleId, AlarmStates.Id(t.From), AlarmStates.Id(t.To)))]);
            int status = result.Applied ? 200 : result.Message.StartsWith("alarm command:", StringComparison.Ordinal) ? 400 : 409;
            return Results.Json(reply, AlarmPayloads.Json, statusCode: status);
        });
    }
}
