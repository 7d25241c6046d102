using Microsoft.Extensions.Logging;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>The reading half of the channel: frames → chunks → messages → waiting requests.</summary>
public sealed partial class UaSecureChannel
{
    private async Task ReceiveLoopAsync(CancellationToken cancellationToken)
    {
        var assembler = new ChunkAssembler(options.Limits.MaxMessageSize, options.Limits.MaxChunkCount);
        uint? lastSequence = null;
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
                        var reader = new UaBinaryReader(frame.Body);
                        var headers = ChunkHeaders.Read(reader, frame.Header.MessageType == MessageTypes.OpenChannel);
                        if (!CheckChunk(headers, frame.Header.MessageType, lastSequence))
                        {
                            return;
                        }

                        lastSequence = headers.SequenceNumber;
                        var body = frame.Body[reader.Position..];
                        if (assembler.Add(headers.RequestId, frame.Header.ChunkType, body) is { } message)
                        {
                            Dispatch(message);
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

    private bool CheckChunk(ChunkHeaders headers, uint messageType, uint? lastSequence)
    {
        if (token is { } current && headers.ChannelId != current.ChannelId)
        {
            Fault(new StatusCode(StatusCodes.BadSecureChannelIdInvalid), $"chunk for channel {headers.ChannelId}, this is {current.ChannelId}");
            return false;
        }

        if (messageType == MessageTypes.Message && token is not null && headers.TokenId != token.TokenId && headers.TokenId != previousToken?.TokenId)
        {
            Fault(new StatusCode(StatusCodes.BadSecureChannelTokenUnknown), $"chunk with token {headers.TokenId}, current {token.TokenId}");
            return false;
        }

        if (!SequenceNumbers.IsValidSuccessor(lastSequence, headers.SequenceNumber))
        {
            Fault(new StatusCode(StatusCodes.BadSequenceNumberInvalid), $"sequence number {headers.SequenceNumber} after {lastSequence}");
            return false;
        }

        return true;
    }

    private void Dispatch(AssembledMessage message)
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

        if (!pending.Complete(message.RequestId, response) && logger.IsEnabled(LogLevel.Debug))
        {
            ChannelLog.LateResponse(logger, message.RequestId);
        }
    }
}
