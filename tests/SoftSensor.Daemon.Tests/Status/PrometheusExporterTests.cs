using System.Diagnostics.Metrics;
using Microsoft.Extensions.DependencyInjection;
using SoftSensor.Daemon.Status;
using SoftSensor.Daemon.Timeseries;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Tests.Status;

/// <summary>
/// The text exposition of <c>/metrics</c> (Prometheus exposition format 0.0.4, "Exposition formats" in
/// the Prometheus documentation): the outbox's meter is exported beside the daemon's, gauges as their
/// value at the scrape with <c># TYPE ... gauge</c>, counters with the <c>_total</c> suffix, metric names
/// in <c>[a-zA-Z_:][a-zA-Z0-9_:]*</c> (dots are not allowed); another daemon's meters in the same
/// process are not.
/// </summary>
public sealed class PrometheusExporterTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-prom-").FullName;

    public void Dispose()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_dir, recursive: true);
    }

    [Fact]
    public void Render_OutboxMeter_ExportedAsGaugesAndCountersWithPrometheusNames()
    {
        using var provider = new ServiceCollection().AddMetrics().BuildServiceProvider();
        using var other = new ServiceCollection().AddMetrics().BuildServiceProvider();
        var factory = provider.GetRequiredService<IMeterFactory>();
        var metrics = new DaemonMetrics(factory);
        using var store = new OutboxStore(Path.Combine(_dir, "outbox.db"), 1_000_000);
        var outbox = new TimeseriesMetrics(factory, store, TimeProvider.System);
        var foreign = new TimeseriesMetrics(other.GetRequiredService<IMeterFactory>(), store, TimeProvider.System);
        using var exporter = new PrometheusExporter(metrics);

        outbox.SendFailed();
        outbox.Sent(12);
        foreign.Sent(1000);
        string text = exporter.Render();

        Assert.Contains("# TYPE softsensor_outbox_depth gauge\n", text, StringComparison.Ordinal);
        Assert.Contains("\nsoftsensor_outbox_depth 0\n", text, StringComparison.Ordinal);
        Assert.Contains("\nsoftsensor_outbox_fill 0\n", text, StringComparison.Ordinal);
        Assert.Contains("# TYPE softsensor_outbox_send_failures_total counter\n", text, StringComparison.Ordinal);
        Assert.Contains("\nsoftsensor_outbox_send_failures_total 1\n", text, StringComparison.Ordinal);
        Assert.Contains("\nsoftsensor_outbox_points_sent_total 12\n", text, StringComparison.Ordinal);
        Assert.DoesNotContain("softsensor.outbox", text, StringComparison.Ordinal);
        foreach (string line in text.Split('\n', StringSplitOptions.RemoveEmptyEntries).Where(l => !l.StartsWith('#')))
        {
            string name = line.Split('{', ' ')[0];
            Assert.Matches("^[a-zA-Z_:][a-zA-Z0-9_:]*$", name);
        }
    }
}
