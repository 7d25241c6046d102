namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// Binary encoding of the small composite built-in types (Part 6 §5.2.2.11 to §5.2.2.15):
/// StatusCode (UInt32), QualifiedName (UInt16 index, String), LocalizedText (mask 0x01 locale,
/// 0x02 text, then those present), ExtensionObject (TypeId, encoding byte, Int32 length, body).
/// </summary>
public static class CompositeEncoding
{
    public static void WriteStatusCode(this UaBinaryWriter w, StatusCode value) => w.WriteUInt32(value.Code);

    public static StatusCode ReadStatusCode(this UaBinaryReader r) => new(r.ReadUInt32());

    public static void WriteQualifiedName(this UaBinaryWriter w, QualifiedName? value)
    {
        value ??= QualifiedName.Null;
        w.WriteUInt16(value.NamespaceIndex);
        w.WriteString(value.Name);
    }

    public static QualifiedName ReadQualifiedName(this UaBinaryReader r) => new(r.ReadUInt16(), r.ReadString());

    public static void WriteLocalizedText(this UaBinaryWriter w, LocalizedText? value)
    {
        value ??= LocalizedText.Null;
        byte mask = (byte)((value.Locale is not null ? 0x01 : 0) | (value.Text is not null ? 0x02 : 0));
        w.WriteByte(mask);
        if (value.Locale is not null)
        {
            w.WriteString(value.Locale);
        }

        if (value.Text is not null)
        {
            w.WriteString(value.Text);
        }
    }

    public static LocalizedText ReadLocalizedText(this UaBinaryReader r)
    {
        byte mask = r.ReadByte();
        if ((mask & ~0x03) != 0)
        {
            throw new UaDecodeException($"LocalizedText mask 0x{mask:X2} at offset {r.Position - 1} has unknown bits.");
        }

        string? locale = (mask & 0x01) != 0 ? r.ReadString() : null;
        string? text = (mask & 0x02) != 0 ? r.ReadString() : null;
        return new LocalizedText(locale, text);
    }

    public static void WriteExtensionObject(this UaBinaryWriter w, ExtensionObject? value)
    {
        value ??= ExtensionObject.Null;
        w.WriteNodeId(value.TypeId);
        w.WriteByte((byte)value.BodyKind);
        if (value.BodyKind != ExtensionObjectBody.None)
        {
            w.WriteByteString(value.Body ?? []);
        }
    }

    /// <summary>Writes a structure as an ExtensionObject with a binary body (null: the null ExtensionObject).</summary>
    public static void WriteExtensionObject(this UaBinaryWriter w, IUaEncodeable? value)
    {
        if (value is null)
        {
            w.WriteExtensionObject(ExtensionObject.Null);
            return;
        }

        w.WriteNodeId(NodeId.Numeric(value.BinaryEncodingId));
        w.WriteByte((byte)ExtensionObjectBody.Binary);
        int lengthAt = w.Length;
        w.WriteInt32(0);
        value.Encode(w);
        w.PatchUInt32(lengthAt, (uint)(w.Length - lengthAt - 4));
    }

    public static ExtensionObject ReadExtensionObject(this UaBinaryReader r)
    {
        var typeId = r.ReadNodeId();
        byte kind = r.ReadByte();
        return kind switch
        {
            0x00 => new ExtensionObject(typeId, ExtensionObjectBody.None, null),
            0x01 => new ExtensionObject(typeId, ExtensionObjectBody.Binary, r.ReadByteString() ?? []),
            0x02 => new ExtensionObject(typeId, ExtensionObjectBody.Xml, r.ReadByteString() ?? []),
            _ => throw new UaDecodeException($"ExtensionObject encoding byte 0x{kind:X2} at offset {r.Position - 1}; expected 0x00, 0x01 or 0x02."),
        };
    }
}
