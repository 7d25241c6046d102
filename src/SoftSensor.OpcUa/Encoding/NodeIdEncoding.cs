namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// Binary encoding of NodeId and ExpandedNodeId (Part 6 §5.2.2.9, §5.2.2.10). The first byte
/// names the form: 0x00 two-byte (ns 0, id ≤ 255), 0x01 four-byte (ns ≤ 255, id ≤ 65535),
/// 0x02 numeric (UInt16 ns, UInt32 id), 0x03 string, 0x04 guid, 0x05 opaque (UInt16 ns then the
/// identifier). In an ExpandedNodeId bit 0x80 says a NamespaceUri String follows the NodeId and
/// bit 0x40 says a ServerIndex UInt32 follows that.
/// </summary>
public static class NodeIdEncoding
{
    private const byte TwoByte = 0x00;
    private const byte FourByte = 0x01;
    private const byte NumericForm = 0x02;
    private const byte StringForm = 0x03;
    private const byte GuidForm = 0x04;
    private const byte OpaqueForm = 0x05;
    private const byte NamespaceUriFlag = 0x80;
    private const byte ServerIndexFlag = 0x40;

    public static void WriteNodeId(this UaBinaryWriter w, NodeId? id) => WriteWithFlags(w, id ?? NodeId.Null, 0);

    public static void WriteExpandedNodeId(this UaBinaryWriter w, ExpandedNodeId? id)
    {
        id ??= ExpandedNodeId.Null;
        byte flags = (byte)((id.HasNamespaceUri ? NamespaceUriFlag : 0) | (id.ServerIndex != 0 ? ServerIndexFlag : 0));
        WriteWithFlags(w, id.NodeId, flags);
        if (id.HasNamespaceUri)
        {
            w.WriteString(id.NamespaceUri);
        }

        if (id.ServerIndex != 0)
        {
            w.WriteUInt32(id.ServerIndex);
        }
    }

    public static NodeId ReadNodeId(this UaBinaryReader r)
    {
        byte first = r.ReadByte();
        if ((first & (NamespaceUriFlag | ServerIndexFlag)) != 0)
        {
            throw new UaDecodeException($"NodeId encoding byte 0x{first:X2} at offset {r.Position - 1} has ExpandedNodeId flags.");
        }

        return ReadBody(r, first);
    }

    public static ExpandedNodeId ReadExpandedNodeId(this UaBinaryReader r)
    {
        byte first = r.ReadByte();
        var node = ReadBody(r, (byte)(first & 0x3F));
        string? uri = (first & NamespaceUriFlag) != 0 ? r.ReadString() : null;
        uint server = (first & ServerIndexFlag) != 0 ? r.ReadUInt32() : 0;
        return new ExpandedNodeId(node, uri, server);
    }

    private static void WriteWithFlags(UaBinaryWriter w, NodeId id, byte flags)
    {
        switch (id.IdType)
        {
            case NodeIdType.Numeric when id.NamespaceIndex == 0 && id.NumericId <= byte.MaxValue:
                w.WriteByte((byte)(TwoByte | flags));
                w.WriteByte((byte)id.NumericId);
                break;
            case NodeIdType.Numeric when id.NamespaceIndex <= byte.MaxValue && id.NumericId <= ushort.MaxValue:
                w.WriteByte((byte)(FourByte | flags));
                w.WriteByte((byte)id.NamespaceIndex);
                w.WriteUInt16((ushort)id.NumericId);
                break;
            case NodeIdType.Numeric:
                w.WriteByte((byte)(NumericForm | flags));
                w.WriteUInt16(id.NamespaceIndex);
                w.WriteUInt32(id.NumericId);
                break;
            case NodeIdType.String:
                w.WriteByte((byte)(StringForm | flags));
                w.WriteUInt16(id.NamespaceIndex);
                w.WriteString(id.StringId);
                break;
            case NodeIdType.Guid:
                w.WriteByte((byte)(GuidForm | flags));
                w.WriteUInt16(id.NamespaceIndex);
                w.WriteGuid(id.GuidId);
                break;
            default:
                w.WriteByte((byte)(OpaqueForm | flags));
                w.WriteUInt16(id.NamespaceIndex);
                w.WriteByteString(id.OpaqueId);
                break;
        }
    }

    private static NodeId ReadBody(UaBinaryReader r, byte form) => form switch
    {
        TwoByte => NodeId.Numeric(r.ReadByte()),
        FourByte => NodeId.Numeric(r.ReadByte(), r.ReadUInt16()),
        NumericForm => NodeId.Numeric(r.ReadUInt16(), r.ReadUInt32()),
        StringForm => NodeId.String(r.ReadUInt16(), r.ReadString() ?? string.Empty),
        GuidForm => NodeId.FromGuid(r.ReadUInt16(), r.ReadGuid()),
        OpaqueForm => NodeId.Opaque(r.ReadUInt16(), r.ReadByteString() ?? []),
        _ => throw new UaDecodeException($"Unknown NodeId encoding 0x{form:X2} at offset {r.Position - 1}; expected 0x00 to 0x05."),
    };
}
