using System.Net;
using System.Net.Sockets;
using MQTTnet.Server;

namespace SoftSensor.Daemon.Demo;

/// <summary>
/// The demo's embedded MQTT broker (MQTTnet server) on a free loopback port, IPv4 and IPv6 loopback
/// only (no other host can reach it). A client that sends an empty client id gets one assigned, as
/// MQTT 3.1.1 §3.1.3.1 allows for a clean session and MQTT 5.0 §3.2.2.3.7 (Assigned Client Identifier) specifies.
/// </summary>
internal sealed class DemoBroker : IAsyncDisposable
{
    private readonly MqttServer _server;

    private DemoBroker(MqttServer server, int port)
    {
        _server = server;
        Port = port;
    }

    public string Host => "127.0.0.1";

    public int Port { get; }

    /// <summary>The broker's address as printed at start.</summary>
    public string Address => $"mqtt://{Host}:{Port}";

    public static async Task<DemoBroker> StartAsync()
    {
        int port;
        using (var probe = new TcpListener(IPAddress.Loopback, 0))
        {
            probe.Start();
            port = ((IPEndPoint)probe.LocalEndpoint).Port;
        }

        var factory = new MqttServerFactory();
        var options = factory.CreateServerOptionsBuilder()
            .WithDefaultEndpoint()
            .WithDefaultEndpointBoundIPAddress(IPAddress.Loopback)
            .WithDefaultEndpointBoundIPV6Address(IPAddress.IPv6Loopback)
            .WithDefaultEndpointPort(port)
            .Build();
        var server = factory.CreateMqttServer(options);
        server.ValidatingConnectionAsync += e =>
        {
            if (string.IsNullOrEmpty(e.ClientId))
            {
                e.AssignedClientIdentifier = "demo-" + Guid.NewGuid().ToString("N")[..12];
                e.ReasonCode = MQTTnet.Protocol.MqttConnectReasonCode.Success;
            }

            return Task.CompletedTask;
        };
        await server.StartAsync();
        return new DemoBroker(server, port);
    }

    public async ValueTask DisposeAsync()
    {
        await _server.StopAsync();
        _server.Dispose();
    }
}
