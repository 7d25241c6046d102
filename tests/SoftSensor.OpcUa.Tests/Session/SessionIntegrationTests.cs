using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Tests.Peers;

namespace SoftSensor.OpcUa.Tests.Session;

/// <summary>
/// The client against a real, independent server (node-opcua 2.182.2, tests/peers): each check is
/// an outcome the OPC UA specification (Part 4) prescribes, observed on that server.
/// </summary>
[Collection(PeerCollection.Name)]
public sealed class SessionIntegrationTests(PeerFixture peer)
{
    private static readonly CancellationToken None = CancellationToken.None;

    [Fact]
    public async Task CreateSession_Anonymous_ReadsNamespaceArrayWithPeerNamespace()
    {
        var (channel, session) = await peer.ConnectAsync();
        await using var _ = channel;

        // Part 5 §6.3.1: index 0 of the NamespaceArray is always the OPC UA namespace.
        Assert.Equal("http://opcfoundation.org/UA/", session.Namespaces.Uris[0]);
        Assert.NotNull(session.Namespaces.IndexOf(OpcUaPeerServer.NamespaceUri));
    }

    [Fact]
    public async Task BrowseAsync_ObjectsFolder_ListsReactor1AndServer()
    {
        var (channel, session) = await peer.ConnectAsync();
        await using var _ = channel;

        var children = await session.BrowseAsync(WellKnownNodes.ObjectsFolder, None);

        // Part 5 §8.2.4: the Server object (i=2253) is organised by the Objects folder.
        Assert.Contains(children, c => c.NodeId.NodeId == NodeId.Numeric(2253) && c.NodeClass == NodeClass.Object);
        var reactor = Assert.Single(children, c => c.BrowseName.Name == "Reactor1");
        Assert.Equal("s=Reactor1", reactor.NodeId.NodeId.IdentifierText);
    }

    [Fact]
    public async Task BrowseAsync_MoreChildrenThanMaxReferences_FollowsContinuationPointsWithBrowseNext()
    {
        var (channel, session) = await peer.ConnectAsync();
        await using var _ = channel;
        var bulk = Resolve(session, "s=Reactor1.Bulk");

        // The peer serves 40 items; 7 per response forces six BrowseNext calls (Part 4 §5.8.3).
        var children = await session.BrowseAsync(bulk, None, maxReferencesPerRequest: 7);

        Assert.Equal(40, children.Count(c => c.BrowseName.Name?.StartsWith("Item", StringComparison.Ordinal) == true));
        Assert.Equal(40, children.Select(c => c.NodeId).Distinct().Count());
    }

    [Fact]
    public async Task ReadValueAsync_OffgasO2_GivesGoodDoubleWithSourceTimestamp()
    {
        var (channel, session) = await peer.ConnectAsync();
        await using var _ = channel;

        var value = await session.ReadValueAsync(Resolve(session, "s=Reactor1.OffgasO2"), None);

        Assert.True(value.Status.IsGood);
        Assert.Equal(BuiltInType.Double, value.Value.Type);
        Assert.InRange(value.Value.AsDouble()!.Value, 19.8, 20.6); // the peer's invented signal: 20.2 ± 0.3
        Assert.InRange(value.SourceTimestamp, DateTime.UtcNow.AddMinutes(-1), DateTime.UtcNow.AddMinutes(1));
    }

    [Fact]
    public async Task ReadAsync_UnknownNode_GivesBadNodeIdUnknownForThatItemOnly()
    {
        var (channel, session) = await peer.ConnectAsync();
        await using var _ = channel;

        var values = await session.ReadAsync([new ReadValueId(Resolve(session, "s=NoSuchNode")), new ReadValueId(WellKnownNodes.ServerState)], None);

        Assert.True(values[0].Status.Is(StatusCodes.BadNodeIdUnknown));
        Assert.True(values[1].Status.IsGood);
        Assert.Equal(0, values[1].Value.Value); // ServerState Running = 0 (Part 5 §12.6)
    }

