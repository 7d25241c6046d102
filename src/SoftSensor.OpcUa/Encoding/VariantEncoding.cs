namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// Binary encoding of Variant (Part 6 §5.2.2.16): a mask byte whose bits 0–5 are the built-in
/// type id, bit 7 (0x80) says an array follows (Int32 length then the elements) and bit 6 (0x40)
/// says the array dimensions follow (Int32 count then Int32 each). A Variant holds a Variant only
/// in an array.
/// </summary>
public static class VariantEncoding
{
    private const byte ArrayFlag = 0x80;
    private const byte DimensionsFlag = 0x40;

    public static void WriteVariant(this UaBinaryWriter w, Variant? value)
    {
        value ??= Variant.Null;
        if (value.IsNull)
        {
            w.WriteByte(0);
            return;
        }

        byte mask = (byte)value.Type;
        if (!value.IsArray)
        {
            w.WriteByte(mask);
            ScalarEncoding.Write(w, value.Type, value.Value);
            return;
        }

        var items = (Array)value.Value!;
        mask |= ArrayFlag;
        if (value.Dimensions is not null)
        {
            mask |= DimensionsFlag;
        }

        w.WriteByte(mask);
        w.WriteInt32(items.Length);
        foreach (var item in items)
        {
            ScalarEncoding.Write(w, value.Type, item);
        }

        if (value.Dimensions is not null)
        {
            w.WriteArray(value.Dimensions, static (x, d) => x.WriteInt32(d));
        }
    }

    public static Variant ReadVariant(this UaBinaryReader r)
    {
        byte mask = r.ReadByte();
        byte typeId = (byte)(mask & 0x3F);
        if (typeId > (byte)BuiltInType.DiagnosticInfo)
        {
            throw new UaDecodeException($"Variant type id {typeId} at offset {r.Position - 1}; expected 0 to 25.");
        }

        var type = (BuiltInType)typeId;
        if (type == BuiltInType.Null)
        {
            return Variant.Null;
        }

        r.EnterNested();
        try
        {
            if ((mask & ArrayFlag) == 0)
            {
                if ((mask & DimensionsFlag) != 0 || type == BuiltInType.Variant)
                {
                    throw new UaDecodeException($"Variant mask 0x{mask:X2} at offset {r.Position - 1} is not a valid scalar.");
                }

                return Variant.Scalar(type, ScalarEncoding.Read(r, type));
            }

            return ReadArrayBody(r, type, (mask & DimensionsFlag) != 0);
        }
        finally
        {
            r.LeaveNested();
        }
    }

    private static Variant ReadArrayBody(UaBinaryReader r, BuiltInType type, bool hasDimensions)
    {
        int length = r.ReadInt32();
        if (length < 0)
        {
            length = 0;
        }

        if (length > r.Limits.MaxArrayLength || length > r.Remaining)
        {
            throw new UaDecodeException($"Variant array of {length} elements at offset {r.Position - 4} exceeds the limit or the bytes left.");
        }

        var items = System.Array.CreateInstance(VariantTypes.ClrType(type), length);
        for (int i = 0; i < length; i++)
        {
            items.SetValue(ScalarEncoding.Read(r, type), i);
        }

        int[]? dimensions = null;
        if (hasDimensions)
        {
            dimensions = r.ReadArrayOrEmpty(static x => x.ReadInt32());
            long product = VariantTypes.ElementCount(dimensions);
            if (dimensions.Length == 0 || product != length)
            {
                throw new UaDecodeException($"Variant dimensions [{string.Join(",", dimensions)}] do not match the array length {length}.");
            }
        }

        return Variant.Array(type, items, dimensions);
    }
}
