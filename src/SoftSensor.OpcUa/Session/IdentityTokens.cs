using System.Buffers.Binary;
using System.Security.Cryptography.X509Certificates;
using Microsoft.Extensions.Logging;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Pki;
using SoftSensor.OpcUa.SecureChannel.Security;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Session;

/// <summary>
/// Builds the user identity token for ActivateSession from the token policies the server
/// advertised for the channel's endpoint (Part 4 §7.36, §7.42). A user-name token policy names the
/// security policy its password is encrypted with (empty: the channel's). Encrypted, the password
/// travels in the legacy token secret format of Part 4 §7.36.2.2: UInt32 length of (password ‖
/// server nonce), the UTF-8 password, the server's latest nonce, all encrypted with the server
/// certificate's public key by the policy's asymmetric encryption algorithm, whose URI goes in
/// EncryptionAlgorithm. Clear text only when the effective policy is None (a warning is logged).
/// </summary>
internal static class IdentityTokens
{
    public static IUaEncodeable Build(UserIdentity identity, IReadOnlyList<EndpointDescription> endpoints, ChannelSecurity channel, byte[]? serverCertificate, byte[]? serverNonce, ILogger logger)
    {
        var wanted = identity is UserNameIdentity ? UserTokenType.UserName : UserTokenType.Anonymous;
        var mine = endpoints.Where(e => e.SecurityMode == (channel.IsNone ? MessageSecurityMode.None : channel.Mode) && e.SecurityPolicyUri == channel.Policy.Uri).ToList();
        var candidates = (mine.Count > 0 ? mine : endpoints.Where(e => e.SecurityMode == MessageSecurityMode.None).ToList())
            .SelectMany(e => e.UserIdentityTokens.Select(p => (Endpoint: e, Policy: p)))
            .Where(x => x.Policy.TokenType == wanted)
            .Select(x => (x.Endpoint, x.Policy, Effective: string.IsNullOrEmpty(x.Policy.SecurityPolicyUri) ? channel.Policy : SecurityPolicy.FromUri(x.Policy.SecurityPolicyUri)))
            .ToList();
        if (candidates.Count == 0)
        {
            throw new ServiceResultException(new StatusCode(StatusCodes.BadIdentityTokenRejected), $"The server offers no {wanted} token policy on its {channel.Describe()} endpoint");
        }

        if (identity is not UserNameIdentity user)
        {
            return new AnonymousIdentityToken(candidates[0].Policy.PolicyId);
        }

        var usable = candidates.Where(c => c.Effective is not null).ToList();
        if (usable.Count == 0)
        {
            throw new ServiceResultException(new StatusCode(StatusCodes.BadIdentityTokenRejected),
                $"The server's user-name token policies ask for password encryption with {string.Join(", ", candidates.Select(c => c.Policy.SecurityPolicyUri))}, which this client refuses (deprecated or unknown)");
        }

        // Prefer an encrypted password; among those the strongest policy.
        var (endpoint, policy, effective) = usable.OrderByDescending(c => c.Effective!.Rank).First();
        if (effective!.IsNone)
        {
            SessionLog.ClearTextPassword(logger, user.User, policy.PolicyId);
            return new UserNameIdentityToken(policy.PolicyId, user.User, System.Text.Encoding.UTF8.GetBytes(user.Password), null);
        }

        var certificate = serverCertificate is { Length: > 0 } ? serverCertificate : endpoint.ServerCertificate;
        if (certificate is not { Length: > 0 } || serverNonce is not { Length: > 0 })
        {
            throw new ServiceResultException(new StatusCode(StatusCodes.BadIdentityTokenRejected), $"User-name policy '{policy.PolicyId}' needs the server's certificate and nonce to encrypt the password, and the server sent none");
        }

        using var server = CertificateFacts.Load(CertificateFacts.SplitChain(certificate)[0]);
        using var key = server.GetRSAPublicKey() ?? throw new ServiceResultException(new StatusCode(StatusCodes.BadCertificateInvalid), "The server certificate has no RSA key");
        return new UserNameIdentityToken(policy.PolicyId, user.User, effective.Encrypt(key, Secret(user.Password, serverNonce)), effective.AsymmetricEncryptionUri);
    }

    /// <summary>The plain-text token secret: UInt32 length, password bytes, server nonce (Part 4 §7.36.2.2).</summary>
    internal static byte[] Secret(string password, byte[] serverNonce)
    {
        var bytes = System.Text.Encoding.UTF8.GetBytes(password);
        var secret = new byte[4 + bytes.Length + serverNonce.Length];
        BinaryPrimitives.WriteUInt32LittleEndian(secret, (uint)(bytes.Length + serverNonce.Length));
        bytes.CopyTo(secret, 4);
        serverNonce.CopyTo(secret, 4 + bytes.Length);
        return secret;
    }

    /// <summary>Who, for logs: "anonymous" or the user name (never the password).</summary>
    public static string Describe(UserIdentity identity) => identity is UserNameIdentity u ? u.User : "anonymous";
}
