using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Mqtt;
using SoftSensor.Daemon.OpcUa;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Sinks;
using SoftSensor.Daemon.Status;
using SoftSensor.Daemon.Store;
using SoftSensor.Daemon.Timeseries;
using SoftSensor.Daemon.Alarming;
using SoftSensor.Daemon.Batches;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Hosting;

/// <summary>
/// The daemon's registrations. To plug in: add an <see cref="IEstimateSink"/>
/// (<c>services.AddSingleton&lt;IEstimateSink, MySink&gt;()</c>: it runs after the MQTT and store
/// sinks), an <see cref="ISampleSourceFactory"/>, or a hosted service; the store
/// (<see cref="SqliteStore"/>) and <see cref="MqttLink"/> are singletons to inject.
/// </summary>
internal static class DaemonServices
{
    /// <summary>Registers options (validated at start), clock, metrics, store, MQTT, pipelines and sinks.</summary>
    public static IServiceCollection AddSoftSensorDaemon(this IServiceCollection services, IConfiguration configuration)
    {
        services.AddOptions<SoftSensorOptions>().Bind(configuration).ValidateOnStart();
        services.AddSingleton<IValidateOptions<SoftSensorOptions>, SoftSensorOptionsValidator>();
        services.TryAddSingleton(TimeProvider.System);
        services.AddMetrics();
        services.AddSingleton<DaemonMetrics>();
        services.AddSingleton<PrometheusExporter>();
        services.AddSingleton<StatusBoard>();
        services.AddSingleton(sp => new MqttTopics(sp.GetRequiredService<IOptions<SoftSensorOptions>>().Value));

        services.AddSingleton<SqliteStore>();
        services.AddSingleton<ICheckpointStore>(sp => sp.GetRequiredService<SqliteStore>());
        services.AddBatches();
        Samples.SampleEndpoints.AddOperatorSamples(services);

        // The broker link keeps real time even when the demo accelerates the process clock.
        services.AddSingleton(sp => ActivatorUtilities.CreateInstance<MqttLink>(sp, TimeProvider.System));
        services.AddSingleton<ISampleSourceFactory, MqttSampleSourceFactory>();

        // Sinks run in registration order: MQTT first (the operators' trends wait on it; its publishes
        // are pipelined, so it hands over and returns), then the store (the history and the durable
        // outbox, which does not depend on MQTT having been first or last).
        services.AddSingleton<IEstimateSink, MqttEstimateSink>();
        services.AddSingleton<IEstimateSink, SqliteEstimateSink>();
        services.AddTimeseries(configuration).AddAlarms(configuration);

        // OPC UA: tags with an opcUaNode, and estimates written back (section opcUa); after MQTT.
        services.AddOpcUaAdapter(configuration);

        services.TryAddSingleton<IReactorCycleFactory, ReactorCycleFactory>();

        // Hosted services stop in reverse order: pipelines, then the dispatcher drains, then MQTT says offline.
        services.AddHostedService(sp => sp.GetRequiredService<MqttLink>());
        services.AddSingleton<FrameDispatcher>();
        services.AddHostedService(sp => sp.GetRequiredService<FrameDispatcher>());
        services.AddSingleton<PipelineSupervisor>();
        services.AddHostedService(sp => sp.GetRequiredService<PipelineSupervisor>());
        return services;
    }
}
