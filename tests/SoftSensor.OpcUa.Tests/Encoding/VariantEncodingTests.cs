using CsCheck;
using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Tests.Encoding;

/// <summary>Variant (Part 6 §5.2.2.16) against byte sequences derived from the rules, and round-trip properties.</summary>
public sealed class VariantEncodingTests
{
    [Fact]
    public void WriteVariant_ScalarDouble_IsTypeIdThenValue()
    {
        // Mask = built-in type id 11 (Double) = 0B, then 1.0 as 00 00 00 00 00 00 F0 3F.
        var w = new UaBinaryWriter();
        w.WriteVariant(Variant.From(1.0));
        Assert.Equal("0B 00 00 00 00 00 00 F0 3F", Hex.Of(w.WrittenSpan));
    }

    [Fact]
    public void WriteVariant_Int32Array_SetsBit7AndWritesLength()
    {
        // Mask 0x80 | 6 (Int32) = 86, length 3, then 1, 2, 3.
        var w = new UaBinaryWriter();
        w.WriteVariant(Variant.Array(BuiltInType.Int32, new[] { 1, 2, 3 }));
        Assert.Equal("86 03 00 00 00 01 00 00 00 02 00 00 00 03 00 00 00", Hex.Of(w.WrittenSpan));
        var back = new UaBinaryReader(w.ToArray()).ReadVariant();
        Assert.True(back.IsArray);
        Assert.Equal(new[] { 1, 2, 3 }, (int[])back.Value!);
    }

    [Fact]
    public void WriteVariant_MatrixWithDimensions_SetsBit6AndAppendsDimensions()
    {
        // A 2×2 Byte matrix: mask 0x80 | 0x40 | 3 = C3, length 4, bytes 01 02 03 04, then the
        // dimensions array: count 2, 2, 2.
        var w = new UaBinaryWriter();
        w.WriteVariant(Variant.Array(BuiltInType.Byte, new byte[] { 1, 2, 3, 4 }, [2, 2]));
        Assert.Equal("C3 04 00 00 00 01 02 03 04 02 00 00 00 02 00 00 00 02 00 00 00", Hex.Of(w.WrittenSpan));
        var back = new UaBinaryReader(w.ToArray()).ReadVariant();
        Assert.Equal([2, 2], back.Dimensions!);
    }

    [Fact]
    public void ReadVariant_DimensionsNotMatchingLength_ThrowsDecodeException()
    {
        // Dimensions 2×3 = 6 for an array of 4 elements: inconsistent.
        var bytes = Hex.Bytes("C3 04 00 00 00 01 02 03 04 02 00 00 00 02 00 00 00 03 00 00 00");
        Assert.Throws<UaDecodeException>(() => new UaBinaryReader(bytes).ReadVariant());
    }

    [Fact]
    public void ReadVariant_ScalarVariantOrUnknownType_ThrowsDecodeException()
    {
        // Type 24 (Variant) is allowed only in arrays; type 30 does not exist.
        Assert.Throws<UaDecodeException>(() => new UaBinaryReader(Hex.Bytes("18 00")).ReadVariant());
        Assert.Throws<UaDecodeException>(() => new UaBinaryReader(Hex.Bytes("1E 00")).ReadVariant());
    }

    [Fact]
    public void WriteVariant_ArrayOfVariants_RoundTrips()
    {
        // Mask 0x80 | 24 = 98, then two Variants: String "a" (0C 01 00 00 00 61) and Boolean true (01 01).
        var inner = new[] { Variant.From("a"), Variant.From(true) };
        var w = new UaBinaryWriter();
        w.WriteVariant(Variant.Array(BuiltInType.Variant, inner));
        Assert.Equal("98 02 00 00 00 0C 01 00 00 00 61 01 01", Hex.Of(w.WrittenSpan));
        var back = (Variant[])new UaBinaryReader(w.ToArray()).ReadVariant().Value!;
        Assert.Equal("a", back[0].Value);
        Assert.Equal(true, back[1].Value);
    }

    [Fact]
    public void Variant_AnyDouble_RoundTripsBitExactly()
    {
        // Property: every binary64, NaN and infinities included, survives encode → decode.
        Gen.Double.Sample(d =>
        {
            var w = new UaBinaryWriter();
            w.WriteVariant(Variant.From(d));
            var back = (double)new UaBinaryReader(w.ToArray()).ReadVariant().Value!;
            return BitConverter.DoubleToInt64Bits(back) == BitConverter.DoubleToInt64Bits(d);
        });
    }

    [Fact]
    public void Variant_AnyStringArray_RoundTrips()
    {
        Gen.String.Array.Sample(items =>
        {
            var w = new UaBinaryWriter();
            w.WriteVariant(Variant.Array(BuiltInType.String, items));
            var back = (string[])new UaBinaryReader(w.ToArray()).ReadVariant().Value!;
            return back.SequenceEqual(items);
        });
    }
}
