using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.SecureChannel.Security;

/// <summary>
/// The security of one channel: policy, message security mode, this client's certificate (with
/// its private key) and the server's certificate (already validated against the trust list). The
/// OpenSecureChannel exchange is signed and encrypted whenever the mode is not None (Part 6
/// §6.7.4); later chunks are signed (Sign) or signed and encrypted (SignAndEncrypt).
/// </summary>
public sealed record ChannelSecurity
{
    public static ChannelSecurity None { get; } = new() { Policy = SecurityPolicy.None, Mode = MessageSecurityMode.None };

    public required SecurityPolicy Policy { get; init; }

    public required MessageSecurityMode Mode { get; init; }

    /// <summary>This client's application instance certificate, with its private key.</summary>
    public X509Certificate2? ClientCertificate { get; init; }

    /// <summary>The server's certificate (the first of the chain it advertised).</summary>
    public X509Certificate2? ServerCertificate { get; init; }

    public bool IsNone => Mode == MessageSecurityMode.None || Policy.IsNone;

    public bool Encrypts => Mode == MessageSecurityMode.SignAndEncrypt;

    /// <summary>"Basic256Sha256 SignAndEncrypt" or "None".</summary>
    public string Describe() => IsNone ? "None" : $"{Policy.Name} {Mode}";

    internal X509Certificate2 Client => ClientCertificate ?? throw new InvalidOperationException("A secured channel needs the client's certificate.");

    internal X509Certificate2 Server => ServerCertificate ?? throw new InvalidOperationException("A secured channel needs the server's certificate.");

    internal RSA ClientKey() => Client.GetRSAPrivateKey() ?? throw new InvalidOperationException($"The client certificate {Client.Subject} has no RSA private key.");

    internal RSA ServerKey() => Server.GetRSAPublicKey() ?? throw new ServiceResultException(new Encoding.StatusCode(Encoding.StatusCodes.BadCertificateInvalid), $"The server certificate {Server.Subject} has no RSA public key.");

    /// <summary>Checks that both keys are of a size the policy allows (Part 7: 2048 to 4096 bits).</summary>
    internal void CheckKeySizes()
    {
        if (IsNone)
        {
            return;
        }

        foreach (var (who, bits) in new[] { ("client", Client.PublicKey.GetRSAPublicKey()?.KeySize ?? 0), ("server", Server.PublicKey.GetRSAPublicKey()?.KeySize ?? 0) })
        {
            if (bits < Policy.MinAsymmetricKeyBits || bits > Policy.MaxAsymmetricKeyBits)
            {
                throw new ServiceResultException(new Encoding.StatusCode(Encoding.StatusCodes.BadCertificateInvalid),
                    $"The {who} certificate has an RSA key of {bits} bits; {Policy.Name} needs {Policy.MinAsymmetricKeyBits} to {Policy.MaxAsymmetricKeyBits} bits");
            }
        }
    }
}
