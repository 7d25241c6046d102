namespace SoftSensor.OpcUa.Encoding;

/// <summary>Writes and reads one value of a built-in type as its CLR representation (Part 6 §5.2.2).</summary>
public static class ScalarEncoding
{
    public static void Write(UaBinaryWriter w, BuiltInType type, object? value)
    {
        switch (type)
        {
            case BuiltInType.Boolean: w.WriteBoolean((bool)value!); break;
            case BuiltInType.SByte: w.WriteSByte((sbyte)value!); break;
            case BuiltInType.Byte: w.WriteByte((byte)value!); break;
            case BuiltInType.Int16: w.WriteInt16((short)value!); break;
            case BuiltInType.UInt16: w.WriteUInt16((ushort)value!); break;
            case BuiltInType.Int32: w.WriteInt32((int)value!); break;
            case BuiltInType.UInt32: w.WriteUInt32((uint)value!); break;
            case BuiltInType.Int64: w.WriteInt64((long)value!); break;
            case BuiltInType.UInt64: w.WriteUInt64((ulong)value!); break;
            case BuiltInType.Float: w.WriteFloat((float)value!); break;
            case BuiltInType.Double: w.WriteDouble((double)value!); break;
            case BuiltInType.String: w.WriteString((string?)value); break;
            case BuiltInType.DateTime: w.WriteDateTime((DateTime)value!); break;
            case BuiltInType.Guid: w.WriteGuid((Guid)value!); break;
            case BuiltInType.ByteString: w.WriteByteString((byte[]?)value); break;
            case BuiltInType.XmlElement: w.WriteString(((XmlElement?)value)?.Xml); break;
            case BuiltInType.NodeId: w.WriteNodeId((NodeId?)value); break;
            case BuiltInType.ExpandedNodeId: w.WriteExpandedNodeId((ExpandedNodeId?)value); break;
            case BuiltInType.StatusCode: w.WriteStatusCode((StatusCode)value!); break;
            case BuiltInType.QualifiedName: w.WriteQualifiedName((QualifiedName?)value); break;
            case BuiltInType.LocalizedText: w.WriteLocalizedText((LocalizedText?)value); break;
            case BuiltInType.ExtensionObject: w.WriteExtensionObject((ExtensionObject?)value); break;
            case BuiltInType.DataValue: w.WriteDataValue((DataValue?)value); break;
            case BuiltInType.Variant: w.WriteVariant((Variant?)value); break;
            case BuiltInType.DiagnosticInfo: w.WriteDiagnosticInfo((DiagnosticInfo?)value); break;
            default: throw new ArgumentOutOfRangeException(nameof(type), type, "Not a built-in type with a value.");
        }
    }

    public static object? Read(UaBinaryReader r, BuiltInType type) => type switch
    {
        BuiltInType.Boolean => r.ReadBoolean(),
        BuiltInType.SByte => r.ReadSByte(),
        BuiltInType.Byte => r.ReadByte(),
        BuiltInType.Int16 => r.ReadInt16(),
        BuiltInType.UInt16 => r.ReadUInt16(),
        BuiltInType.Int32 => r.ReadInt32(),
        BuiltInType.UInt32 => r.ReadUInt32(),
        BuiltInType.Int64 => r.ReadInt64(),
        BuiltInType.UInt64 => r.ReadUInt64(),
        BuiltInType.Float => r.ReadFloat(),
        BuiltInType.Double => r.ReadDouble(),
        BuiltInType.String => r.ReadString(),
        BuiltInType.DateTime => r.ReadDateTime(),
        BuiltInType.Guid => r.ReadGuid(),
        BuiltInType.ByteString => r.ReadByteString(),
        BuiltInType.XmlElement => new XmlElement(r.ReadString()),
        BuiltInType.NodeId => r.ReadNodeId(),
        BuiltInType.ExpandedNodeId => r.ReadExpandedNodeId(),
        BuiltInType.StatusCode => r.ReadStatusCode(),
        BuiltInType.QualifiedName => r.ReadQualifiedName(),
        BuiltInType.LocalizedText => r.ReadLocalizedText(),
        BuiltInType.ExtensionObject => r.ReadExtensionObject(),
        BuiltInType.DataValue => r.ReadDataValue(),
        BuiltInType.Variant => r.ReadVariant(),
        BuiltInType.DiagnosticInfo => r.ReadDiagnosticInfo(),
        _ => throw new UaDecodeException($"Built-in type {type} has no value encoding."),
    };
}
