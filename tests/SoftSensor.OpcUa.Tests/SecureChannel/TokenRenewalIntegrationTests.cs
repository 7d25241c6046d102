using SoftSensor.OpcUa.SecureChannel;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Tests.Peers;

namespace SoftSensor.OpcUa.Tests.SecureChannel;

/// <summary>Token renewal (Part 4 §5.5.2, Part 6 §6.7.4) against node-opcua with a short lifetime.</summary>
[Collection(PeerCollection.Name)]
public sealed class TokenRenewalIntegrationTests(PeerFixture peer)
{
    [Fact]
    public async Task Channel_ShortTokenLifetime_RenewsAt75PercentAndKeepsServing()
    {
        // The client asks for 3 s; node-opcua grants min(asked, its limit) but at least 2.5 s,
        // so the token is renewed about every 2.25 s on the same channel.
        var (connection, session) = await peer.ConnectAsync(channel: new ChannelOptions { RequestedLifetime = TimeSpan.FromSeconds(3) });
        await using var _ = connection;
        var channel = connection.Channel;
        uint channelId = channel.Token.ChannelId;
        uint firstToken = channel.Token.TokenId;
        Assert.InRange(channel.Token.RevisedLifetimeMs, 2500u, 3000u);

        var deadline = DateTime.UtcNow.AddSeconds(10);
        while (channel.RenewalCount < 2 && DateTime.UtcNow < deadline)
        {
            Assert.True((await session.ReadValueAsync(WellKnownNodes.ServerState, CancellationToken.None)).Status.IsGood);
            await Task.Delay(200);
        }

        Assert.True(channel.RenewalCount >= 2, $"renewed {channel.RenewalCount} times");
        Assert.Equal(channelId, channel.Token.ChannelId);
        Assert.NotEqual(firstToken, channel.Token.TokenId);
        Assert.True(channel.IsOpen);
        Assert.True((await session.ReadValueAsync(WellKnownNodes.ServerState, CancellationToken.None)).Status.IsGood);
    }
}
