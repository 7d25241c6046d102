using System.Net;
using System.Net.Sockets;
using System.Reflection;
using MQTTnet.Packets;
using MQTTnet.Server;

namespace SoftSensor.Daemon.Demo;

/// <summary>
/// The demo's embedded MQTT broker (MQTTnet server) on a free loopback port, IPv4 and IPv6 loopback
/// only (no other host can reach it). A client that sends an empty client id gets one assigned, as
/// MQTT 3.1.1 §3.1.3.1 allows for a clean session and MQTT 5.0 §3.2.2.3.7 (Assigned Client Identifier) specifies.
/// </summary>
/// <remarks>
/// MQTTnet 5.2 assigns the identifier only to MQTT 5 clients and refuses an empty one from a 3.1.1
/// client after the validation handler ("identifier rejected", which is what a plain
/// <c>mosquitto_sub</c> got). The handler therefore writes the assigned identifier into the CONNECT
/// packet itself, the one place the server reads it from; the packet is reached through the event's
/// private field, pinned to the MQTTnet version in Directory.Packages.props and checked at start
/// (<see cref="ConnectPacketField"/> throws if it moved) and by DemoBrokerTests with a real
/// mosquitto_sub.
/// </remarks>
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
            if (string.IsNullOrEmpty(e.ClientId) && (e.ProtocolVersion == MQTTnet.Formatter.MqttProtocolVersion.V500 || e.CleanSession != false))
            {
                var assigned = "demo-" + Guid.NewGuid().ToString("N")[..12];
                e.AssignedClientIdentifier = assigned;
                if (ConnectPacketField.GetValue(e) is MqttConnectPacket packet)
                {
                    packet.ClientId = assigned;
                }

                e.ReasonCode = MQTTnet.Protocol.MqttConnectReasonCode.Success;
            }

            return Task.CompletedTask;
        };
        await server.StartAsync();
        return new DemoBroker(server, port);
    }

    /// <summary>The CONNECT packet behind <see cref="ValidatingConnectionEventArgs"/> (MQTTnet 5.2).</summary>
    internal static readonly FieldInfo ConnectPacketField =
        typeof(ValidatingConnectionEventArgs).GetField("_connectPacket", BindingFlags.Instance | BindingFlags.NonPublic) is { } field
        && field.FieldType == typeof(MqttConnectPacket)
            ? field
            : throw new InvalidOperationException(
                "MQTTnet's ValidatingConnectionEventArgs no longer holds its CONNECT packet in _connectPacket; " +
                "the demo broker cannot assign client identifiers to MQTT 3.1.1 clients (see DemoBroker remarks).");

    public async ValueTask DisposeAsync()
    {
        await _server.StopAsync();
        _server.Dispose();
    }
}
