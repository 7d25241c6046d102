using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.SecureChannel.Security;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>
/// Splits an outgoing message body into chunks that fit the peer's receive buffer (Part 6
/// §6.7.2.2): every chunk but the last is 'C', the last 'F'. Refuses bodies beyond the peer's
/// MaxMessageSize or MaxChunkCount (0: no limit) with BadRequestTooLarge before sending anything.
/// Each chunk is sealed (signed, padded, encrypted) by the given <see cref="ChunkProtection"/>.
/// </summary>
public static class MessageChunker
{
    /// <summary>Builds the chunks; <paramref name="writeSecurityHeader"/> writes channel id and security header.</summary>
    public static List<byte[]> Build(
        uint messageType,
        Action<UaBinaryWriter> writeSecurityHeader,
        uint requestId,
        ReadOnlySpan<byte> body,
        uint chunkSize,
        TransportLimits remote,
        SequenceNumbers sequence) =>
        Build(messageType, writeSecurityHeader, requestId, body, chunkSize, remote, sequence, ChunkProtection.None);

    public static List<byte[]> Build(
        uint messageType,
        Action<UaBinaryWriter> writeSecurityHeader,
        uint requestId,
        ReadOnlySpan<byte> body,
        uint chunkSize,
        TransportLimits remote,
        SequenceNumbers sequence,
        ChunkProtection protection)
    {
        var probe = new UaBinaryWriter(128);
        writeSecurityHeader(probe);
        int securityEnd = FrameHeader.Size + probe.Length;
        int overhead = securityEnd + 8;
        int room = protection.MaxBodySize((int)chunkSize - securityEnd);
        if (room <= 0)
        {
            throw new ServiceResultException(new StatusCode(StatusCodes.BadTcpMessageTooLarge), $"Chunk size {chunkSize} leaves no room for a body after {overhead} header bytes.");
        }

        int count = Math.Max(1, (body.Length + room - 1) / room);
        if ((remote.MaxMessageSize != 0 && body.Length > remote.MaxMessageSize) || (remote.MaxChunkCount != 0 && count > remote.MaxChunkCount))
        {
            throw new ServiceResultException(new StatusCode(StatusCodes.BadRequestTooLarge),
                $"Request of {body.Length} bytes in {count} chunks exceeds the server's limits ({remote.MaxMessageSize} bytes, {remote.MaxChunkCount} chunks).");
        }

        var chunks = new List<byte[]>(count);
        for (int i = 0; i < count; i++)
        {
            int start = i * room;
            var part = body.Slice(start, Math.Min(room, body.Length - start));
            var w = new UaBinaryWriter(overhead + part.Length);
            FrameHeader.Write(w, messageType, i == count - 1 ? ChunkType.Final : ChunkType.Intermediate);
            writeSecurityHeader(w);
            w.WriteUInt32(sequence.Next());
            w.WriteUInt32(requestId);
            w.WriteRaw(part);
            FrameHeader.PatchSize(w);
            chunks.Add(protection.Seal(w.WrittenSpan, securityEnd));
        }

        return chunks;
    }
}
