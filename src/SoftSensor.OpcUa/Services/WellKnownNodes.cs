using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>Standard nodes of namespace 0 this client uses (Part 6 Annex A, NodeIds.csv).</summary>
public static class WellKnownNodes
{
    public static NodeId RootFolder { get; } = NodeId.Numeric(84);

    public static NodeId ObjectsFolder { get; } = NodeId.Numeric(85);

    public static NodeId HierarchicalReferences { get; } = NodeId.Numeric(33);

    public static NodeId HasTypeDefinition { get; } = NodeId.Numeric(40);

    /// <summary>Server_NamespaceArray (i=2255).</summary>
    public static NodeId NamespaceArray { get; } = NodeId.Numeric(2255);

    /// <summary>Server_ServerStatus_State (i=2259).</summary>
    public static NodeId ServerState { get; } = NodeId.Numeric(2259);

    /// <summary>Server_ServerStatus_CurrentTime (i=2258).</summary>
    public static NodeId ServerCurrentTime { get; } = NodeId.Numeric(2258);
}
