using Microsoft.Extensions.Logging;
using SoftSensor.OpcUa.SecureChannel;

namespace SoftSensor.OpcUa.Session;

/// <summary>
/// A channel and a session opened together, for short-lived uses (the browse verb, tests);
/// disposing closes the session (deleting its subscriptions) and the channel.
/// </summary>
public sealed class UaConnection : IAsyncDisposable
{
    private UaConnection(UaSecureChannel channel, UaSession session)
    {
        Channel = channel;
        Session = session;
    }

    public UaSecureChannel Channel { get; }

    public UaSession Session { get; }

    public static async Task<UaConnection> OpenAsync(SessionOptions options, TimeProvider time, ILogger logger, CancellationToken cancellationToken)
    {
        var security = await EndpointSelector.ResolveAsync(options, time, logger, cancellationToken);
        var channel = await UaSecureChannel.OpenAsync(options.EndpointUrl, options.Channel, security, time, logger, cancellationToken);
        try
        {
            var session = await UaSession.CreateAsync(channel, options, time, logger, cancellationToken);
            return new UaConnection(channel, session);
        }
        catch
        {
            await channel.DisposeAsync();
            throw;
        }
    }

    public async ValueTask DisposeAsync()
    {
        using var cts = new CancellationTokenSource(TimeSpan.FromSeconds(5));
        await Session.CloseAsync(true, cts.Token);
        await Channel.CloseAsync(cts.Token);
    }
}
