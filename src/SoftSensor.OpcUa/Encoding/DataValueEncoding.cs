namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// Binary encoding of DataValue (Part 6 §5.2.2.17): a mask byte (0x01 Value, 0x02 StatusCode,
/// 0x04 SourceTimestamp, 0x08 ServerTimestamp, 0x10 SourcePicoseconds, 0x20 ServerPicoseconds),
/// then the fields present in the order Value, StatusCode, SourceTimestamp, SourcePicoseconds,
/// ServerTimestamp, ServerPicoseconds. A Good status is left out.
/// </summary>
public static class DataValueEncoding
{
    public static void WriteDataValue(this UaBinaryWriter w, DataValue? value)
    {
        value ??= new DataValue();
        bool hasValue = !value.Value.IsNull;
        bool hasStatus = value.Status.Code != 0;
        bool hasSource = value.SourceTimestamp != DateTime.MinValue;
        bool hasServer = value.ServerTimestamp != DateTime.MinValue;
        bool hasSourcePico = hasSource && value.SourcePicoseconds != 0;
        bool hasServerPico = hasServer && value.ServerPicoseconds != 0;
        byte mask = (byte)((hasValue ? 0x01 : 0) | (hasStatus ? 0x02 : 0) | (hasSource ? 0x04 : 0)
            | (hasServer ? 0x08 : 0) | (hasSourcePico ? 0x10 : 0) | (hasServerPico ? 0x20 : 0));
        w.WriteByte(mask);
        if (hasValue)
        {
            w.WriteVariant(value.Value);
        }

        if (hasStatus)
        {
            w.WriteStatusCode(value.Status);
        }

        if (hasSource)
        {
            w.WriteDateTime(value.SourceTimestamp);
        }

        if (hasSourcePico)
        {
            w.WriteUInt16(value.SourcePicoseconds);
        }

        if (hasServer)
        {
            w.WriteDateTime(value.ServerTimestamp);
        }

        if (hasServerPico)
        {
            w.WriteUInt16(value.ServerPicoseconds);
        }
    }

    public static DataValue ReadDataValue(this UaBinaryReader r)
    {
        byte mask = r.ReadByte();
        if ((mask & 0xC0) != 0)
        {
            throw new UaDecodeException($"DataValue mask 0x{mask:X2} at offset {r.Position - 1} has unknown bits.");
        }

        r.EnterNested();
        try
        {
            return new DataValue
            {
                Value = (mask & 0x01) != 0 ? r.ReadVariant() : Variant.Null,
                Status = (mask & 0x02) != 0 ? r.ReadStatusCode() : StatusCode.Good,
                SourceTimestamp = (mask & 0x04) != 0 ? r.ReadDateTime() : DateTime.MinValue,
                SourcePicoseconds = (mask & 0x10) != 0 ? r.ReadUInt16() : (ushort)0,
                ServerTimestamp = (mask & 0x08) != 0 ? r.ReadDateTime() : DateTime.MinValue,
                ServerPicoseconds = (mask & 0x20) != 0 ? r.ReadUInt16() : (ushort)0,
            };
        }
        finally
        {
            r.LeaveNested();
        }
    }
}
