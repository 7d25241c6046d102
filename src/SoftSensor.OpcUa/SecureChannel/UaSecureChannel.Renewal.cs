using System.Security.Cryptography;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.SecureChannel.Security;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>
/// Issuing and renewing the channel's security token (Part 4 §5.5.2, Part 6 §6.7.4): the renewal
/// goes out as OPN Renew on the same channel once <see cref="ChannelOptions.RenewAtFraction"/> of
/// the revised lifetime has passed, with a fresh client nonce; the keys of the new token are
/// derived from the new nonces (Part 6 §6.7.5) as soon as the reader sees the response, and
/// messages under the previous token are still accepted.
/// </summary>
public sealed partial class UaSecureChannel
{
    private ITimer? renewalTimer;
    private volatile byte[] clientNonce = [];

    private async Task OpenTokenAsync(SecurityTokenRequestType type, CancellationToken cancellationToken)
    {
        var nonce = security.IsNone ? [] : RandomNumberGenerator.GetBytes(security.Policy.NonceLength);
        clientNonce = nonce;
        var request = new OpenSecureChannelRequest
        {
            Header = NewHeader(0, options.ConnectTimeout),
            ClientProtocolVersion = 0,
            RequestType = type,
            SecurityMode = security.IsNone ? MessageSecurityMode.None : security.Mode,
            ClientNonce = nonce,
            RequestedLifetimeMs = (uint)Math.Clamp(options.RequestedLifetime.TotalMilliseconds, 1, uint.MaxValue),
        };
        var response = await ExchangeAsync(MessageTypes.OpenChannel, request, options.ConnectTimeout, cancellationToken);
        if (response is not OpenSecureChannelResponse open || response.Header.ServiceResult.IsBad)
        {
            throw new ServiceResultException(response.Header.ServiceResult.IsBad ? response.Header.ServiceResult : new StatusCode(StatusCodes.BadUnknownResponse), $"OpenSecureChannel ({type}, {security.Describe()}) was refused");
        }

        if (type == SecurityTokenRequestType.Renew)
        {
            RenewalCount++;
            ChannelLog.Renewed(logger, open.SecurityToken.ChannelId, open.SecurityToken.TokenId, open.SecurityToken.RevisedLifetimeMs);
        }

        ScheduleRenewal(open.SecurityToken.RevisedLifetimeMs);
    }

    /// <summary>Called by the reader on a good OPN response, before its waiter runs: derives and installs the new token's keys.</summary>
    private void InstallToken(OpenSecureChannelResponse open)
    {
        ChunkProtection incoming = ChunkProtection.None;
        ChunkProtection outgoing = ChunkProtection.None;
        if (!security.IsNone)
        {
            if (open.ServerNonce is not { } serverNonce || serverNonce.Length < security.Policy.NonceLength)
            {
                throw new ServiceResultException(new StatusCode(StatusCodes.BadNonceInvalid),
                    $"The server's nonce has {open.ServerNonce?.Length ?? 0} bytes; {security.Policy.Name} needs {security.Policy.NonceLength}");
            }

            var (client, server) = ChannelKeys.Derive(security.Policy, clientNonce, serverNonce);
            incoming = ChunkProtection.SymmetricIncoming(security.Policy, server, security.Encrypts);
            outgoing = ChunkProtection.SymmetricOutgoing(security.Policy, client, security.Encrypts);
        }

        inbound.ChannelId = open.SecurityToken.ChannelId;
        inbound.AddToken(open.SecurityToken.TokenId, incoming);
        token = open.SecurityToken;
        sending = new SendState(open.SecurityToken, outgoing);
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
