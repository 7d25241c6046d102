namespace SoftSensor.OpcUa.Transport;

/// <summary>
/// The three-letter message types of the OPC UA Connection Protocol and Secure Conversation
/// (Part 6 §7.1.2.2 and §6.7.2.2), read as the little-endian UInt32 of their ASCII bytes.
/// </summary>
public static class MessageTypes
{
    public const uint Hello = 'H' | ('E' << 8) | ('L' << 16);
    public const uint Acknowledge = 'A' | ('C' << 8) | ('K' << 16);
    public const uint Error = 'E' | ('R' << 8) | ('R' << 16);
    public const uint ReverseHello = 'R' | ('H' << 8) | ('E' << 16);
    public const uint OpenChannel = 'O' | ('P' << 8) | ('N' << 16);
    public const uint Message = 'M' | ('S' << 8) | ('G' << 16);
    public const uint CloseChannel = 'C' | ('L' << 8) | ('O' << 16);

    /// <summary>The three letters of a message type, for messages and logs.</summary>
    public static string Name(uint type) =>
        new([(char)(type & 0xFF), (char)((type >> 8) & 0xFF), (char)((type >> 16) & 0xFF)]);
}

/// <summary>The chunk type byte of Part 6 §6.7.2.2: final, intermediate, abort.</summary>
public enum ChunkType : byte
{
    Final = (byte)'F',
    Intermediate = (byte)'C',
    Abort = (byte)'A',
}
