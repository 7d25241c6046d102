using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Sinks;
using SoftSensor.Daemon.Store;

namespace SoftSensor.Daemon.Timeseries;

/// <summary>Registers the time-series sink, its outbox and sender (one line in the host: <c>services.AddTimeseries(configuration)</c>).</summary>
internal static class TimeseriesServices
{
    public static IServiceCollection AddTimeseries(this IServiceCollection services, IConfiguration configuration)
    {
        var section = configuration.GetSection(TimeseriesOptions.Section);
        services.AddOptions<TimeseriesOptions>().Bind(section)
            .PostConfigure(o =>
            {
                // The outbox lives in the daemon's store file unless configured elsewhere.
                if (section["outboxPath"] is null)
                {
                    o.OutboxPath = configuration["store:path"] ?? "data/softsensor.db";
                }
            })
            .ValidateOnStart();
        services.TryAddEnumerable(ServiceDescriptor.Singleton<IValidateOptions<TimeseriesOptions>, TimeseriesOptionsValidator>());
        services.TryAddSingleton(TimeProvider.System);
        services.AddMetrics();
        if (!(section.Get<TimeseriesOptions>() ?? new TimeseriesOptions()).Enabled)
        {
            return services;
        }

        services.AddSingleton(sp => sp.GetRequiredService<IOptions<TimeseriesOptions>>().Value);
        services.AddSingleton(sp =>
        {
            var o = sp.GetRequiredService<TimeseriesOptions>();
            return new OutboxStore(o.OutboxPath, o.MaxOutboxBytes);
        });
        // store:retention bounds the unsent rows too (the outbox is itself bounded by maxOutboxMegabytes).
        services.AddSingleton<Store.IRetainedRows>(sp => sp.GetRequiredService<OutboxStore>());
        services.AddSingleton<ITimeseriesWriter>(sp =>
        {
            var o = sp.GetRequiredService<TimeseriesOptions>();
            var store = sp.GetRequiredService<OutboxStore>();
            TimeseriesLog.Started(sp.GetRequiredService<ILoggerFactory>().CreateLogger(typeof(TimeseriesServices).FullName!),
                o.OutboxPath, store.Stats.Depth, o.Url, o.Org, o.Bucket);
            return new InfluxLineWriter(o, o.ResolveToken(Environment.GetEnvironmentVariable));
        });
        services.AddSingleton<TimeseriesMetrics>();
        services.AddSingleton(sp => new OutboxSender(
            sp.GetRequiredService<OutboxStore>(), sp.GetRequiredService<ITimeseriesWriter>(), sp.GetRequiredService<TimeseriesOptions>(),
            sp.GetRequiredService<TimeseriesMetrics>(), sp.GetRequiredService<TimeProvider>(), sp.GetRequiredService<ILogger<OutboxSender>>()));
        services.AddHostedService(sp => sp.GetRequiredService<OutboxSender>());
        services.AddSingleton(sp =>
        {
            var sink = ActivatorUtilities.CreateInstance<TimeseriesSink>(sp);
            // Same file as the daemon's store: commit the outbox row in the frame's own transaction.
            if (sp.GetService<SqliteStore>() is { } frames)
            {
                sink.AttachTo(frames);
            }

            return sink;
        });
        services.AddSingleton<IEstimateSink>(sp => sp.GetRequiredService<TimeseriesSink>());
        return services;
    }
}
