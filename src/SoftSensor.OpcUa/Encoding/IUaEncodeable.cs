namespace SoftSensor.OpcUa.Encoding;

/// <summary>A structure with a UA Binary encoding and the numeric NodeId (ns 0) of that encoding.</summary>
public interface IUaEncodeable
{
    /// <summary>The identifier of the structure's DefaultBinary encoding object (Part 6 Annex A, NodeIds.csv).</summary>
    uint BinaryEncodingId { get; }

    /// <summary>Writes the fields in the order the specification lists them.</summary>
    void Encode(UaBinaryWriter writer);
}
