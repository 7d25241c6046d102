using Microsoft.Extensions.Logging;
using SoftSensor.OpcUa.Client;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Subscriptions;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.OpcUa;

/// <summary>Builds supervised OPC UA clients from <see cref="OpcUaOptions"/>.</summary>
internal static class OpcUaClientFactory
{
    public static UaSubscriptionClient Create(OpcUaOptions options, IReadOnlyList<MonitoredNode> nodes, Func<ItemChange, CancellationToken, ValueTask> onChange, TimeProvider time, ILogger logger)
    {
        var identity = string.IsNullOrEmpty(options.User)
            ? UserIdentity.Anonymous
            : UserIdentity.UserName(options.User, Environment.GetEnvironmentVariable(options.PasswordVariable) ?? string.Empty);
        var client = new ClientOptions
        {
            Session = new SessionOptions { EndpointUrl = options.Endpoint, Identity = identity, SessionName = "softsensor-daemon" },
            Subscription = new SubscriptionSettings { PublishingInterval = options.PublishingInterval },
        };
        return new UaSubscriptionClient(client, nodes, onChange, time, logger);
    }
}
