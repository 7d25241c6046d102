using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>
/// Issuing and renewing the channel's security token (Part 4 §5.5.2, Part 6 §6.7.4): the renewal
/// goes out as OPN Renew on the same channel once <see cref="ChannelOptions.RenewAtFraction"/> of
/// the revised lifetime has passed; messages under the previous token are still accepted.
/// </summary>
public sealed partial class UaSecureChannel
{
    private ITimer? renewalTimer;

    private async Task OpenTokenAsync(SecurityTokenRequestType type, CancellationToken cancellationToken)
    {
        var request = new OpenSecureChannelRequest
        {
            Header = NewHeader(0, options.ConnectTimeout),
            ClientProtocolVersion = 0,
            RequestType = type,
            SecurityMode = MessageSecurityMode.None,
            ClientNonce = [],
            RequestedLifetimeMs = (uint)Math.Clamp(options.RequestedLifetime.TotalMilliseconds, 1, uint.MaxValue),
        };
        var response = await ExchangeAsync(MessageTypes.OpenChannel, request, options.ConnectTimeout, cancellationToken);
        if (response is not OpenSecureChannelResponse open || response.Header.ServiceResult.IsBad)
        {
            throw new ServiceResultException(response.Header.ServiceResult.IsBad ? response.Header.ServiceResult : new StatusCode(StatusCodes.BadUnknownResponse), $"OpenSecureChannel ({type}) was refused");
        }

        previousToken = token;
        token = open.SecurityToken;
        if (type == SecurityTokenRequestType.Renew)
        {
            RenewalCount++;
            ChannelLog.Renewed(logger, token.ChannelId, token.TokenId, token.RevisedLifetimeMs);
        }

        ScheduleRenewal(token.RevisedLifetimeMs);
    }

    private void ScheduleRenewal(uint lifetimeMs)
    {
        var due = TimeSpan.FromMilliseconds(Math.Max(100, lifetimeMs * options.RenewAtFraction));
        renewalTimer?.Dispose();
        renewalTimer = time.CreateTimer(_ => _ = RenewAsync(), null, due, Timeout.InfiniteTimeSpan);
    }

    private async Task RenewAsync()
    {
        if (!IsOpen)
        {
            return;
        }

        try
        {
            await OpenTokenAsync(SecurityTokenRequestType.Renew, lifetime.Token);
        }
        catch (Exception e) when (e is ServiceResultException or OperationCanceledException or ObjectDisposedException)
        {
            if (IsOpen)
            {
                ChannelLog.RenewFailed(logger, token?.ChannelId ?? 0, e.Message);
                Fault(new StatusCode(StatusCodes.BadSecureChannelTokenUnknown), $"token renewal failed: {e.Message}");
            }
        }
    }
}
