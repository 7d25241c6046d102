using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Batches;

/// <summary>
/// Batch commands on the status API: <c>GET /api/batches/{reactor}</c> the open batch (404 when none),
/// <c>POST /api/batches/{reactor}/start</c> with a <see cref="BatchStart"/> JSON body,
/// <c>POST /api/batches/{reactor}/end</c>, <c>POST /api/batches/{reactor}/phase</c> with <c>{"phase": "induced"}</c>,
/// <c>GET /api/batches/{reactor}/phases</c> the open batch's phase changes. Bad commands answer 400 with every problem.
/// </summary>
internal static class BatchEndpoints
{
    /// <summary>Registers the batch book (one line in the host's services).</summary>
    public static IServiceCollection AddBatches(this IServiceCollection services) =>
        services.AddSingleton<BatchBook>().AddHostedService<BatchCommandListener>()
            .AddSingleton<BatchReports>().AddHostedService(sp => sp.GetRequiredService<BatchReports>());

    public static void MapBatchEndpoints(this IEndpointRouteBuilder app)
    {
        // The batch book is the one source of the open batch: without one, the answer names the configured id the frames carry instead.
        app.MapGet("/api/batches/{reactor}", (string reactor, BatchBook book, IOptions<SoftSensorOptions> o) =>
            Known(o.Value, reactor) is { } bad ? bad
            : book.Current(reactor) is { } run ? Results.Ok(run)
            : Results.NotFound(new { problems = new[] { $"reactor '{reactor}' has no open batch" }, configuredBatchId = o.Value.Reactors.First(r => r.Id == reactor).BatchId }));
        app.MapPost("/api/batches/{reactor}/start", (string reactor, BatchStart body, HttpContext context, BatchBook book, IOptions<SoftSensorOptions> o) =>
        {
            if (Known(o.Value, reactor) is { } bad)
            {
                return bad;
            }

            var (run, problems) = book.Start(reactor, body with { Source = Access.AccessMiddleware.UserName(context) ?? body.Source });
            return run is null ? Results.BadRequest(new { problems }) : Results.Ok(run);
        });
        app.MapPost("/api/batches/{reactor}/end", (string reactor, BatchBook book, IOptions<SoftSensorOptions> o) =>
        {
            if (Known(o.Value, reactor) is { } bad)
            {
                return bad;
            }

            var (run, problem) = book.End(reactor);
            return run is null ? Results.BadRequest(new { problems = new[] { problem } }) : Results.Ok(run);
        });
        app.MapPost("/api/batches/{reactor}/phase", (string reactor, PhaseCommand body, HttpContext context, BatchBook book, IOptions<SoftSensorOptions> o) =>
        {
            if (Known(o.Value, reactor) is { } bad)
            {
                return bad;
            }

            var (run, problem) = book.SetPhase(reactor, body.Phase, Access.AccessMiddleware.UserName(context) ?? "operator");
            return run is null ? Results.BadRequest(new { problems = new[] { problem } }) : Results.Ok(run);
        });
        app.MapGet("/api/batches/{reactor}/phases", (string reactor, BatchBook book, IOptions<SoftSensorOptions> o) =>
            Known(o.Value, reactor) is { } bad ? bad
            : book.Current(reactor) is { } run ? Results.Ok(book.Phases(reactor, run.BatchId))
            : Results.NotFound(new { problems = new[] { $"reactor '{reactor}' has no open batch" } }));
    }

    private static IResult? Known(SoftSensorOptions o, string reactor) =>
        o.Reactors.Any(r => r.Id == reactor) ? null
        : Results.NotFound(new { problems = new[] { $"reactor is '{reactor}' (expected one of {string.Join(", ", o.Reactors.Select(r => r.Id))})" } });
}

/// <summary>The body of a phase command: a phase id (batch, fed-batch, induced, harvest).</summary>
internal sealed record PhaseCommand(string? Phase);
