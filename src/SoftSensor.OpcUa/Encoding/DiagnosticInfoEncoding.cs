namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// Binary encoding of DiagnosticInfo (Part 6 §5.2.2.12): a mask byte (0x01 SymbolicId,
/// 0x02 NamespaceUri, 0x04 LocalizedText, 0x08 Locale, 0x10 AdditionalInfo, 0x20 InnerStatusCode,
/// 0x40 InnerDiagnosticInfo), then the fields present in the order SymbolicId, NamespaceUri,
/// Locale, LocalizedText, AdditionalInfo, InnerStatusCode, InnerDiagnosticInfo.
/// </summary>
public static class DiagnosticInfoEncoding
{
    public static void WriteDiagnosticInfo(this UaBinaryWriter w, DiagnosticInfo? value)
    {
        if (value is null)
        {
            w.WriteByte(0);
            return;
        }

        byte mask = (byte)((value.SymbolicId.HasValue ? 0x01 : 0) | (value.NamespaceUri.HasValue ? 0x02 : 0)
            | (value.LocalizedText.HasValue ? 0x04 : 0) | (value.Locale.HasValue ? 0x08 : 0)
            | (value.AdditionalInfo is not null ? 0x10 : 0) | (value.InnerStatusCode.HasValue ? 0x20 : 0)
            | (value.InnerDiagnosticInfo is not null ? 0x40 : 0));
        w.WriteByte(mask);
        if (value.SymbolicId is { } s)
        {
            w.WriteInt32(s);
        }

        if (value.NamespaceUri is { } n)
        {
            w.WriteInt32(n);
        }

        if (value.Locale is { } l)
        {
            w.WriteInt32(l);
        }

        if (value.LocalizedText is { } t)
        {
            w.WriteInt32(t);
        }

        if (value.AdditionalInfo is not null)
        {
            w.WriteString(value.AdditionalInfo);
        }

        if (value.InnerStatusCode is { } c)
        {
            w.WriteStatusCode(c);
        }

        if (value.InnerDiagnosticInfo is not null)
        {
            w.WriteDiagnosticInfo(value.InnerDiagnosticInfo);
        }
    }

    /// <summary>Reads a DiagnosticInfo; the empty mask gives null.</summary>
    public static DiagnosticInfo? ReadDiagnosticInfo(this UaBinaryReader r)
    {
        byte mask = r.ReadByte();
        if (mask == 0)
        {
            return null;
        }

        if ((mask & 0x80) != 0)
        {
            throw new UaDecodeException($"DiagnosticInfo mask 0x{mask:X2} at offset {r.Position - 1} has the reserved bit 0x80 set.");
        }

        r.EnterNested();
        try
        {
            return new DiagnosticInfo
            {
                SymbolicId = (mask & 0x01) != 0 ? r.ReadInt32() : null,
                NamespaceUri = (mask & 0x02) != 0 ? r.ReadInt32() : null,
                Locale = (mask & 0x08) != 0 ? r.ReadInt32() : null,
                LocalizedText = (mask & 0x04) != 0 ? r.ReadInt32() : null,
                AdditionalInfo = (mask & 0x10) != 0 ? r.ReadString() : null,
                InnerStatusCode = (mask & 0x20) != 0 ? r.ReadStatusCode() : null,
                InnerDiagnosticInfo = (mask & 0x40) != 0 ? r.ReadDiagnosticInfo() : null,
            };
        }
        finally
        {
            r.LeaveNested();
        }
    }
}
