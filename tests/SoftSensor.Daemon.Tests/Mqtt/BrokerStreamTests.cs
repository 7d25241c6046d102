using SoftSensor.Daemon.Mqtt;

namespace SoftSensor.Daemon.Tests.Mqtt;

/// <summary>
/// The broker stream's buffering against an in-memory duplex (an encode/decode check: the end-to-end
/// behaviour over a real mosquitto is in the daemon's MQTT tests). The property checked is the one
/// a byte stream owes its reader (common practice, the Stream contract): the same bytes in the same
/// order, whatever the sizes of the reads and writes, and held writes leaving before later ones.
/// </summary>
public class BrokerStreamTests
{
    [Fact]
    public async Task Reads_in_small_pieces_return_every_byte_in_order_with_few_reads_of_the_socket()
    {
        var data = Enumerable.Range(0, 10_000).Select(i => (byte)(i * 7)).ToArray();
        var inner = new Duplex(data);
        using var stream = new BrokerStream(inner, 4096);
        var got = new List<byte>();
        var piece = new byte[3];
        int n;
        while ((n = await stream.ReadAsync(piece.AsMemory(0, 1 + (got.Count % 3)))) > 0)
        {
            got.AddRange(piece.AsSpan(0, n).ToArray());
        }

        Assert.Equal(data, got);
        Assert.Equal(4, inner.Reads); // 4096 + 4096 + 1808, then the end
    }

    [Fact]
    public async Task Held_writes_leave_together_at_release_and_are_never_overtaken()
    {
        var inner = new Duplex([]);
        using var stream = new BrokerStream(inner, 64);
        await stream.WriteAsync(new byte[] { 1 });
        stream.Hold();
        await stream.WriteAsync(new byte[] { 2, 3 });
        await stream.WriteAsync(new byte[] { 4 });
        Assert.Equal([1], inner.Written);
        await stream.ReleaseAsync(CancellationToken.None);
        await stream.WriteAsync(new byte[] { 5 });

        Assert.Equal([1, 2, 3, 4, 5], inner.Written);
        Assert.Equal(3, inner.Writes); // [1], [2 3 4] in one write, [5]
    }

    [Fact]
    public async Task Held_writes_beyond_the_buffer_are_sent_in_order_without_waiting_for_the_release()
    {
        var inner = new Duplex([]);
        using var stream = new BrokerStream(inner, 8);
        stream.Hold();
        var expected = new List<byte>();
        for (byte i = 0; i < 20; i++)
        {
            var packet = new[] { i, i, i };
            expected.AddRange(packet);
            await stream.WriteAsync(packet);
        }

        await stream.WriteAsync(Enumerable.Repeat((byte)99, 20).ToArray()); // larger than the buffer: after what is held
        expected.AddRange(Enumerable.Repeat((byte)99, 20));
        await stream.ReleaseAsync(CancellationToken.None);

        Assert.Equal(expected, inner.Written);
    }

    /// <summary>An in-memory duplex: reads come from a fixed array, writes are recorded; counts the calls.</summary>
    private sealed class Duplex(byte[] toRead) : Stream
    {
        private int _position;

        public List<byte> Written { get; } = [];

        public int Reads { get; private set; }

        public int Writes { get; private set; }

        public override bool CanRead => true;

        public override bool CanSeek => false;

        public override bool CanWrite => true;

        public override long Length => throw new NotSupportedException();

        public override long Position { get => throw new NotSupportedException(); set => throw new NotSupportedException(); }

        public override void Flush()
        {
        }

        public override int Read(byte[] buffer, int offset, int count)
        {
            Reads++;
            int n = Math.Min(count, toRead.Length - _position);
            Array.Copy(toRead, _position, buffer, offset, n);
            _position += n;
            return n;
        }

        public override ValueTask<int> ReadAsync(Memory<byte> buffer, CancellationToken cancellationToken = default)
        {
            Reads++;
            int n = Math.Min(buffer.Length, toRead.Length - _position);
            toRead.AsMemory(_position, n).CopyTo(buffer);
            _position += n;
            return ValueTask.FromResult(n);
        }

        public override void Write(byte[] buffer, int offset, int count)
        {
            Writes++;
            Written.AddRange(buffer.AsSpan(offset, count).ToArray());
        }

        public override ValueTask WriteAsync(ReadOnlyMemory<byte> buffer, CancellationToken cancellationToken = default)
        {
            Writes++;
            Written.AddRange(buffer.ToArray());
            return ValueTask.CompletedTask;
        }

        public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();

        public override void SetLength(long value) => throw new NotSupportedException();
    }
}
