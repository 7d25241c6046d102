using System.Security.Cryptography;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.SecureChannel.Security;

/// <summary>
/// One security policy of IEC 62541-7 (Part 7 §6.6, the SecurityPolicy profiles): its URI, the
/// asymmetric algorithms used for OpenSecureChannel, session signatures and user-token encryption,
/// and the lengths of the keys derived for the symmetric chunks. Every supported policy derives its
/// keys with P_SHA256 (RFC 5246 §5), signs chunks with HMAC-SHA256 (32-byte key and signature),
/// encrypts them with AES-CBC (16-byte blocks and IV) and uses 32-byte nonces.
/// </summary>
public sealed class SecurityPolicy
{
    public const string RsaSha256Uri = "http://www.w3.org/2001/04/xmldsig-more#rsa-sha256";
    public const string RsaPssSha256Uri = "http://opcfoundation.org/UA/security/rsa-pss-sha2-256";
    public const string RsaOaepUri = "http://www.w3.org/2001/04/xmlenc#rsa-oaep";
    public const string RsaOaepSha256Uri = "http://opcfoundation.org/UA/security/rsa-oaep-sha2-256";

    /// <summary>No security: for test servers only.</summary>
    public static SecurityPolicy None { get; } = new("None", SecurityPolicies.None, 0, false, false, 0);

    /// <summary>Part 7 Basic256Sha256: RSA-PKCS#1 v1.5 SHA-256 signatures, RSA-OAEP (SHA-1) encryption, AES-256-CBC.</summary>
    public static SecurityPolicy Basic256Sha256 { get; } = new("Basic256Sha256", SecurityPolicies.Basic256Sha256, 2, false, false, 32);

    /// <summary>Part 7 Aes128_Sha256_RsaOaep: RSA-PKCS#1 v1.5 SHA-256 signatures, RSA-OAEP (SHA-1) encryption, AES-128-CBC.</summary>
    public static SecurityPolicy Aes128Sha256RsaOaep { get; } = new("Aes128_Sha256_RsaOaep", SecurityPolicies.Aes128Sha256RsaOaep, 1, false, false, 16);

    /// <summary>Part 7 Aes256_Sha256_RsaPss: RSA-PSS SHA-256 signatures, RSA-OAEP SHA-256 encryption, AES-256-CBC.</summary>
    public static SecurityPolicy Aes256Sha256RsaPss { get; } = new("Aes256_Sha256_RsaPss", SecurityPolicies.Aes256Sha256RsaPss, 3, true, true, 32);

    /// <summary>The secured policies this client speaks, most secure first.</summary>
    public static IReadOnlyList<SecurityPolicy> Secured { get; } = [Aes256Sha256RsaPss, Basic256Sha256, Aes128Sha256RsaOaep];

    /// <summary>
    /// Policies Part 7 (1.04 onwards) marks deprecated, with the reason they are refused: both sign
    /// with SHA-1, which is no longer collision resistant (SHAttered, 2017); Basic128Rsa15 also
    /// encrypts with RSA PKCS#1 v1.5, open to Bleichenbacher's padding-oracle attack (CRYPTO 1998).
    /// </summary>
    public static IReadOnlyDictionary<string, string> Deprecated { get; } = new Dictionary<string, string>(StringComparer.Ordinal)
    {
        ["Basic128Rsa15"] = "deprecated by IEC 62541-7 since 1.04: SHA-1 signatures (no longer collision resistant) and RSA PKCS#1 v1.5 encryption (open to Bleichenbacher's padding-oracle attack)",
        ["Basic256"] = "deprecated by IEC 62541-7 since 1.04: SHA-1 signatures for certificates, chunks and sessions (no longer collision resistant)",
    };

    private SecurityPolicy(string name, string uri, int rank, bool pssSignatures, bool oaepSha256, int encryptionKeyLength)
    {
        Name = name;
        Uri = uri;
        Rank = rank;
        pss = pssSignatures;
        oaep256 = oaepSha256;
        EncryptionKeyLength = encryptionKeyLength;
    }

    private readonly bool pss;
    private readonly bool oaep256;

    public string Name { get; }

    public string Uri { get; }

    /// <summary>Higher is more secure (used to pick an endpoint when the user does not name one).</summary>
    public int Rank { get; }

    public bool IsNone => Rank == 0;

    /// <summary>Derived symmetric encryption key length in bytes (AES-128: 16, AES-256: 32).</summary>
    public int EncryptionKeyLength { get; }

    public int SigningKeyLength => IsNone ? 0 : 32;

    public int SymmetricSignatureLength => IsNone ? 0 : 32;

    public int SymmetricBlockSize => IsNone ? 0 : 16;

    public int NonceLength => IsNone ? 0 : 32;

