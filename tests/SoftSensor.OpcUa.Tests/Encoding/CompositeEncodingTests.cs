using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Tests.Encoding;

/// <summary>The composite built-in types (Part 6 §5.2.2.11 to §5.2.2.17) against byte sequences derived from the rules.</summary>
public sealed class CompositeEncodingTests
{
    [Fact]
    public void WriteLocalizedText_LocaleAndText_MaskThenBoth()
    {
        // Part 6 §5.2.2.14: mask 0x01 locale | 0x02 text = 03, then "en" (02 00 00 00 65 6E), then "O2" (02 00 00 00 4F 32).
        var w = new UaBinaryWriter();
        w.WriteLocalizedText(new LocalizedText("en", "O2"));
        w.WriteLocalizedText(new LocalizedText(null, "O2"));
        w.WriteLocalizedText(LocalizedText.Null);
        Assert.Equal("03 02 00 00 00 65 6E 02 00 00 00 4F 32 02 02 00 00 00 4F 32 00", Hex.Of(w.WrittenSpan));
        var r = new UaBinaryReader(w.ToArray());
        Assert.Equal(new LocalizedText("en", "O2"), r.ReadLocalizedText());
        Assert.Equal(new LocalizedText(null, "O2"), r.ReadLocalizedText());
        Assert.Equal(LocalizedText.Null, r.ReadLocalizedText());
    }

    [Fact]
    public void WriteQualifiedName_IsUInt16IndexThenString()
    {
        // Part 6 §5.2.2.13: 2:RQ → 02 00, then 02 00 00 00 52 51.
        var w = new UaBinaryWriter();
        w.WriteQualifiedName(new QualifiedName(2, "RQ"));
        Assert.Equal("02 00 02 00 00 00 52 51", Hex.Of(w.WrittenSpan));
        Assert.Equal(new QualifiedName(2, "RQ"), new UaBinaryReader(w.ToArray()).ReadQualifiedName());
    }

    [Theory]
    // Part 4 §7.39: the top two bits are the severity: 00 Good, 01 Uncertain, 10 Bad (11 reserved → Bad).
    [InlineData(0x00000000u, StatusSeverity.Good)]
    [InlineData(0x40920000u, StatusSeverity.Uncertain)]
    [InlineData(0x80340000u, StatusSeverity.Bad)]
    [InlineData(0xC0000000u, StatusSeverity.Bad)]
    public void StatusCodeSeverity_TopTwoBits_GiveSeverity(uint code, StatusSeverity expected) =>
        Assert.Equal(expected, new StatusCode(code).Severity);

    [Fact]
    public void StatusCodeIs_InfoBitsSet_ComparesOnTopSixteenBits()
    {
        // Part 4 §7.39: the low 16 bits are info bits (e.g. 0x0400 InfoType DataValue with limit bits).
        Assert.True(new StatusCode(StatusCodes.UncertainLastUsableValue | 0x0401).Is(StatusCodes.UncertainLastUsableValue));
    }

    [Fact]
    public void WriteDiagnosticInfo_AllFields_FollowsMaskAndFieldOrder()
    {
        // Part 6 §5.2.2.12: mask 0x7F (all seven), then SymbolicId 1, NamespaceUri 2, Locale 3,
        // LocalizedText 4 (Locale before LocalizedText although its bit is 0x08), AdditionalInfo "x",
        // InnerStatusCode 0x80340000, then the inner DiagnosticInfo with mask 0x01 and SymbolicId 5.
        var info = new DiagnosticInfo
        {
            SymbolicId = 1, NamespaceUri = 2, Locale = 3, LocalizedText = 4, AdditionalInfo = "x",
            InnerStatusCode = new StatusCode(0x80340000), InnerDiagnosticInfo = new DiagnosticInfo { SymbolicId = 5 },
        };
        var w = new UaBinaryWriter();
        w.WriteDiagnosticInfo(info);
        Assert.Equal("7F 01 00 00 00 02 00 00 00 03 00 00 00 04 00 00 00 01 00 00 00 78 00 00 34 80 01 05 00 00 00", Hex.Of(w.WrittenSpan));
        Assert.Equal(info, new UaBinaryReader(w.ToArray()).ReadDiagnosticInfo());
    }

