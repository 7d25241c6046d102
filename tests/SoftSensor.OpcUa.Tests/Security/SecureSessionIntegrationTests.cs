using System.Collections.Concurrent;
using Microsoft.Extensions.Logging.Abstractions;
using SoftSensor.OpcUa.Client;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.SecureChannel;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Subscriptions;
using SoftSensor.OpcUa.Tests.Peers;

namespace SoftSensor.OpcUa.Tests.Security;

/// <summary>
/// The client against a real, independent server (node-opcua 2.182.2, tests/peers) that offers
/// secure endpoints only: for each security policy of Part 7 this client speaks and each mode
/// (Sign, SignAndEncrypt), a user-name login whose password is encrypted with the server's key
/// (Part 4 §7.36.2.2), browse, read, write-back and a subscription whose data keep flowing across
/// token renewals (Part 6 §6.7.4, keys derived from the new nonces).
/// </summary>
[Collection(SecurePeerCollection.Name)]
public sealed class SecureSessionIntegrationTests(SecurePeerFixture peer)
{
    private const string Ns = "nsu=" + OpcUaPeerServer.NamespaceUri + ";";

    public static TheoryData<string, SecurityChoice> PolicyAndMode() => new()
    {
        { "Basic256Sha256", SecurityChoice.Sign },
        { "Basic256Sha256", SecurityChoice.SignAndEncrypt },
        { "Aes128_Sha256_RsaOaep", SecurityChoice.Sign },
        { "Aes128_Sha256_RsaOaep", SecurityChoice.SignAndEncrypt },
        { "Aes256_Sha256_RsaPss", SecurityChoice.Sign },
        { "Aes256_Sha256_RsaPss", SecurityChoice.SignAndEncrypt },
    };

    [Theory]
    [MemberData(nameof(PolicyAndMode))]
    public async Task SecureEndpoint_UserLogin_BrowseReadWriteAndSubscribeAcrossTokenRenewal(string policy, SecurityChoice mode)
    {
        var changes = new ConcurrentQueue<ItemChange>();
        var options = new ClientOptions
        {
            Session = Options(policy, mode, peer.TrustingPki, SecurePeerFixture.Password) with { Channel = new ChannelOptions { RequestedLifetime = TimeSpan.FromSeconds(2) } },
            Subscription = new SubscriptionSettings { PublishingInterval = TimeSpan.FromMilliseconds(200), MaxKeepAliveCount = 5 },
            ReconnectMinDelay = TimeSpan.FromMilliseconds(200),
        };
        var client = new UaSubscriptionClient(options, [new MonitoredNode(1, new NodeReference(Ns + "s=Reactor1.Counter"), new MonitoredItemSettings { SamplingInterval = TimeSpan.FromMilliseconds(100) })], (c, _) =>
        {
            changes.Enqueue(c);
            return ValueTask.CompletedTask;
        }, TimeProvider.System, NullLogger.Instance);
        using var cts = new CancellationTokenSource();
        var run = client.RunAsync(cts.Token);
        try
        {
            await WaitUntil(() => client.CurrentSession is not null, TimeSpan.FromSeconds(20));
            var session = client.CurrentSession!;
            Assert.Equal($"{policy} {(mode == SecurityChoice.Sign ? "Sign" : "SignAndEncrypt")}", session.Channel.Security.Describe());

            // Browse and read on the secured session.
            var children = await session.BrowseAsync(session.Namespaces.Resolve(ExpandedNodeId.Parse(Ns + "s=Reactor1"))!, CancellationToken.None);
            Assert.Contains(children, c => c.BrowseName.Name == "OffgasO2");
            var o2 = await session.ReadValueAsync(session.Namespaces.Resolve(ExpandedNodeId.Parse(Ns + "s=Reactor1.OffgasO2"))!, CancellationToken.None);
            Assert.InRange(o2.Value.AsDouble()!.Value, 19.8, 20.6); // the peer's invented signal: 20.2 ± 0.3

            // Data changes before and after at least one token renewal (2 s asked, renewed at 75 %).
            int renewalsAtStart = session.Channel.RenewalCount;
            await WaitUntil(() => session.Channel.RenewalCount >= renewalsAtStart + 1, TimeSpan.FromSeconds(15));
            int afterRenewal = changes.Count;
            await WaitUntil(() => changes.Count >= afterRenewal + 5, TimeSpan.FromSeconds(10));
            Assert.All(changes, c => Assert.True(c.Value.Status.IsGood, c.Value.Status.ToString()));
            Assert.True(session.Channel.IsOpen);
            Assert.Equal(1, client.Counters.Connects);

            // Write-back after the renewal, read back on the same session.
            var written = await client.WriteAsync([(new NodeReference("Objects/Reactor1/Estimates/OUR"), new DataValue { Value = Variant.From(42.5), Status = StatusCode.Good })], CancellationToken.None);
            Assert.True(written[0].IsGood, written[0].ToString());
            var back = await session.ReadValueAsync(session.Namespaces.Resolve(ExpandedNodeId.Parse(Ns + "s=Reactor1.Estimates.OUR"))!, CancellationToken.None);
            Assert.Equal(42.5, back.Value.AsDouble());
        }
        finally
        {
            await cts.CancelAsync();
            await run.WaitAsync(TimeSpan.FromSeconds(10));
        }
    }

