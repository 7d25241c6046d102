using Microsoft.Extensions.Logging;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>
/// The reading half of the channel: frames → checked chunks (<see cref="Security.InboundChunks"/>:
/// channel, token, signature, decryption, padding, sequence number) → messages → waiting requests.
/// A chunk that fails a check closes the channel with that check's status code.
/// </summary>
public sealed partial class UaSecureChannel
{
    private async Task ReceiveLoopAsync(CancellationToken cancellationToken)
    {
        var assembler = new ChunkAssembler(options.Limits.MaxMessageSize, options.Limits.MaxChunkCount);
        try
        {
            while (!cancellationToken.IsCancellationRequested)
            {
                var frame = await connection.ReadFrameAsync(cancellationToken);
                switch (frame.Header.MessageType)
                {
                    case MessageTypes.Error:
                        var (error, reason) = ConnectionMessages.DecodeError(frame.Body);
                        Fault(error, $"server sent ERR: {reason}");
                        return;
                    case MessageTypes.OpenChannel:
                    case MessageTypes.Message:
                        ChunkHeaders headers;
                        ReadOnlyMemory<byte> body;
                        try
                        {
                            (headers, body) = inbound.Read(frame);
                        }
                        catch (ServiceResultException e)
                        {
                            Fault(e.Status, e.Message);
                            return;
                        }

                        if (assembler.Add(headers.RequestId, frame.Header.ChunkType, body) is { } message)
                        {
                            Dispatch(message, frame.Header.MessageType);
                        }

                        break;
                    default:
                        Fault(new StatusCode(StatusCodes.BadTcpMessageTypeInvalid), $"unexpected {MessageTypes.Name(frame.Header.MessageType)} from the server");
                        return;
                }
            }
        }
        catch (OperationCanceledException) when (cancellationToken.IsCancellationRequested)
        {
            // Closing.
        }
        catch (UaDecodeException e)
        {
            Fault(new StatusCode(StatusCodes.BadTcpMessageTypeInvalid), e.Message);
        }
        catch (Exception e) when (e is IOException or EndOfStreamException or ObjectDisposedException or System.Net.Sockets.SocketException)
        {
            Fault(new StatusCode(StatusCodes.BadConnectionClosed), e.Message);
        }
    }

    private void Dispatch(AssembledMessage message, uint messageType)
    {
        if (message.IsFailure)
        {
            pending.Fail(message.RequestId, new ServiceResultException(message.Error, message.Reason ?? "The response failed"));
            return;
        }

        IServiceResponse response;
        try
        {
            response = ResponseDecoder.Decode(message.Body);
        }
        catch (UaDecodeException e)
        {
            ChannelLog.UndecodableResponse(logger, message.RequestId, e.Message);
            pending.Fail(message.RequestId, new ServiceResultException(new StatusCode(StatusCodes.BadDecodingError), $"Response could not be decoded: {e.Message}", e));
            return;
        }

        if (messageType == MessageTypes.OpenChannel && response is OpenSecureChannelResponse open && open.Header.ServiceResult.IsGood)
        {
            try
            {
                InstallToken(open);
            }
            catch (ServiceResultException e)
            {
                pending.Fail(message.RequestId, e);
                Fault(e.Status, e.Message);
                return;
            }
        }

        if (!pending.Complete(message.RequestId, response) && logger.IsEnabled(LogLevel.Debug))
        {
            ChannelLog.LateResponse(logger, message.RequestId);
        }
    }
}
