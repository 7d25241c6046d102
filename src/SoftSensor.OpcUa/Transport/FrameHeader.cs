using System.Buffers.Binary;
using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Transport;

/// <summary>
/// The 8-byte header of every opc.tcp frame (Part 6 §7.1.2.2): three ASCII bytes of message type,
/// one byte chunk type, UInt32 MessageSize counting the whole frame including this header.
/// </summary>
public readonly record struct FrameHeader(uint MessageType, ChunkType ChunkType, uint MessageSize)
{
    public const int Size = 8;

    public static void Write(UaBinaryWriter w, uint messageType, ChunkType chunkType)
    {
        w.WriteByte((byte)(messageType & 0xFF));
        w.WriteByte((byte)((messageType >> 8) & 0xFF));
        w.WriteByte((byte)((messageType >> 16) & 0xFF));
        w.WriteByte((byte)chunkType);
        w.WriteUInt32(0); // patched by PatchSize
    }

    /// <summary>Sets the MessageSize of a frame written from offset 0.</summary>
    public static void PatchSize(UaBinaryWriter w) => w.PatchUInt32(4, (uint)w.Length);

    /// <summary>Parses and checks a header against the largest frame this side accepts.</summary>
    public static FrameHeader Parse(ReadOnlySpan<byte> header, uint maxFrameSize)
    {
        uint type = header[0] | ((uint)header[1] << 8) | ((uint)header[2] << 16);
        var chunk = (ChunkType)header[3];
        uint size = BinaryPrimitives.ReadUInt32LittleEndian(header[4..]);
        bool knownType = type is MessageTypes.Hello or MessageTypes.Acknowledge or MessageTypes.Error
            or MessageTypes.ReverseHello or MessageTypes.OpenChannel or MessageTypes.Message or MessageTypes.CloseChannel;
        if (!knownType)
        {
            throw new UaDecodeException($"Unknown message type '{MessageTypes.Name(type)}' (0x{type:X6}).");
        }

        if (chunk is not (ChunkType.Final or ChunkType.Intermediate or ChunkType.Abort))
        {
            throw new UaDecodeException($"Unknown chunk type 0x{header[3]:X2}; expected 'F', 'C' or 'A'.");
        }

        if (size < Size || size > maxFrameSize)
        {
            throw new UaDecodeException($"Frame size {size} is outside 8..{maxFrameSize} bytes.");
        }

        return new FrameHeader(type, chunk, size);
    }
}
