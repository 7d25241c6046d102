using System.Net;
using System.Net.Sockets;
using MQTTnet.Channel;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>
/// Opens the broker's TCP connection for MQTTnet (its stream-provider extension point; TLS, when
/// configured, is layered on top by MQTTnet) as a <see cref="BrokerStream"/>, and remembers the
/// newest one so that the link can hold back a burst of publishes (<see cref="BrokerStream.Hold"/>).
/// </summary>
internal sealed class BrokerStreamProvider : IMqttClientStreamProvider
{
    /// <summary>The kernel's send and receive buffers of the socket (MQTTnet's own default).</summary>
    public const int SocketBufferBytes = 8 * 1024;

    /// <summary>The stream's read buffer and its buffer for held writes.</summary>
    public const int BufferBytes = 64 * 1024;

    private volatile BrokerStream? _current;

    /// <summary>The stream of the newest connection (null before the first).</summary>
    public BrokerStream? Current => _current;

    public async Task<Stream> ConnectAsync(EndPoint brokerEndPoint, CancellationToken cancellationToken)
    {
        // The socket options of MQTTnet's own TCP channel: no Nagle delay on our side, no lingering
        // close, and 8 KiB kernel buffers. The small receive buffer matters: a broker that keeps
        // Nagle's algorithm on (mosquitto's default, set_tcp_nodelay false) holds each small message
        // until the previous one is acknowledged, and a large buffer lets the kernel delay that
        // acknowledgement (measured with the load benchmark: +25 ms median at 300 reactors).
        var socket = new Socket(SocketType.Stream, ProtocolType.Tcp)
        {
            NoDelay = true,
            ReceiveBufferSize = SocketBufferBytes,
            SendBufferSize = SocketBufferBytes,
            LingerState = new LingerOption(true, 0),
        };
        try
        {
            await socket.ConnectAsync(brokerEndPoint, cancellationToken);
        }
        catch
        {
            socket.Dispose();
            throw;
        }

        var stream = new BrokerStream(new NetworkStream(socket, ownsSocket: true), BufferBytes);
        _current = stream;
        return stream;
    }
}

/// <summary>
/// The daemon's side of the broker connection. Reads come from a buffer refilled by one read of the
/// socket: MQTTnet reads a packet in small pieces (fixed header, then the rest), one system call
/// each, which under load was most of the daemon's system calls. Writes go straight through (one
/// per packet) unless the link holds them: between <see cref="Hold"/> and <see cref="ReleaseAsync"/>
/// they are gathered and then sent together, so the thirteen publishes of a frame (or of all the
/// frames dispatched together) leave in a few TCP segments instead of one each, for the broker and
/// for us. Threading: one reader (MQTTnet's receive loop) and any number of writers (MQTTnet
/// serialises its packets; the link's release may come from another task) at once.
/// </summary>
internal sealed class BrokerStream(Stream inner, int bufferBytes) : Stream
{
    private readonly byte[] _read = new byte[bufferBytes];
    private readonly byte[] _held = new byte[bufferBytes];
    private readonly SemaphoreSlim _writeGate = new(1, 1);
    private int _start;
    private int _end;
    private int _heldBytes;
    private volatile bool _holding;

    public override bool CanRead => true;

    public override bool CanWrite => true;

    public override bool CanSeek => false;

    public override long Length => throw new NotSupportedException();

    public override long Position { get => throw new NotSupportedException(); set => throw new NotSupportedException(); }

    /// <summary>From now on writes are gathered until <see cref="ReleaseAsync"/> (or until the buffer is full).</summary>
    public void Hold() => _holding = true;

