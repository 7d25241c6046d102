using Microsoft.Extensions.Logging;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.SecureChannel.Security;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>
/// A secure channel over one opc.tcp connection (Part 4 §5.5, Part 6 §6.7): OpenSecureChannel
/// Issue (signed and encrypted with the certificates' keys unless the policy is None), then
/// requests as MSG chunks correlated by RequestId and protected with the keys derived from both
/// nonces, token renewal at 75 % of the revised lifetime, CloseSecureChannel. Threading contract: any number
/// of callers may send concurrently; one background task reads. When the connection fails every
/// waiting request fails with the channel's status and <see cref="Completion"/> finishes.
/// </summary>
public sealed partial class UaSecureChannel : IAsyncDisposable
{
    private readonly UaTcpConnection connection;
    private readonly ChannelOptions options;
    private readonly TimeProvider time;
    private readonly ILogger logger;
    private readonly string endpointUrl;
    private readonly PendingRequests pending = new();
    private readonly SequenceNumbers sendSequence = new();
    private readonly SemaphoreSlim sendLock = new(1, 1);
    private readonly CancellationTokenSource lifetime = new();
    private readonly TaskCompletionSource<StatusCode> completion = new(TaskCreationOptions.RunContinuationsAsynchronously);
    private Task? receiveLoop;
    private int disposed;
    private readonly ChannelSecurity security;
    private readonly InboundChunks inbound;
    private volatile SendState? sending;
    private ChannelSecurityToken? token;
    private ChunkProtection? asymmetricOut;

    private UaSecureChannel(UaTcpConnection connection, string endpointUrl, ChannelOptions options, ChannelSecurity security, TimeProvider time, ILogger logger)
    {
        this.connection = connection;
        this.endpointUrl = endpointUrl;
        this.options = options;
        this.security = security;
        this.time = time;
        this.logger = logger;
        inbound = new InboundChunks(security);
    }

    /// <summary>The policy, mode and certificates of this channel.</summary>
    public ChannelSecurity Security => security;

    /// <summary>The current security token (channel id, token id, revised lifetime).</summary>
    public ChannelSecurityToken Token => token ?? throw new InvalidOperationException("The channel is not open.");

    /// <summary>How many times the token has been renewed.</summary>
    public int RenewalCount { get; private set; }

    /// <summary>Finishes with the reason when the channel closes or fails.</summary>
    public Task<StatusCode> Completion => completion.Task;

    /// <summary>True until the channel closes or fails.</summary>
    public bool IsOpen => !completion.Task.IsCompleted;

    /// <summary>The limits the server returned in Acknowledge.</summary>
    public TransportLimits ServerLimits => connection.Remote;

    /// <summary>Connects, exchanges Hello/Acknowledge and opens the channel (Issue).</summary>
    public static Task<UaSecureChannel> OpenAsync(string endpointUrl, ChannelOptions options, TimeProvider time, ILogger logger, CancellationToken cancellationToken) =>
        OpenAsync(endpointUrl, options, ChannelSecurity.None, time, logger, cancellationToken);

    /// <summary>Connects and opens the channel with the given security (the server certificate already validated).</summary>
    public static async Task<UaSecureChannel> OpenAsync(string endpointUrl, ChannelOptions options, ChannelSecurity security, TimeProvider time, ILogger logger, CancellationToken cancellationToken)
    {
        var address = EndpointAddress.Parse(endpointUrl);
        security.CheckKeySizes();
        var connection = await UaTcpConnection.ConnectAsync(address, options.Limits, options.ConnectTimeout, cancellationToken);
        var channel = new UaSecureChannel(connection, endpointUrl, options, security, time, logger);
        try
        {
            channel.receiveLoop = Task.Run(() => channel.ReceiveLoopAsync(channel.lifetime.Token), CancellationToken.None);
            if (security.IsNone)
            {
                ChannelLog.SecurityNone(logger, endpointUrl);
            }

            await channel.OpenTokenAsync(SecurityTokenRequestType.Issue, cancellationToken);
            ChannelLog.Opened(logger, channel.Token.ChannelId, endpointUrl, channel.Token.TokenId, channel.Token.RevisedLifetimeMs, security.Describe());
            return channel;
        }
        catch
        {
            await channel.DisposeAsync();
            throw;
        }
    }

    /// <summary>
    /// Sends a request and waits for its response, at most <paramref name="timeout"/> (BadTimeout
    /// then). A ServiceFault or a Bad ServiceResult raises <see cref="ServiceResultException"/>.
    /// </summary>
    public async Task<TResponse> SendAsync<TResponse>(IServiceRequest request, TimeSpan? timeout, CancellationToken cancellationToken)
        where TResponse : class, IServiceResponse
    {
        var response = await ExchangeAsync(MessageTypes.Message, request, timeout ?? options.RequestTimeout, cancellationToken);
        if (response is ServiceFault || response.Header.ServiceResult.IsBad)
        {
            throw new ServiceResultException(response.Header.ServiceResult, $"{request.GetType().Name} failed");
        }

        return response as TResponse ?? throw new ServiceResultException(new StatusCode(StatusCodes.BadUnknownResponse), $"{request.GetType().Name} got a {response.GetType().Name}");
    }

