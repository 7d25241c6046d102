namespace SoftSensor.OpcUa.Services;

/// <summary>Attribute ids used by this client (Part 6 Annex A, AttributeIds.csv).</summary>
public static class AttributeIds
{
    public const uint NodeId = 1;
    public const uint NodeClass = 2;
    public const uint BrowseName = 3;
    public const uint DisplayName = 4;
    public const uint Description = 5;
    public const uint Value = 13;
    public const uint DataType = 14;
    public const uint ValueRank = 15;
    public const uint AccessLevel = 17;
    public const uint UserAccessLevel = 18;
}
