using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Tests.Encoding;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.Tests.Transport;

/// <summary>Hello, Acknowledge and the frame header (Part 6 §7.1.2) against byte sequences derived from the rules.</summary>
public sealed class ConnectionMessagesTests
{
    [Fact]
    public void EncodeHello_Limits_MatchesHeaderAndFieldOrder()
    {
        // Part 6 §7.1.2.2/§7.1.2.3: "HEL" 48 45 4C, chunk 'F' 46, size 8 header + 5 × 4 + 4 + 9 = 41 (29 00 00 00);
        // ProtocolVersion 0; ReceiveBufferSize 8192 (00 20 00 00); SendBufferSize 8192;
        // MaxMessageSize 0; MaxChunkCount 0; EndpointUrl "opc.tcp:/" (9 bytes).
        var limits = new TransportLimits { ReceiveBufferSize = 8192, SendBufferSize = 8192, MaxMessageSize = 0, MaxChunkCount = 0 };
        var hello = ConnectionMessages.EncodeHello(limits, "opc.tcp:/");
        Assert.Equal(
            "48 45 4C 46 29 00 00 00 00 00 00 00 00 20 00 00 00 20 00 00 00 00 00 00 00 00 00 00 09 00 00 00 6F 70 63 2E 74 63 70 3A 2F",
            Hex.Of(hello));
    }

    [Fact]
    public void DecodeAcknowledge_BufferBelow8192_IsRefused()
    {
        // Part 6 §7.1.2.4: buffer sizes shall be at least 8192 bytes.
        var body = Hex.Bytes("00 00 00 00 00 10 00 00 00 20 00 00 00 00 00 00 00 00 00 00");
        Assert.Throws<UaDecodeException>(() => ConnectionMessages.DecodeAcknowledge(body));
    }

    [Theory]
    [InlineData("58 59 5A 46 10 00 00 00")] // unknown type "XYZ"
    [InlineData("4D 53 47 51 10 00 00 00")] // chunk type 'Q'
    [InlineData("4D 53 47 46 04 00 00 00")] // size smaller than the header
    [InlineData("4D 53 47 46 00 00 01 00")] // size beyond the receive buffer
    public void ParseHeader_Malformed_ThrowsDecodeException(string hex) =>
        Assert.Throws<UaDecodeException>(() => FrameHeader.Parse(Hex.Bytes(hex), 65535));

    [Theory]
    [InlineData("opc.tcp://127.0.0.1:4841/softsensor", "127.0.0.1", 4841)]
    [InlineData("opc.tcp://plc.local", "plc.local", 4840)]
    public void ParseEndpoint_Url_GivesHostAndPort(string url, string host, int port)
    {
        var address = EndpointAddress.Parse(url);
        Assert.Equal(host, address.Host);
        Assert.Equal(port, address.Port);
    }

    [Fact]
    public void ParseEndpoint_WrongScheme_NamesTheUrl()
    {
        var e = Assert.Throws<FormatException>(() => EndpointAddress.Parse("http://x:1"));
        Assert.Contains("http://x:1", e.Message, StringComparison.Ordinal);
    }
}