    /// <summary>Asymmetric key sizes Part 7 allows for these policies: 2048 to 4096 bits.</summary>
    public int MinAsymmetricKeyBits => 2048;

    public int MaxAsymmetricKeyBits => 4096;

    public string AsymmetricSignatureUri => pss ? RsaPssSha256Uri : RsaSha256Uri;

    public string AsymmetricEncryptionUri => oaep256 ? RsaOaepSha256Uri : RsaOaepUri;

    private RSASignaturePadding SignaturePadding => pss ? RSASignaturePadding.Pss : RSASignaturePadding.Pkcs1;

    private RSAEncryptionPadding EncryptionPadding => oaep256 ? RSAEncryptionPadding.OaepSHA256 : RSAEncryptionPadding.OaepSHA1;

    /// <summary>Plain-text bytes per RSA block: modulus length minus the OAEP overhead (2·hLen + 2, RFC 8017 §7.1.1).</summary>
    public int AsymmetricPlainBlockSize(int keyBytes) => keyBytes - (oaep256 ? 66 : 42);

    public byte[] Sign(RSA privateKey, ReadOnlySpan<byte> data) => privateKey.SignData(data.ToArray(), HashAlgorithmName.SHA256, SignaturePadding);

    public bool Verify(RSA publicKey, ReadOnlySpan<byte> data, ReadOnlySpan<byte> signature) =>
        publicKey.VerifyData(data, signature, HashAlgorithmName.SHA256, SignaturePadding);

    /// <summary>Encrypts block by block; the input length must be a multiple of the plain block size unless it is a single block.</summary>
    public byte[] Encrypt(RSA publicKey, ReadOnlySpan<byte> plain)
    {
        int keyBytes = publicKey.KeySize / 8;
        int block = AsymmetricPlainBlockSize(keyBytes);
        int blocks = Math.Max(1, (plain.Length + block - 1) / block);
        var output = new byte[blocks * keyBytes];
        for (int i = 0; i < blocks; i++)
        {
            var part = plain.Slice(i * block, Math.Min(block, plain.Length - (i * block)));
            publicKey.Encrypt(part.ToArray(), EncryptionPadding).CopyTo(output, i * keyBytes);
        }

        return output;
    }

    /// <summary>Decrypts block by block; a length that is not a multiple of the key size, or a bad block, is BadSecurityChecksFailed.</summary>
    public byte[] Decrypt(RSA privateKey, ReadOnlySpan<byte> cipher)
    {
        int keyBytes = privateKey.KeySize / 8;
        if (cipher.Length == 0 || cipher.Length % keyBytes != 0)
        {
            throw SecurityFailure($"{cipher.Length} encrypted bytes are not a whole number of {keyBytes}-byte RSA blocks");
        }

        using var output = new MemoryStream(cipher.Length);
        try
        {
            for (int at = 0; at < cipher.Length; at += keyBytes)
            {
                output.Write(privateKey.Decrypt(cipher.Slice(at, keyBytes).ToArray(), EncryptionPadding));
            }
        }
        catch (CryptographicException e)
        {
            throw SecurityFailure($"an RSA block does not decrypt ({e.Message})");
        }

        return output.ToArray();
    }

    /// <summary>Finds a policy by its short name or URI; a deprecated or unknown one is refused with the reason.</summary>
    public static SecurityPolicy Find(string nameOrUri)
    {
        string name = nameOrUri.StartsWith(SecurityPolicies.Prefix, StringComparison.Ordinal) ? nameOrUri[SecurityPolicies.Prefix.Length..] : nameOrUri;
        if (Deprecated.TryGetValue(name, out var why))
        {
            throw new ServiceResultException(new StatusCode(StatusCodes.BadSecurityPolicyRejected), $"Security policy {name} is refused: {why}. Use {string.Join(", ", Secured.Select(p => p.Name))}.");
        }

        if (string.Equals(name, None.Name, StringComparison.OrdinalIgnoreCase))
        {
            return None;
        }

        return Secured.FirstOrDefault(p => string.Equals(p.Name, name, StringComparison.OrdinalIgnoreCase))
            ?? throw new ServiceResultException(new StatusCode(StatusCodes.BadSecurityPolicyRejected), $"Security policy '{nameOrUri}' is unknown (expected one of None, {string.Join(", ", Secured.Select(p => p.Name))}).");
    }

    /// <summary>The policy of a URI, or null when this client does not speak it (deprecated or unknown).</summary>
    public static SecurityPolicy? FromUri(string? uri) =>
        string.IsNullOrEmpty(uri) ? null : uri == None.Uri ? None : Secured.FirstOrDefault(p => p.Uri == uri);

    internal static ServiceResultException SecurityFailure(string reason) =>
        new(new StatusCode(StatusCodes.BadSecurityChecksFailed), $"Security checks failed: {reason}");

    public override string ToString() => Name;
}
