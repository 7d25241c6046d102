using System.Net.Sockets;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Transport;

/// <summary>
/// One opc.tcp connection: TCP connect, Hello/Acknowledge (Part 6 §7.1.3), then whole frames in
/// both directions. Threading contract: one reader at a time calls <see cref="ReadFrameAsync"/>;
/// <see cref="WriteAsync"/> may be called concurrently (writes are serialised, a frame is never
/// interleaved with another).
/// </summary>
public sealed class UaTcpConnection : IAsyncDisposable
{
    private readonly TcpClient client;
    private readonly NetworkStream stream;
    private readonly SemaphoreSlim writeLock = new(1, 1);
    private readonly byte[] header = new byte[FrameHeader.Size];

    private UaTcpConnection(TcpClient client, TransportLimits local)
    {
        this.client = client;
        stream = client.GetStream();
        Local = local;
        Remote = local;
    }

    /// <summary>The limits this client declared in Hello (ReceiveBufferSize bounds incoming frames).</summary>
    public TransportLimits Local { get; }

    /// <summary>The limits the server returned in Acknowledge (its ReceiveBufferSize bounds outgoing frames).</summary>
    public TransportLimits Remote { get; private set; }

    /// <summary>Connects, sends Hello and waits for Acknowledge; an Error reply becomes a <see cref="ServiceResultException"/>.</summary>
    public static async Task<UaTcpConnection> ConnectAsync(EndpointAddress endpoint, TransportLimits limits, TimeSpan timeout, CancellationToken cancellationToken)
    {
        using var cts = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        cts.CancelAfter(timeout);
        var client = new TcpClient { NoDelay = true };
        try
        {
            await client.ConnectAsync(endpoint.Host, endpoint.Port, cts.Token);
            var connection = new UaTcpConnection(client, limits);
            await connection.WriteAsync(ConnectionMessages.EncodeHello(limits, endpoint.Url), cts.Token);
            var reply = await connection.ReadFrameAsync(cts.Token);
            if (reply.Header.MessageType == MessageTypes.Error)
            {
                var (error, reason) = ConnectionMessages.DecodeError(reply.Body);
                throw new ServiceResultException(error, $"Server at {endpoint} refused Hello: {reason}");
            }

            if (reply.Header.MessageType != MessageTypes.Acknowledge)
            {
                throw new ServiceResultException(new StatusCode(StatusCodes.BadTcpMessageTypeInvalid), $"Expected ACK from {endpoint}, got {MessageTypes.Name(reply.Header.MessageType)}.");
            }

            connection.Remote = ConnectionMessages.DecodeAcknowledge(reply.Body).Limits;
            return connection;
        }
        catch (OperationCanceledException) when (!cancellationToken.IsCancellationRequested)
        {
            client.Dispose();
            throw new ServiceResultException(new StatusCode(StatusCodes.BadTimeout), $"No Acknowledge from {endpoint} within {timeout.TotalSeconds:0.#} s.");
        }
        catch (Exception e) when (e is SocketException or IOException or UaDecodeException)
        {
            client.Dispose();
            throw new ServiceResultException(new StatusCode(StatusCodes.BadNotConnected), $"Cannot connect to {endpoint}: {e.Message}", e);
        }
        catch
        {
            client.Dispose();
            throw;
        }
    }

    /// <summary>Reads one whole frame; a closed socket or a malformed header throws.</summary>
    public async Task<Frame> ReadFrameAsync(CancellationToken cancellationToken)
    {
        await stream.ReadExactlyAsync(header, cancellationToken);
        var parsed = FrameHeader.Parse(header, Local.ReceiveBufferSize);
        var body = new byte[parsed.MessageSize - FrameHeader.Size];
        await stream.ReadExactlyAsync(body, cancellationToken);
        return new Frame(parsed, body);
    }

    /// <summary>Writes one whole frame.</summary>
    public async Task WriteAsync(ReadOnlyMemory<byte> frame, CancellationToken cancellationToken)
    {
        await writeLock.WaitAsync(cancellationToken);
        try
        {
            await stream.WriteAsync(frame, cancellationToken);
        }
        finally
        {
            writeLock.Release();
        }
    }

    public ValueTask DisposeAsync()
    {
        client.Dispose();
        writeLock.Dispose();
        return ValueTask.CompletedTask;
    }
}