    /// <summary>Sends CloseSecureChannel and closes the connection; never throws for a dead link.</summary>
    public async Task CloseAsync(CancellationToken cancellationToken)
    {
        if (IsOpen && token is not null)
        {
            try
            {
                var request = new CloseSecureChannelRequest { Header = NewHeader(0, TimeSpan.FromSeconds(1)) };
                await WriteMessageAsync(MessageTypes.CloseChannel, request, pending.Register().RequestId, cancellationToken);
            }
            catch (Exception e) when (e is IOException or ServiceResultException or ObjectDisposedException or System.Net.Sockets.SocketException)
            {
                // The link is already gone: nothing to close politely.
            }
        }

        Fault(new StatusCode(StatusCodes.BadSecureChannelClosed), "closed by the client");
        await DisposeAsync();
    }

    public async ValueTask DisposeAsync()
    {
        if (Interlocked.Exchange(ref disposed, 1) == 1)
        {
            return;
        }

        Fault(new StatusCode(StatusCodes.BadSecureChannelClosed), "disposed");
        await lifetime.CancelAsync();
        await connection.DisposeAsync();
        if (receiveLoop is not null)
        {
            await receiveLoop.ConfigureAwait(ConfigureAwaitOptions.SuppressThrowing);
        }

        renewalTimer?.Dispose();
        lifetime.Dispose();
    }

    private async Task<IServiceResponse> ExchangeAsync(uint messageType, IServiceRequest request, TimeSpan timeout, CancellationToken cancellationToken)
    {
        if (!IsOpen)
        {
            throw new ServiceResultException(Completion.Result, "The secure channel is closed");
        }

        var (requestId, waiter) = pending.Register();
        request.Header = request.Header with { TimeoutHintMs = (uint)Math.Min(uint.MaxValue, timeout.TotalMilliseconds) };
        using var cts = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        cts.CancelAfter(timeout);
        try
        {
            await WriteMessageAsync(messageType, request, requestId, cts.Token);
            return await waiter.Task.WaitAsync(cts.Token);
        }
        catch (OperationCanceledException) when (!cancellationToken.IsCancellationRequested)
        {
            throw new ServiceResultException(new StatusCode(StatusCodes.BadTimeout), $"{request.GetType().Name} got no response within {timeout.TotalSeconds:0.###} s");
        }
        catch (Exception e) when (e is IOException or ObjectDisposedException or System.Net.Sockets.SocketException)
        {
            Fault(new StatusCode(StatusCodes.BadConnectionClosed), e.Message);
            throw new ServiceResultException(new StatusCode(StatusCodes.BadConnectionClosed), "The connection failed while sending", e);
        }
        finally
        {
            pending.Forget(requestId);
        }
    }

    private async Task WriteMessageAsync(uint messageType, IServiceRequest request, uint requestId, CancellationToken cancellationToken)
    {
        var body = new UaBinaryWriter();
        ResponseDecoder.EncodeRequest(body, request);
        uint chunkSize = Math.Min(connection.Remote.ReceiveBufferSize, connection.Local.SendBufferSize);
        await sendLock.WaitAsync(cancellationToken);
        try
        {
            var state = sending;
            uint channelId = state?.Token.ChannelId ?? 0;
            uint tokenId = state?.Token.TokenId ?? 0;
            Action<UaBinaryWriter> securityHeader;
            ChunkProtection protection;
            if (messageType == MessageTypes.OpenChannel)
            {
                securityHeader = security.IsNone
                    ? w => ChunkHeaders.WriteAsymmetric(w, channelId)
                    : w => ChunkHeaders.WriteAsymmetric(w, channelId, security.Policy.Uri, security.Client.RawData, security.Server.GetCertHash());
                protection = security.IsNone ? ChunkProtection.None : asymmetricOut ??= ChunkProtection.AsymmetricOutgoing(security.Policy, security.ClientKey(), security.ServerKey());
            }
            else
            {
                securityHeader = w => ChunkHeaders.WriteSymmetric(w, channelId, tokenId);
                protection = state?.Outgoing ?? ChunkProtection.None;
            }

            var chunks = MessageChunker.Build(messageType, securityHeader, requestId, body.WrittenSpan, chunkSize, connection.Remote, sendSequence, protection);
            foreach (var chunk in chunks)
            {
                await connection.WriteAsync(chunk, cancellationToken);
            }
        }
        finally
        {
            sendLock.Release();
        }
    }

    private RequestHeader NewHeader(uint handle, TimeSpan timeout) => new()
    {
        Timestamp = time.GetUtcNow().UtcDateTime,
        RequestHandle = handle,
        TimeoutHintMs = (uint)timeout.TotalMilliseconds,
    };

    private void Fault(StatusCode status, string reason)
    {
        if (!completion.TrySetResult(status))
        {
            return;
        }

        if (!status.Is(StatusCodes.BadSecureChannelClosed))
        {
            ChannelLog.Faulted(logger, token?.ChannelId ?? 0, endpointUrl, $"{status}: {reason}");
        }

        pending.FailAll(() => new ServiceResultException(status, $"The secure channel failed: {reason}"));
        lifetime.Cancel();
    }

    /// <summary>The token messages go out under, with the protection of its client keys.</summary>
    private sealed record SendState(ChannelSecurityToken Token, ChunkProtection Outgoing);
}
