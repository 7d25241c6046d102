namespace SoftSensor.OpcUa.Encoding;

/// <summary>The four identifier types of a NodeId (Part 3 §8.2.3).</summary>
public enum NodeIdType
{
    Numeric = 0,
    String = 1,
    Guid = 2,
    Opaque = 3,
}
