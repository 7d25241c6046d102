using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Tests.Encoding;

/// <summary>NodeId and ExpandedNodeId (Part 6 §5.2.2.9, §5.2.2.10) against byte sequences derived from the rules.</summary>
public sealed class NodeIdEncodingTests
{
    [Theory]
    // Part 6 §5.2.2.9: two-byte form 0x00 for ns 0 and id ≤ 255: i=72 → 00 48.
    [InlineData("i=72", "00 48")]
    // Four-byte form 0x01 for ns ≤ 255 and id ≤ 65535: ns=5;i=1025 → 01, ns 05, id 0x0401 LE → 01 05 01 04.
    [InlineData("ns=5;i=1025", "01 05 01 04")]
    // Numeric form 0x02 beyond those ranges: ns=300 (2C 01), id 70000 = 0x00011170 → 70 11 01 00.
    [InlineData("ns=300;i=70000", "02 2C 01 70 11 01 00")]
    // String form 0x03: ns=1, then the String "Hot水" = 48 6F 74 E6 B0 B4 (6 bytes).
    [InlineData("ns=1;s=Hot水", "03 01 00 06 00 00 00 48 6F 74 E6 B0 B4")]
    // Guid form 0x04: ns=4 then the Guid of §5.2.2.6.
    [InlineData("ns=4;g=72962B91-FA75-4AE6-8D28-B404DC7DAF63", "04 04 00 91 2B 96 72 75 FA E6 4A 8D 28 B4 04 DC 7D AF 63")]
    // Opaque form 0x05: ns=2 then a ByteString: "AQID" is base64 of 01 02 03.
    [InlineData("ns=2;b=AQID", "05 02 00 03 00 00 00 01 02 03")]
    public void WriteNodeId_EachForm_MatchesSpecLayoutAndRoundTrips(string text, string hex)
    {
        var id = NodeId.Parse(text);
        var w = new UaBinaryWriter();
        w.WriteNodeId(id);
        Assert.Equal(hex, Hex.Of(w.WrittenSpan));
        Assert.Equal(id, new UaBinaryReader(w.ToArray()).ReadNodeId());
    }

    [Fact]
    public void WriteExpandedNodeId_WithNamespaceUri_SetsFlag0x80AndAppendsUri()
    {
        // Part 6 §5.2.2.10: bit 0x80 of the encoding byte says a NamespaceUri String follows the
        // NodeId (whose index is then 0). s=A in ns 0: 03 | 0x80 = 83, ns 00 00, "A" 01 00 00 00 41, uri "u" 01 00 00 00 75.
        var id = ExpandedNodeId.Parse("nsu=u;s=A");
        var w = new UaBinaryWriter();
        w.WriteExpandedNodeId(id);
        Assert.Equal("83 00 00 01 00 00 00 41 01 00 00 00 75", Hex.Of(w.WrittenSpan));
        Assert.Equal(id, new UaBinaryReader(w.ToArray()).ReadExpandedNodeId());
    }

    [Fact]
    public void WriteExpandedNodeId_WithServerIndex_SetsFlag0x40AndAppendsUInt32()
    {
        // Bit 0x40: a ServerIndex UInt32 follows. i=1 two-byte 00 | 0x40 = 40, id 01, server 3 = 03 00 00 00.
        var id = new ExpandedNodeId(NodeId.Numeric(1), null, 3);
        var w = new UaBinaryWriter();
        w.WriteExpandedNodeId(id);
        Assert.Equal("40 01 03 00 00 00", Hex.Of(w.WrittenSpan));
        Assert.Equal(id, new UaBinaryReader(w.ToArray()).ReadExpandedNodeId());
    }

    [Fact]
    public void ReadNodeId_ExpandedFlagsOrUnknownForm_ThrowDecodeException()
    {
        Assert.Throws<UaDecodeException>(() => new UaBinaryReader(Hex.Bytes("83 00 00 00 00 00 00")).ReadNodeId());
        Assert.Throws<UaDecodeException>(() => new UaBinaryReader(Hex.Bytes("06 00 00")).ReadNodeId());
    }

    [Theory]
    [InlineData("nsu=urn:softsensor:peer:reactor;s=Reactor1.OffgasO2", "urn:softsensor:peer:reactor", "s=Reactor1.OffgasO2")]
    [InlineData("nsu=http://example.org/UA/;i=5", "http://example.org/UA/", "i=5")]
    public void ParseExpanded_NsuForm_KeepsUriAndIdentifier(string text, string uri, string identifier)
    {
        // Part 6 §5.3.1.11: nsu=<uri>;<identifier> names the namespace by URI.
        var id = ExpandedNodeId.Parse(text);
        Assert.Equal(uri, id.NamespaceUri);
        Assert.Equal(identifier, id.NodeId.IdentifierText);
        Assert.Equal(text, id.ToString());
    }

    [Theory]
    [InlineData("ns=x;i=1")]
    [InlineData("i=-1")]
    [InlineData("q=1")]
    [InlineData("ns=1")]
    [InlineData("g=not-a-guid")]
    public void Parse_BadText_ThrowsFormatExceptionNamingTheText(string text)
    {
        var e = Assert.Throws<FormatException>(() => NodeId.Parse(text));
        Assert.Contains(text, e.Message, StringComparison.Ordinal);
    }
}
