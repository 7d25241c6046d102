using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Tests.Encoding;

/// <summary>Primitive types of UA Binary (Part 6 §5.2.2.1 to §5.2.2.7) against byte sequences derived from its rules.</summary>
public sealed class PrimitiveEncodingTests
{
    [Fact]
    public void WriteString_Example_IsLengthThenUtf8()
    {
        // Part 6 §5.2.2.4 example: "水Boy" is 水 (U+6C34 → UTF-8 E6 B0 B4) then "Boy" (42 6F 79):
        // 6 bytes, so Int32 length 06 00 00 00 little-endian, then the bytes.
        var w = new UaBinaryWriter();
        w.WriteString("水Boy");
        Assert.Equal("06 00 00 00 E6 B0 B4 42 6F 79", Hex.Of(w.WrittenSpan));
        Assert.Equal("水Boy", new UaBinaryReader(w.ToArray()).ReadString());
    }

    [Fact]
    public void WriteString_NullAndEmpty_AreMinusOneAndZero()
    {
        // Part 6 §5.2.2.4: a null string has length -1 (FF FF FF FF); an empty one length 0.
        var w = new UaBinaryWriter();
        w.WriteString(null);
        w.WriteString(string.Empty);
        Assert.Equal("FF FF FF FF 00 00 00 00", Hex.Of(w.WrittenSpan));
        var r = new UaBinaryReader(w.ToArray());
        Assert.Null(r.ReadString());
        Assert.Equal(string.Empty, r.ReadString());
    }

    [Fact]
    public void WriteInt32AndDouble_AreLittleEndian()
    {
        // Part 6 §5.2.2.2 and §5.2.2.3: integers little-endian; Double IEEE 754 binary64 little-endian.
        // 1.0 = 0x3FF0000000000000, so bytes 00 00 00 00 00 00 F0 3F; -2 as Int32 = FE FF FF FF.
        var w = new UaBinaryWriter();
        w.WriteInt32(-2);
        w.WriteDouble(1.0);
        w.WriteUInt16(0x1234);
        Assert.Equal("FE FF FF FF 00 00 00 00 00 00 F0 3F 34 12", Hex.Of(w.WrittenSpan));
    }

    [Fact]
    public void WriteDateTime_UnixEpoch_Is116444736000000000Ticks()
    {
        // Part 6 §5.2.2.5: 100 ns ticks since 1601-01-01 UTC. 1970-01-01 is 134 774 days later
        // (369 years, 89 leap days): 134774 × 86400 s × 10^7 = 116 444 736 000 000 000 = 0x019DB1DED53E8000.
        var w = new UaBinaryWriter();
        w.WriteDateTime(DateTime.UnixEpoch);
        Assert.Equal("00 80 3E D5 DE B1 9D 01", Hex.Of(w.WrittenSpan));
        Assert.Equal(DateTime.UnixEpoch, new UaBinaryReader(w.ToArray()).ReadDateTime());
    }

    [Fact]
    public void WriteDateTime_MinValueAndBefore1601_AreZero()
    {
        // Part 6 §5.2.2.5: a date before 1601 or the "no date" value is encoded as 0.
        var w = new UaBinaryWriter();
        w.WriteDateTime(DateTime.MinValue);
        w.WriteDateTime(new DateTime(1500, 1, 1, 0, 0, 0, DateTimeKind.Utc));
        Assert.Equal("00 00 00 00 00 00 00 00 00 00 00 00 00 00 00 00", Hex.Of(w.WrittenSpan));
        Assert.Equal(DateTime.MinValue, new UaBinaryReader(w.ToArray()).ReadDateTime());
    }

    [Fact]
    public void WriteGuid_Example_IsData1To3LittleEndianThenData4()
    {
        // Part 6 §5.2.2.6 example: 72962B91-FA75-4AE6-8D28-B404DC7DAF63 →
        // Data1 91 2B 96 72, Data2 75 FA, Data3 E6 4A, Data4 8D 28 B4 04 DC 7D AF 63.
        var w = new UaBinaryWriter();
        w.WriteGuid(Guid.Parse("72962B91-FA75-4AE6-8D28-B404DC7DAF63"));
        Assert.Equal("91 2B 96 72 75 FA E6 4A 8D 28 B4 04 DC 7D AF 63", Hex.Of(w.WrittenSpan));
        Assert.Equal(Guid.Parse("72962B91-FA75-4AE6-8D28-B404DC7DAF63"), new UaBinaryReader(w.ToArray()).ReadGuid());
    }

    [Fact]
    public void WriteByteString_NullAndBytes_RoundTrip()
    {
        // Part 6 §5.2.2.7: same layout as String: Int32 length (-1 null) then the bytes.
        var w = new UaBinaryWriter();
        w.WriteByteString(null);
        w.WriteByteString([0xCA, 0xFE]);
        Assert.Equal("FF FF FF FF 02 00 00 00 CA FE", Hex.Of(w.WrittenSpan));
        var r = new UaBinaryReader(w.ToArray());
        Assert.Null(r.ReadByteString());
        Assert.Equal([0xCA, 0xFE], r.ReadByteString());
    }

    [Fact]
    public void ReadString_LengthBeyondMessage_ThrowsDecodeException()
    {
        // Length 16 with 2 bytes left: a truncated message, reported as a decode error.
        var r = new UaBinaryReader(Hex.Bytes("10 00 00 00 41 42"));
        Assert.Throws<UaDecodeException>(() => r.ReadString());
    }

    [Fact]
    public void ReadString_InvalidUtf8_ThrowsDecodeException()
    {
        // Part 6 §5.2.2.4: Strings are UTF-8; C3 28 is an invalid two-byte sequence.
        var r = new UaBinaryReader(Hex.Bytes("02 00 00 00 C3 28"));
        Assert.Throws<UaDecodeException>(() => r.ReadString());
    }

    [Fact]
    public void ReadArray_CountAboveLimit_ThrowsDecodeException()
    {
        var r = new UaBinaryReader(Hex.Bytes("00 00 00 10"), new DecodeLimits { MaxArrayLength = 1000 });
        Assert.Throws<UaDecodeException>(() => r.ReadArray(static x => x.ReadInt32()));
    }
}
