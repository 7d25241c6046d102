using Microsoft.Extensions.Logging.Abstractions;
using SoftSensor.OpcUa.SecureChannel;
using SoftSensor.OpcUa.Session;

namespace SoftSensor.OpcUa.Tests.Peers;

/// <summary>One node-opcua server with a user-name policy, shared by the tests of a class.</summary>
public sealed class PeerFixture : IAsyncLifetime
{
    public const string User = "operator";
    public const string Password = "pilot-plant-7";

    public OpcUaPeerServer Server { get; } = new(new Dictionary<string, string>
    {
        ["OPCUA_USER"] = User,
        ["OPCUA_PASSWORD"] = Password,
        ["OPCUA_UPDATE_MS"] = "100",
    });

    public Task InitializeAsync() => Server.StartAsync(CancellationToken.None);

    public Task DisposeAsync() => Server.StopAsync();

    /// <summary>Opens a channel and an anonymous (or given) session on the peer; disposing closes both.</summary>
    public async Task<(UaConnection Connection, UaSession Session)> ConnectAsync(UserIdentity? identity = null, ChannelOptions? channel = null)
    {
        var options = new SessionOptions { EndpointUrl = Server.EndpointUrl, Identity = identity ?? UserIdentity.Anonymous, Channel = channel ?? new ChannelOptions() };
        var connection = await UaConnection.OpenAsync(options, TimeProvider.System, NullLogger.Instance, CancellationToken.None);
        return (connection, connection.Session);
    }
}
