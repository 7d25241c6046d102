using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Pki;
using SoftSensor.OpcUa.SecureChannel.Security;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Session;

/// <summary>
/// The application signatures of a session on a secured channel (Part 4 §5.6.2.2, §5.6.3.2,
/// §7.37): the server signs ClientCertificate ‖ ClientNonce with its private key in the
/// CreateSession response; the client signs ServerCertificate ‖ ServerNonce (the latest nonce the
/// server sent) in ActivateSession. Both use the asymmetric signature algorithm of the channel's
/// policy.
/// </summary>
internal static class SessionSignatures
{
    /// <summary>Checks the server's certificate and signature in a CreateSession response; BadApplicationSignatureInvalid when they do not hold.</summary>
    public static void CheckServer(ChannelSecurity security, CreateSessionResponse created, byte[]? clientCertificate, byte[] clientNonce)
    {
        if (security.IsNone)
        {
            return;
        }

        if (created.ServerNonce is not { Length: >= 32 })
        {
            throw new ServiceResultException(new StatusCode(StatusCodes.BadNonceInvalid), $"CreateSession returned a server nonce of {created.ServerNonce?.Length ?? 0} bytes (expected 32 or more)");
        }

        var leaf = created.ServerCertificate is { Length: > 0 } chain ? CertificateFacts.SplitChain(chain)[0] : null;
        if (leaf is null || !leaf.AsSpan().SequenceEqual(security.Server.RawData))
        {
            throw new ServiceResultException(new StatusCode(StatusCodes.BadCertificateInvalid), "CreateSession returned another server certificate than the one the channel was opened with");
        }

        var signature = created.ServerSignature;
        if (signature.Algorithm != security.Policy.AsymmetricSignatureUri || signature.Signature is null)
        {
            throw new ServiceResultException(new StatusCode(StatusCodes.BadApplicationSignatureInvalid),
                $"The server signed CreateSession with '{signature.Algorithm}' (expected {security.Policy.AsymmetricSignatureUri})");
        }

        using var key = security.ServerKey();
        if (!security.Policy.Verify(key, [.. clientCertificate ?? [], .. clientNonce], signature.Signature))
        {
            throw new ServiceResultException(new StatusCode(StatusCodes.BadApplicationSignatureInvalid), "The server's CreateSession signature over this client's certificate and nonce does not verify");
        }
    }

    /// <summary>The client's signature for ActivateSession (empty under None).</summary>
    public static SignatureData Client(ChannelSecurity security, byte[]? serverCertificate, byte[]? serverNonce)
    {
        if (security.IsNone)
        {
            return SignatureData.Empty;
        }

        using var key = security.ClientKey();
        byte[] data = [.. serverCertificate ?? [], .. serverNonce ?? []];
        return new SignatureData(security.Policy.AsymmetricSignatureUri, security.Policy.Sign(key, data));
    }
}
