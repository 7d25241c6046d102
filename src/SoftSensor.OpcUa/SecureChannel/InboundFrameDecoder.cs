using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>
/// Decodes one whole frame received from a server, the way the channel's reader does: header,
/// then ACK limits, ERR code, or the secure-conversation headers and (for a final chunk) the
/// response body. Bad input raises <see cref="UaDecodeException"/> only.
/// </summary>
public static class InboundFrameDecoder
{
    /// <summary>What a frame held.</summary>
    public sealed record Decoded(FrameHeader Header, ChunkHeaders? Chunk, object? Content);

    public static Decoded Decode(ReadOnlyMemory<byte> frame, uint maxFrameSize, DecodeLimits? limits = null)
    {
        if (frame.Length < FrameHeader.Size)
        {
            throw new UaDecodeException($"Frame of {frame.Length} bytes is shorter than its 8-byte header.");
        }

        var header = FrameHeader.Parse(frame.Span[..FrameHeader.Size], maxFrameSize);
        if (header.MessageSize != frame.Length)
        {
            throw new UaDecodeException($"Frame header says {header.MessageSize} bytes, the frame has {frame.Length}.");
        }

        var body = frame[FrameHeader.Size..];
        switch (header.MessageType)
        {
            case MessageTypes.Acknowledge:
                return new Decoded(header, null, ConnectionMessages.DecodeAcknowledge(body).Limits);
            case MessageTypes.Error:
                return new Decoded(header, null, ConnectionMessages.DecodeError(body).Error);
            case MessageTypes.OpenChannel:
            case MessageTypes.Message:
                var reader = new UaBinaryReader(body, limits);
                var chunk = ChunkHeaders.Read(reader, header.MessageType == MessageTypes.OpenChannel);
                var payload = body[reader.Position..];
                if (header.ChunkType == ChunkType.Abort)
                {
                    var abort = new ChunkAssembler(0, 0).Add(chunk.RequestId, ChunkType.Abort, payload);
                    return new Decoded(header, chunk, abort!.Error);
                }

                object? content = header.ChunkType == ChunkType.Final ? ResponseDecoder.Decode(payload, limits) : null;
                return new Decoded(header, chunk, content);
            default:
                throw new UaDecodeException($"A client does not receive '{MessageTypes.Name(header.MessageType)}' frames.");
        }
    }
}