    [Fact]
    public async Task NoModeGiven_PicksTheMostSecureEndpointBothSupport()
    {
        var options = Options(null, SecurityChoice.Auto, peer.TrustingPki, SecurePeerFixture.Password);
        await using var connection = await UaConnection.OpenAsync(options, TimeProvider.System, NullLogger.Instance, CancellationToken.None);

        // SignAndEncrypt over Sign, then Aes256_Sha256_RsaPss (RSA-PSS, OAEP-SHA256) as the strongest policy.
        Assert.Equal("Aes256_Sha256_RsaPss SignAndEncrypt", connection.Channel.Security.Describe());
    }

    [Fact]
    public async Task WrongPassword_IsBadUserAccessDenied()
    {
        var options = Options("Basic256Sha256", SecurityChoice.SignAndEncrypt, peer.TrustingPki, "not-the-password");

        var e = await Assert.ThrowsAsync<ServiceResultException>(() => UaConnection.OpenAsync(options, TimeProvider.System, NullLogger.Instance, CancellationToken.None));

        Assert.True(e.Status.Is(StatusCodes.BadUserAccessDenied), e.Status.ToString());
    }

    [Fact]
    public async Task UntrustedServer_IsRefusedAndCopiedToRejected_ThenAcceptedOnceTrusted()
    {
        string pki = peer.NewPki("client-untrusting");
        var options = Options("Basic256Sha256", SecurityChoice.SignAndEncrypt, pki, SecurePeerFixture.Password);

        var e = await Assert.ThrowsAsync<ServiceResultException>(() => UaConnection.OpenAsync(options, TimeProvider.System, NullLogger.Instance, CancellationToken.None));

        using var server = peer.ServerCertificate();
        Assert.True(e.Status.Is(StatusCodes.BadCertificateUntrusted), e.Status.ToString());
        Assert.Contains(server.Thumbprint, e.Message, StringComparison.Ordinal);
        Assert.Contains(server.Subject, e.Message, StringComparison.Ordinal);
        Assert.Contains($"softsensor opcua trust --endpoint {peer.Server.EndpointUrl} --pki ", e.Message, StringComparison.Ordinal);
        var rejected = Assert.Single(Directory.GetFiles(Path.Combine(pki, "rejected")));
        Assert.Contains(server.Thumbprint, rejected, StringComparison.Ordinal);

        new SoftSensor.OpcUa.Pki.PkiStore(pki).Trust(server);
        await using var connection = await UaConnection.OpenAsync(options, TimeProvider.System, NullLogger.Instance, CancellationToken.None);
        Assert.Empty(Directory.GetFiles(Path.Combine(pki, "rejected")));
        Assert.True(File.Exists(Path.Combine(pki, "own", "certs", "softsensor.der")));
    }

    [Fact]
    public async Task DeprecatedPolicy_IsRefusedWithTheReason()
    {
        var options = Options("Basic256", SecurityChoice.SignAndEncrypt, peer.TrustingPki, SecurePeerFixture.Password);

        var e = await Assert.ThrowsAsync<ServiceResultException>(() => UaConnection.OpenAsync(options, TimeProvider.System, NullLogger.Instance, CancellationToken.None));

        Assert.True(e.Status.Is(StatusCodes.BadSecurityPolicyRejected));
        Assert.Contains("SHA-1", e.Message, StringComparison.Ordinal);
    }

    private SessionOptions Options(string? policy, SecurityChoice mode, string pki, string password) => new()
    {
        EndpointUrl = peer.Server.EndpointUrl,
        Identity = UserIdentity.UserName(SecurePeerFixture.User, password),
        Security = new SecuritySettings { Mode = mode, Policy = policy, PkiDirectory = pki },
    };

    private static async Task WaitUntil(Func<bool> condition, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (!condition())
        {
            Assert.True(DateTime.UtcNow < deadline, $"condition not met within {timeout.TotalSeconds} s");
            await Task.Delay(50);
        }
    }
}
