using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.SecureChannel;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Tests.Encoding;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.Tests.SecureChannel;

/// <summary>Message chunks (Part 6 §6.7.2): splitting to the peer's buffer, joining, abort, limits, sequence numbers.</summary>
public sealed class ChunkingTests
{
    private static readonly TransportLimits Peer = new() { ReceiveBufferSize = 8192, SendBufferSize = 8192, MaxMessageSize = 100_000, MaxChunkCount = 10 };

    [Fact]
    public void Build_SmallMessage_IsOneFinalChunkWithSymmetricAndSequenceHeaders()
    {
        // "MSG" 'F', size 8+8+8+2 = 26 (1A), channel 7, token 1, sequence 1, request 9, body AA BB.
        var chunks = MessageChunker.Build(MessageTypes.Message, w => ChunkHeaders.WriteSymmetric(w, 7, 1), 9, [0xAA, 0xBB], 8192, Peer, new SequenceNumbers());
        Assert.Equal("4D 53 47 46 1A 00 00 00 07 00 00 00 01 00 00 00 01 00 00 00 09 00 00 00 AA BB", Hex.Of(Assert.Single(chunks)));
    }

    [Fact]
    public void Build_LargeMessage_SplitsIntoIntermediateChunksAndFinalOfBufferSize()
    {
        // 8192-byte chunks carry 8192 − 24 header bytes = 8168 body bytes: 20 000 bytes need 3 chunks.
        var body = Enumerable.Range(0, 20_000).Select(i => (byte)i).ToArray();
        var sequence = new SequenceNumbers();
        var chunks = MessageChunker.Build(MessageTypes.Message, w => ChunkHeaders.WriteSymmetric(w, 7, 1), 9, body, 8192, Peer, sequence);

        Assert.Equal(3, chunks.Count);
        Assert.Equal([(byte)'C', (byte)'C', (byte)'F'], chunks.Select(c => c[3]).ToArray());
        Assert.All(chunks, c => Assert.True(c.Length <= 8192));

        var assembler = new ChunkAssembler(100_000, 10);
        AssembledMessage? whole = null;
        uint? last = null;
        foreach (var chunk in chunks)
        {
            var r = new UaBinaryReader(chunk.AsMemory(8));
            var headers = ChunkHeaders.Read(r, asymmetric: false);
            Assert.True(SequenceNumbers.IsValidSuccessor(last, headers.SequenceNumber));
            last = headers.SequenceNumber;
            whole = assembler.Add(headers.RequestId, (ChunkType)chunk[3], chunk.AsMemory(8 + r.Position));
        }

        Assert.NotNull(whole);
        Assert.Equal(body, whole.Body.ToArray());
    }

    [Fact]
    public void Build_BeyondPeerMaxChunkCount_RefusedBeforeSending()
    {
        var body = new byte[11 * 8168];
        var e = Assert.Throws<ServiceResultException>(() => MessageChunker.Build(MessageTypes.Message, w => ChunkHeaders.WriteSymmetric(w, 7, 1), 9, body, 8192, Peer with { MaxMessageSize = 0 }, new SequenceNumbers()));
        Assert.True(e.Status.Is(StatusCodes.BadRequestTooLarge));
    }

    [Fact]
    public void Add_AbortChunk_FailsTheMessageWithItsError()
    {
        // Part 6 §6.7.2.2: an 'A' chunk body is an Error UInt32 and a Reason String.
        var assembler = new ChunkAssembler(0, 0);
        Assert.Null(assembler.Add(4, ChunkType.Intermediate, new byte[10]));
        var result = assembler.Add(4, ChunkType.Abort, Hex.Bytes("00 00 B9 80 02 00 00 00 6E 6F"));
        Assert.NotNull(result);
        Assert.True(result.IsFailure);
        Assert.Equal(StatusCodes.BadResponseTooLarge, result.Error.Code);
        Assert.Equal(0, assembler.Pending);
    }

    [Fact]
    public void Add_MoreThanMaxChunkCount_FailsWithBadResponseTooLarge()
    {
        var assembler = new ChunkAssembler(0, 2);
        assembler.Add(1, ChunkType.Intermediate, new byte[4]);
        assembler.Add(1, ChunkType.Intermediate, new byte[4]);
        var result = assembler.Add(1, ChunkType.Final, new byte[4]);
        Assert.True(result!.IsFailure);
        Assert.Equal(StatusCodes.BadResponseTooLarge, result.Error.Code);
    }

    [Fact]
    public void SequenceNumbers_AtWrapThreshold_WrapBelow1024()
    {
        // Part 6 §6.7.2.4: after UInt32.MaxValue − 1024 the number wraps to a value below 1024.
        var sequence = new SequenceNumbers(SequenceNumbers.WrapThreshold);
        Assert.Equal(SequenceNumbers.WrapThreshold, sequence.Next());
        Assert.Equal(1u, sequence.Next());
        Assert.True(SequenceNumbers.IsValidSuccessor(SequenceNumbers.WrapThreshold, 5));
        Assert.False(SequenceNumbers.IsValidSuccessor(10, 12));
    }
}