    [Fact]
    public void ReadDiagnosticInfo_DeeplyNested_StopsAtDepthLimit()
    {
        // Mask 0x40 repeated: each byte opens another inner DiagnosticInfo; the limit stops it.
        var bytes = Enumerable.Repeat((byte)0x40, 200).Append((byte)0).ToArray();
        Assert.Throws<UaDecodeException>(() => new UaBinaryReader(bytes, new DecodeLimits { MaxNestingDepth = 32 }).ReadDiagnosticInfo());
    }

    [Fact]
    public void WriteExtensionObject_BinaryBody_IsTypeIdEncodingLengthBody()
    {
        // Part 6 §5.2.2.15: TypeId i=724 (DataChangeFilter_Encoding_DefaultBinary, four-byte form 01 00 D4 02),
        // encoding 01 (ByteString body), Int32 length 16, then the body: trigger 1 (01 00 00 00),
        // deadband type 1 absolute (01 00 00 00), deadband 0.5 (00 00 00 00 00 00 E0 3F).
        var w = new UaBinaryWriter();
        w.WriteExtensionObject(new SoftSensor.OpcUa.Services.DataChangeFilter(SoftSensor.OpcUa.Services.DataChangeTrigger.StatusValue, SoftSensor.OpcUa.Services.DeadbandType.Absolute, 0.5));
        Assert.Equal("01 00 D4 02 01 10 00 00 00 01 00 00 00 01 00 00 00 00 00 00 00 00 00 E0 3F", Hex.Of(w.WrittenSpan));
        var read = new UaBinaryReader(w.ToArray()).ReadExtensionObject();
        Assert.Equal(NodeId.Numeric(724), read.TypeId);
        Assert.Equal(16, read.Body!.Length);
    }

    [Fact]
    public void WriteExtensionObject_Null_IsNullNodeIdAndNoBody()
    {
        var w = new UaBinaryWriter();
        w.WriteExtensionObject(ExtensionObject.Null);
        Assert.Equal("00 00 00", Hex.Of(w.WrittenSpan));
        Assert.True(new UaBinaryReader(w.ToArray()).ReadExtensionObject().IsNull);
    }

    [Fact]
    public void WriteDataValue_ValueStatusAndTimestamps_FollowsMaskOrder()
    {
        // Part 6 §5.2.2.17: mask 0x01 value | 0x02 status | 0x04 source time | 0x10 source ps = 0x17,
        // then Variant Double (0B + 8 bytes of 2.5 = 00 00 00 00 00 00 04 40), status 0x40950000,
        // source timestamp 1970-01-01 (00 80 3E D5 DE B1 9D 01), source picoseconds 10 (0A 00).
        var value = new DataValue
        {
            Value = Variant.From(2.5), Status = new StatusCode(StatusCodes.UncertainSubNormal),
            SourceTimestamp = DateTime.UnixEpoch, SourcePicoseconds = 10,
        };
        var w = new UaBinaryWriter();
        w.WriteDataValue(value);
        Assert.Equal("17 0B 00 00 00 00 00 00 04 40 00 00 95 40 00 80 3E D5 DE B1 9D 01 0A 00", Hex.Of(w.WrittenSpan));
        var back = new UaBinaryReader(w.ToArray()).ReadDataValue();
        Assert.Equal(2.5, back.Value.AsDouble());
        Assert.Equal(value.Status, back.Status);
        Assert.Equal(DateTime.UnixEpoch, back.SourceTimestamp);
        Assert.Equal(10, back.SourcePicoseconds);
    }

    [Fact]
    public void ReadDataValue_EmptyMask_IsNullValueWithGoodStatus()
    {
        // Part 6 §5.2.2.17: an absent StatusCode means Good.
        var back = new UaBinaryReader(Hex.Bytes("00")).ReadDataValue();
        Assert.True(back.Value.IsNull);
        Assert.True(back.Status.IsGood);
    }
}
