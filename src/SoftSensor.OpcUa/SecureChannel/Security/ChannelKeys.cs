using System.Security.Cryptography;

namespace SoftSensor.OpcUa.SecureChannel.Security;

/// <summary>
/// The symmetric keys of one side of a channel for one security token (Part 6 §6.7.5): signing
/// key, encrypting key and initialization vector, in that order, from P_SHA256(secret, seed).
/// The client's keys (what it signs and encrypts with) come from P_SHA256(ServerNonce,
/// ClientNonce); the server's keys (what the client verifies and decrypts with) from
/// P_SHA256(ClientNonce, ServerNonce).
/// </summary>
public sealed record ChannelKeys(byte[] SigningKey, byte[] EncryptingKey, byte[] InitializationVector)
{
    public static (ChannelKeys Client, ChannelKeys Server) Derive(SecurityPolicy policy, byte[] clientNonce, byte[] serverNonce) =>
        (FromSecret(policy, serverNonce, clientNonce), FromSecret(policy, clientNonce, serverNonce));

    private static ChannelKeys FromSecret(SecurityPolicy policy, byte[] secret, byte[] seed)
    {
        int signing = policy.SigningKeyLength;
        int encrypting = policy.EncryptionKeyLength;
        int iv = policy.SymmetricBlockSize;
        var bytes = PSha256(secret, seed, signing + encrypting + iv);
        return new ChannelKeys(bytes[..signing], bytes[signing..(signing + encrypting)], bytes[(signing + encrypting)..]);
    }

    /// <summary>
    /// P_SHA256 of RFC 5246 §5: A(0) = seed, A(i) = HMAC(secret, A(i−1)); output
    /// HMAC(secret, A(1) ‖ seed) ‖ HMAC(secret, A(2) ‖ seed) ‖ … cut to <paramref name="length"/>.
    /// </summary>
    public static byte[] PSha256(byte[] secret, byte[] seed, int length)
    {
        var output = new byte[length];
        using var hmac = new HMACSHA256(secret);
        byte[] a = seed;
        int at = 0;
        while (at < length)
        {
            a = hmac.ComputeHash(a);
            var block = hmac.ComputeHash([.. a, .. seed]);
            int n = Math.Min(block.Length, length - at);
            block.AsSpan(0, n).CopyTo(output.AsSpan(at));
            at += n;
        }

        return output;
    }

    public override string ToString() => "ChannelKeys { (secret) }";
}