    [Fact]
    public async Task WriteAsync_EstimateWithStatusAndTimestamp_IsReadBackUnchanged()
    {
        var (channel, session) = await peer.ConnectAsync();
        await using var _ = channel;
        var node = Resolve(session, "s=Reactor1.Estimates.Biomass");
        var stamp = new DateTime(2026, 3, 4, 5, 6, 7, 890, DateTimeKind.Utc);
        var written = new DataValue { Value = Variant.From(12.345), Status = new StatusCode(StatusCodes.UncertainSubNormal), SourceTimestamp = stamp };

        var results = await session.WriteAsync([new WriteValue(node, written)], None);
        var back = await session.ReadValueAsync(node, None);

        Assert.True(results[0].IsGood, results[0].ToString());
        Assert.Equal(12.345, back.Value.AsDouble());
        Assert.Equal(StatusCodes.UncertainSubNormal, back.Status.Code);
        Assert.Equal(stamp, back.SourceTimestamp);
    }

    [Fact]
    public async Task WriteAsync_ReadOnlyMeasurement_GivesBadNotWritable()
    {
        var (channel, session) = await peer.ConnectAsync();
        await using var _ = channel;

        var results = await session.WriteAsync([new WriteValue(Resolve(session, "s=Reactor1.OffgasO2"), new DataValue { Value = Variant.From(1.0) })], None);

        Assert.True(results[0].IsBad);
    }

    [Fact]
    public async Task ResolveAsync_BrowsePath_FindsNodeAndConfirmsWithTranslate()
    {
        var (channel, session) = await peer.ConnectAsync();
        await using var _ = channel;

        var found = await BrowsePathResolver.ResolveAsync(session, "Objects/Reactor1/OffgasCO2", None);
        var missing = await BrowsePathResolver.ResolveAsync(session, "Objects/Reactor1/NoSuchTag", None);

        Assert.True(found.IsFound, found.Error);
        Assert.Equal(Resolve(session, "s=Reactor1.OffgasCO2"), found.Node);
        Assert.False(missing.IsFound);
        Assert.Contains("NoSuchTag", missing.Error, StringComparison.Ordinal);
    }

    [Fact]
    public async Task TranslateAsync_QualifiedPath_GivesTargetNode()
    {
        var (channel, session) = await peer.ConnectAsync();
        await using var _ = channel;
        ushort ns = session.Namespaces.IndexOf(OpcUaPeerServer.NamespaceUri)!.Value;

        var result = (await session.TranslateAsync([new BrowsePath(WellKnownNodes.ObjectsFolder, [new(new QualifiedName(ns, "Reactor1")), new(new QualifiedName(ns, "AirFlow"))])], None))[0];

        Assert.True(result.Status.IsGood);
        Assert.Equal(Resolve(session, "s=Reactor1.AirFlow"), result.Targets[0].TargetId.NodeId);
        Assert.Equal(uint.MaxValue, result.Targets[0].RemainingPathIndex); // fully resolved (Part 4 §5.8.4.2)
    }

    [Fact]
    public async Task CreateSession_UserNameWithRightPassword_IsActivated()
    {
        var (channel, session) = await peer.ConnectAsync(UserIdentity.UserName(PeerFixture.User, PeerFixture.Password));
        await using var _ = channel;

        Assert.True((await session.ReadValueAsync(WellKnownNodes.ServerState, None)).Status.IsGood);
    }

    [Fact]
    public async Task CreateSession_UserNameWithWrongPassword_IsRefusedWithBadStatus()
    {
        var error = await Assert.ThrowsAsync<ServiceResultException>(() => peer.ConnectAsync(UserIdentity.UserName(PeerFixture.User, "wrong")));

        Assert.True(error.Status.IsBad);
        Assert.DoesNotContain("wrong", error.Message, StringComparison.Ordinal);
    }

    private static NodeId Resolve(UaSession session, string identifier) =>
        session.Namespaces.Resolve(ExpandedNodeId.Parse($"nsu={OpcUaPeerServer.NamespaceUri};{identifier}"))!;
}