    /// <summary>
    /// Sends what was gathered and lets writes through again. On a connection that has just failed the
    /// gathered bytes are dropped: their publishes then fail in MQTTnet (counted and logged by the link).
    /// </summary>
    public async ValueTask ReleaseAsync(CancellationToken cancellationToken)
    {
        try
        {
            await _writeGate.WaitAsync(cancellationToken);
        }
        catch (ObjectDisposedException)
        {
            return;
        }

        try
        {
            _holding = false;
            await SendHeldAsync(cancellationToken);
        }
        catch (Exception e) when (e is IOException or ObjectDisposedException or SocketException)
        {
            _heldBytes = 0;
        }
        finally
        {
            _writeGate.Release();
        }
    }

    public override int Read(byte[] buffer, int offset, int count) => Read(buffer.AsSpan(offset, count));

    public override int Read(Span<byte> buffer)
    {
        if (_start == _end)
        {
            if (buffer.Length >= _read.Length)
            {
                return inner.Read(buffer);
            }

            _start = 0;
            _end = inner.Read(_read, 0, _read.Length);
        }

        return Take(buffer);
    }

    public override Task<int> ReadAsync(byte[] buffer, int offset, int count, CancellationToken cancellationToken) =>
        ReadAsync(buffer.AsMemory(offset, count), cancellationToken).AsTask();

    public override ValueTask<int> ReadAsync(Memory<byte> buffer, CancellationToken cancellationToken = default)
    {
        if (_start != _end)
        {
            return ValueTask.FromResult(Take(buffer.Span));
        }

        return buffer.Length >= _read.Length ? inner.ReadAsync(buffer, cancellationToken) : FillAndTakeAsync(buffer, cancellationToken);
    }

    public override void Write(byte[] buffer, int offset, int count) => WriteAsync(buffer.AsMemory(offset, count)).AsTask().GetAwaiter().GetResult();

    public override Task WriteAsync(byte[] buffer, int offset, int count, CancellationToken cancellationToken) =>
        WriteAsync(buffer.AsMemory(offset, count), cancellationToken).AsTask();

    public override async ValueTask WriteAsync(ReadOnlyMemory<byte> buffer, CancellationToken cancellationToken = default)
    {
        await _writeGate.WaitAsync(cancellationToken);
        try
        {
            if (_holding && buffer.Length <= _held.Length)
            {
                if (_heldBytes + buffer.Length > _held.Length)
                {
                    await SendHeldAsync(cancellationToken);
                }

                buffer.CopyTo(_held.AsMemory(_heldBytes));
                _heldBytes += buffer.Length;
                return;
            }

            // Never overtake what is held: the broker must see the packets in the order they were written.
            await SendHeldAsync(cancellationToken);
            await inner.WriteAsync(buffer, cancellationToken);
        }
        finally
        {
            _writeGate.Release();
        }
    }

    public override void Flush()
    {
        // Held writes leave at ReleaseAsync; the socket itself has nothing to flush.
    }

    public override Task FlushAsync(CancellationToken cancellationToken) => Task.CompletedTask;

    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();

    public override void SetLength(long value) => throw new NotSupportedException();

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            inner.Dispose();
            _writeGate.Dispose();
        }

        base.Dispose(disposing);
    }

    public override async ValueTask DisposeAsync()
    {
        await inner.DisposeAsync();
        _writeGate.Dispose();
        await base.DisposeAsync();
    }

    /// <summary>Under the write gate.</summary>
    private async ValueTask SendHeldAsync(CancellationToken cancellationToken)
    {
        if (_heldBytes == 0)
        {
            return;
        }

        int n = _heldBytes;
        _heldBytes = 0;
        await inner.WriteAsync(_held.AsMemory(0, n), cancellationToken);
    }

    private async ValueTask<int> FillAndTakeAsync(Memory<byte> buffer, CancellationToken cancellationToken)
    {
        _start = 0;
        _end = await inner.ReadAsync(_read, cancellationToken);
        return _end == 0 ? 0 : Take(buffer.Span);
    }

    private int Take(Span<byte> destination)
    {
        int n = Math.Min(destination.Length, _end - _start);
        _read.AsSpan(_start, n).CopyTo(destination);
        _start += n;
        return n;
    }
}
