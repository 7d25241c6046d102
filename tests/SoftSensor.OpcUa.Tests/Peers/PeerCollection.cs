namespace SoftSensor.OpcUa.Tests.Peers;

/// <summary>The test classes that share one node-opcua peer.</summary>
[CollectionDefinition(Name)]
public sealed class PeerCollection : ICollectionFixture<PeerFixture>
{
    public const string Name = "node-opcua peer";
}
