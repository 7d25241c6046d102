using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Samples;

/// <summary>
/// Operator inputs on the status API: <c>POST /api/samples/{reactor}</c> with the JSON of
/// <see cref="SamplePayload"/> (200 with the stored input, 400 with every problem);
/// <c>GET /api/samples/{reactor}?batch=</c> the inputs, newest first; <c>GET /api/samples/{reactor}/{id}</c> one;
/// <c>GET /api/corrected/{reactor}/{id}</c> the corrected trajectory stored after input id.
/// </summary>
internal static class SampleEndpoints
{
    /// <summary>Registers the sample book, the intake and the MQTT listener.</summary>
    public static IServiceCollection AddOperatorSamples(this IServiceCollection services) =>
        services.AddSingleton<SampleBook>().AddSingleton<Batches.IBatchSamples>(sp => sp.GetRequiredService<SampleBook>()).AddSingleton<SampleIntake>().AddHostedService<SampleCommandListener>();

    public static void MapSampleEndpoints(this IEndpointRouteBuilder app)
    {
        app.MapPost("/api/samples/{reactor}", async (string reactor, HttpRequest request, SampleIntake intake) =>
        {
            using var body = new MemoryStream();
            await request.Body.CopyToAsync(body, request.HttpContext.RequestAborted);
            var (record, problems) = intake.Enter(reactor, body.ToArray(), "http", Access.AccessMiddleware.UserName(request.HttpContext));
            return record is null ? Results.Json(new SampleReply(false, null, problems), SampleCommandListener.Json, statusCode: 400)
                : Results.Json(new SampleReply(true, record, []), SampleCommandListener.Json);
        });
        app.MapGet("/api/samples/{reactor}", (string reactor, string? batch, int? limit, SampleBook book, IOptions<SoftSensorOptions> o) =>
            Unknown(o.Value, reactor) ?? Results.Json(book.List(reactor, batch, limit ?? 200), SampleCommandListener.Json));
        app.MapGet("/api/samples/{reactor}/{id:long}", (string reactor, long id, SampleBook book, IOptions<SoftSensorOptions> o) =>
            Unknown(o.Value, reactor) ?? (book.Get(id) is { } r && r.Reactor == reactor ? Results.Json(r, SampleCommandListener.Json)
                : Results.NotFound(new { problems = new[] { $"sample is {id} (expected the id of an input of reactor '{reactor}')" } })));
        app.MapGet("/api/corrected/{reactor}/{id:long}", (string reactor, long id, SampleBook book, IOptions<SoftSensorOptions> o) =>
            Unknown(o.Value, reactor) ?? Results.Json(book.Trajectory(reactor, id).Select(Doc).ToList(), SampleCommandListener.Json));
    }

    /// <summary>A corrected point for JSON (null for a value that could not be computed).</summary>
    public static object Doc(CorrectedPoint p) => new
    {
        p.Reactor, p.Batch, p.SampleId, p.Time, BiomassGPerL = Finite(p.BiomassGPerL), BiomassSigmaGPerL = Finite(p.BiomassSigmaGPerL),
        IntegratorGPerL = Finite(p.IntegratorGPerL), EkfGPerL = Finite(p.EkfGPerL), VolumeL = Finite(p.VolumeL),
    };

    private static IResult? Unknown(SoftSensorOptions o, string reactor) =>
        o.Reactors.Any(r => r.Id == reactor) ? null
        : Results.NotFound(new { problems = new[] { $"reactor is '{reactor}' (expected one of {string.Join(", ", o.Reactors.Select(r => r.Id))})" } });

    private static double? Finite(double v) => double.IsFinite(v) ? v : null;
}
