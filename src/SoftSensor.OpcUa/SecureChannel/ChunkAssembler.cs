using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>
/// Joins the chunks of incoming messages by RequestId (Part 6 §6.7.2.2): 'C' chunks are held,
/// 'F' completes the message, 'A' discards it and carries an Error code and reason. A message
/// larger than MaxMessageSize or of more than MaxChunkCount chunks (the limits this client
/// declared in Hello; 0 means none) is discarded and reported as BadResponseTooLarge.
/// </summary>
public sealed class ChunkAssembler(uint maxMessageSize, uint maxChunkCount)
{
    private readonly Dictionary<uint, Partial> partials = [];

    /// <summary>Adds one chunk body; returns the outcome once the message is complete, aborted or too large.</summary>
    public AssembledMessage? Add(uint requestId, ChunkType chunkType, ReadOnlyMemory<byte> body)
    {
        if (chunkType == ChunkType.Abort)
        {
            partials.Remove(requestId);
            var r = new UaBinaryReader(body);
            var error = r.ReadStatusCode();
            string? reason = r.ReadString();
            return AssembledMessage.Failed(requestId, error, $"Server aborted the response: {reason}");
        }

        if (!partials.TryGetValue(requestId, out var partial))
        {
            partial = new Partial();
            partials[requestId] = partial;
        }

        partial.Chunks.Add(body);
        partial.Size += body.Length;
        if ((maxMessageSize != 0 && partial.Size > maxMessageSize) || (maxChunkCount != 0 && partial.Chunks.Count > maxChunkCount))
        {
            partials.Remove(requestId);
            return AssembledMessage.Failed(requestId, new StatusCode(StatusCodes.BadResponseTooLarge),
                $"Response exceeds {maxMessageSize} bytes or {maxChunkCount} chunks ({partial.Size} bytes in {partial.Chunks.Count} chunks so far).");
        }

        if (chunkType == ChunkType.Intermediate)
        {
            return null;
        }

        partials.Remove(requestId);
        if (partial.Chunks.Count == 1)
        {
            return AssembledMessage.Complete(requestId, partial.Chunks[0]);
        }

        var whole = new byte[partial.Size];
        int at = 0;
        foreach (var chunk in partial.Chunks)
        {
            chunk.CopyTo(whole.AsMemory(at));
            at += chunk.Length;
        }

        return AssembledMessage.Complete(requestId, whole);
    }

    /// <summary>Number of messages waiting for more chunks.</summary>
    public int Pending => partials.Count;

    private sealed class Partial
    {
        public List<ReadOnlyMemory<byte>> Chunks { get; } = [];

        public long Size { get; set; }
    }
}

/// <summary>A whole message body, or the failure of one (abort or limits).</summary>
public sealed record AssembledMessage(uint RequestId, ReadOnlyMemory<byte> Body, StatusCode Error, string? Reason)
{
    public bool IsFailure => Error.IsBad;

    public static AssembledMessage Complete(uint requestId, ReadOnlyMemory<byte> body) => new(requestId, body, StatusCode.Good, null);

    public static AssembledMessage Failed(uint requestId, StatusCode error, string reason) => new(requestId, ReadOnlyMemory<byte>.Empty, error, reason);
}
