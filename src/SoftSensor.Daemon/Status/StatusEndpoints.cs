using System.Text.Json;
using System.Text.Json.Serialization;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Mqtt;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Store;
using static SoftSensor.Daemon.Status.StatusDocuments;

namespace SoftSensor.Daemon.Status;

/// <summary>
/// The status page and its API (loopback by default): <c>/</c> the page, <c>/api/status</c> current
/// estimates and input health, <c>/api/trends?reactor=&amp;hours=</c> trends from the store,
/// <c>/api/estimates?reactor=&amp;name=&amp;from=&amp;to=</c> stored estimates, <c>/api/alarms</c>
/// active alarms, <c>/metrics</c> Prometheus text.
/// </summary>
internal static class StatusEndpoints
{
    /// <summary>Estimates drawn as trends on the page.</summary>
    public static readonly string[] TrendNames = [EstimateNames.Our, EstimateNames.Cer, EstimateNames.Rq, EstimateNames.MuPerH, EstimateNames.BiomassGPerL];

    private const int MaxPoints = 720;

    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web)
    {
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.CamelCase) },
    };

    public static void MapStatusEndpoints(this IEndpointRouteBuilder app)
    {
        app.MapGet("/", async (StatusBoard board, MqttLink link, Batches.BatchBook book, SqliteStore store, Samples.SampleBook samples, IOptions<SoftSensorOptions> o, TimeProvider time, Store.StoreHealth health, CancellationToken ct) =>
        {
            // The page carries its status and trends, so the first paint already shows values and plots.
            var status = Current(board, link, book, o.Value, time, health);
            var trends = new List<TrendDoc>();
            foreach (var r in status.Reactors)
            {
                trends.Add(await TrendDocAsync(r.Id, null, store, samples, o.Value, ct));
            }

            return Results.Content(StatusPage.With(JsonSerializer.Serialize(status, Json), JsonSerializer.Serialize(trends, Json)), "text/html; charset=utf-8");
        });
        app.MapGet("/api/status", (StatusBoard board, MqttLink link, Batches.BatchBook book, IOptions<SoftSensorOptions> o, TimeProvider time, Store.StoreHealth health) =>
            Results.Json(Current(board, link, book, o.Value, time, health), Json));
        app.MapGet("/api/trends", TrendsAsync);
        app.MapGet("/api/estimates", EstimatesAsync);
        app.MapGet("/api/alarms", async (SqliteStore store, CancellationToken ct) =>
            Results.Json((await store.ActiveAlarmsAsync(ct)).Select(a => new AlarmDoc(a.Reactor, a.AlarmId, a.Time, a.State, a.Priority, Finite(a.Value), a.Message)).ToList(), Json));
        app.MapGet("/metrics", (PrometheusExporter exporter) => Results.Text(exporter.Render(), PrometheusExporter.ContentType));
    }

    private static DaemonDoc Current(StatusBoard board, MqttLink link, Batches.BatchBook book, SoftSensorOptions o, TimeProvider time, Store.StoreHealth health) =>
        new($"mqtt://{o.Mqtt.Host}:{o.Mqtt.Port}", link.IsOnline, link.Connections, time.GetUtcNow(),
            board.All.Select(s => Reactor(s, o.Reactors.FirstOrDefault(r => r.Id == s.Reactor)?.Tags, book.Current(s.Reactor))).ToList())
        { Store = StatusDocuments.Store(health) };

    private static async Task<IResult> TrendsAsync(string? reactor, double? hours, SqliteStore store, Samples.SampleBook samples, IOptions<SoftSensorOptions> o, CancellationToken ct)
    {
        var id = reactor ?? o.Value.Reactors.FirstOrDefault()?.Id;
        if (id is null || o.Value.Reactors.All(r => r.Id != id))
        {
            return Results.Json(new { error = $"reactor '{reactor}' is not configured (expected one of {string.Join(", ", o.Value.Reactors.Select(r => r.Id))})" }, Json, statusCode: 400);
        }

        return Results.Json(await TrendDocAsync(id, hours, store, samples, o.Value, ct), Json);
    }

    private static async Task<TrendDoc> TrendDocAsync(string id, double? hours, SqliteStore store, Samples.SampleBook samples, SoftSensorOptions o, CancellationToken ct)
    {
        var to = await store.LatestFrameTimeAsync(id, ct);
        var series = new Dictionary<string, TrendSeries>(StringComparer.Ordinal);
        if (to is null)
        {
            return new TrendDoc(id, null, null, series);
        }

        var from = to.Value - TimeSpan.FromHours(Math.Clamp(hours ?? o.Status.TrendHours, 0.01, 24 * 30));
        foreach (var name in TrendNames)
        {
            var rows = await store.QueryEstimatesAsync(id, name, from, to.Value, 100_000, ct);
            int step = Math.Max(1, (rows.Count + MaxPoints - 1) / MaxPoints);
            var picked = rows.Where((_, i) => i % step == 0 || i == rows.Count - 1).ToList();
            if (picked.Count > 0)
            {
                series[name] = new TrendSeries(
                    picked[0].Unit,
                    picked.Select(r => r.Time.ToUnixTimeMilliseconds()).ToList(),
                    picked.Select(r => Finite(r.Value)).ToList(),
                    picked.Select(r => (int)r.Quality).ToList());
            }
        }

        var corrected = samples.Latest(id, from, to.Value);
        int every = Math.Max(1, (corrected.Count + MaxPoints - 1) / MaxPoints);
        var kept = corrected.Where((_, i) => i % every == 0 || i == corrected.Count - 1).ToList();
        return new TrendDoc(id, from, to, series)
        {
            CorrectedBiomass = kept.Count == 0 ? null
                : new TrendSeries("g/L", kept.Select(p => p.Time.ToUnixTimeMilliseconds()).ToList(), kept.Select(p => Finite(p.BiomassGPerL)).ToList(), kept.Select(_ => 0).ToList()),
        };
    }

    private static async Task<IResult> EstimatesAsync(string reactor, string? name, DateTimeOffset? from, DateTimeOffset? to, int? limit, SqliteStore store, CancellationToken ct)
    {
        var rows = await store.QueryEstimatesAsync(reactor, name, from ?? DateTimeOffset.UnixEpoch, to ?? DateTimeOffset.MaxValue.AddDays(-1), Math.Clamp(limit ?? 1000, 1, 100_000), ct);
        return Results.Json(rows.Select(r => new { r.Reactor, r.Name, r.Time, Value = Finite(r.Value), Sigma = Finite(r.Sigma), r.Unit, Quality = EstimatePayload.Name(r.Quality), r.StatusCode }).ToList(), Json);
    }
}
