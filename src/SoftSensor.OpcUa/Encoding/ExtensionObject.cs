namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// A structure wrapped with the NodeId of its encoding (Part 6 §5.2.2.15): TypeId, an encoding
/// byte (0x00 no body, 0x01 ByteString body, 0x02 XmlElement body), then Int32 length and body.
/// The body is kept as bytes; <see cref="ExtensionObjectCodec"/> decodes the known types.
/// </summary>
public sealed record ExtensionObject(NodeId TypeId, ExtensionObjectBody BodyKind, byte[]? Body)
{
    public static ExtensionObject Null { get; } = new(NodeId.Null, ExtensionObjectBody.None, null);

    public bool IsNull => BodyKind == ExtensionObjectBody.None && TypeId.IsNull;

    /// <summary>Wraps an encodeable structure with its binary encoding id.</summary>
    public static ExtensionObject From(IUaEncodeable value)
    {
        var w = new UaBinaryWriter();
        value.Encode(w);
        return new ExtensionObject(NodeId.Numeric(value.BinaryEncodingId), ExtensionObjectBody.Binary, w.ToArray());
    }
}

/// <summary>The encoding byte of an ExtensionObject (Part 6 §5.2.2.15).</summary>
public enum ExtensionObjectBody : byte
{
    None = 0x00,
    Binary = 0x01,
    Xml = 0x02,
}
