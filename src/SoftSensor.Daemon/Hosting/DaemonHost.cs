using SoftSensor.Daemon.Batches;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using SoftSensor.Daemon.Access;
using SoftSensor.Daemon.Alarming;
using SoftSensor.Daemon.Status;

namespace SoftSensor.Daemon.Hosting;

/// <summary>
/// Builds the daemon: an ASP.NET Core host (the status page runs in-process) with systemd
/// integration (Type=notify; journal-formatted logs under systemd), the layered configuration,
/// the daemon's services and the status endpoints on <c>status:url</c>.
/// </summary>
internal static class DaemonHost
{
    /// <summary>Shutdown budget of the host; deploy/softsensor.service sets TimeoutStopSec above it.</summary>
    public static readonly TimeSpan ShutdownTimeout = TimeSpan.FromSeconds(20);

    /// <summary>Builds (does not start) the host.</summary>
    public static WebApplication Build(DaemonHostSettings settings)
    {
        var builder = WebApplication.CreateSlimBuilder(new WebApplicationOptions { Args = [], ContentRootPath = Directory.GetCurrentDirectory() });
        DaemonConfiguration.Apply(builder.Configuration, settings);
        builder.Services.AddSystemd();
        builder.Services.Configure<HostOptions>(o => o.ShutdownTimeout = ShutdownTimeout);
        builder.Logging.ClearProviders();
        builder.Logging.AddSimpleConsole(o =>
        {
            o.SingleLine = true;
            o.TimestampFormat = "yyyy-MM-ddTHH:mm:ssZ ";
            o.UseUtcTimestamp = true;
        });
        builder.Logging.SetMinimumLevel(settings.ConsoleLevel);
        builder.Logging.AddFilter("Microsoft", LogLevel.Warning);
        // A start failure (e.g. invalid configuration) is reported by DaemonRunner in one line; the host's own stack-trace log would repeat it.
        builder.Logging.AddFilter("Microsoft.Extensions.Hosting.Internal.Host", LogLevel.Critical);
        builder.Services.AddSoftSensorDaemon(builder.Configuration);
        builder.Services.AddSingleton(new Pipeline.ConfigLocation(settings.ConfigFile is { } config ? Path.GetDirectoryName(Path.GetFullPath(config))! : Directory.GetCurrentDirectory()));
        builder.Services.AddSingleton(new DefinitionFile(settings.ConfigFile is { } file ? Path.GetFullPath(file) : null));
        builder.Services.AddSingleton<DaemonStatusFile>().AddHostedService(sp => sp.GetRequiredService<DaemonStatusFile>());
        settings.ConfigureServices?.Invoke(builder.Services);
        builder.Services.AddAccessControl(builder.Configuration);
        builder.WebHost.UseUrls(builder.Configuration["status:url"] ?? new Configuration.StatusOptions().Url);
        builder.WebHost.ConfigureServerLimits(builder.Configuration);
        var app = builder.Build();
        app.UseAccessControl();
        // The exporter listens from the start, so /metrics counts what happened before its first request.
        app.Services.GetRequiredService<PrometheusExporter>();
        app.MapStatusEndpoints();
        app.MapAlarmEndpoints();
        app.MapBatchEndpoints();
        app.MapBatchForm();
        app.MapBatchReports();
        Samples.SampleEndpoints.MapSampleEndpoints(app);
        Samples.SampleForm.MapSampleForm(app);
        return app;
    }

    /// <summary>The status page's address after start (the real port when the URL asked for port 0).</summary>
    public static string StatusAddress(WebApplication app)
    {
        var addresses = app.Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>();
        return addresses?.Addresses.FirstOrDefault() ?? app.Urls.FirstOrDefault() ?? "";
    }
}
