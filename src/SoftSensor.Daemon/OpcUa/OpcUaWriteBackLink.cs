using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SoftSensor.OpcUa.Client;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.OpcUa;

/// <summary>
/// The supervised OPC UA connection used for write-back, run as a hosted service when
/// <c>opcUa:writeBack</c> names any node (it monitors nothing; it keeps a session for Write). Its
/// time-outs and back-off run on real time, whatever clock the pipelines use.
/// </summary>
internal sealed class OpcUaWriteBackLink(IOptions<OpcUaOptions> options, ILogger<OpcUaWriteBackLink> logger) : BackgroundService
{
    /// <summary>The client, or null when write-back is not configured.</summary>
    public UaSubscriptionClient? Client { get; } = options.Value.Endpoint.Length > 0 && options.Value.WriteBack.Values.Any(m => m.Count > 0)
        ? OpcUaClientFactory.Create(options.Value, [], static (_, _) => ValueTask.CompletedTask, TimeProvider.System, logger)
        : null;

    protected override Task ExecuteAsync(CancellationToken stoppingToken) => Client?.RunAsync(stoppingToken) ?? Task.CompletedTask;
}
