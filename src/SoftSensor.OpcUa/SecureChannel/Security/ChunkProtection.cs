using System.Buffers.Binary;
using System.Security.Cryptography;

namespace SoftSensor.OpcUa.SecureChannel.Security;

/// <summary>
/// Signs and encrypts the chunks of one direction, or checks and decrypts them (Part 6 §6.7.2.2
/// and §6.7.2.5). A chunk is: frame header | security header | [sequence header | body | padding |
/// signature]; the bracketed part is encrypted. The signature covers everything before it, with the
/// frame's final (encrypted) MessageSize. Padding, present only when encrypting: one PaddingSize
/// byte, PaddingSize bytes of that same value, and — when the encryption key is longer than 2048
/// bits — an ExtraPaddingSize byte holding the high byte of the count, so that sequence header,
/// body, padding and signature fill whole plain-text blocks. Opening checks the signature before
/// the padding, and every failure is BadSecurityChecksFailed (one status for all, so a peer learns
/// nothing from which check failed).
/// </summary>
public sealed class ChunkProtection
{
    private readonly Func<byte[], byte[]> sign;
    private readonly Func<ReadOnlyMemory<byte>, ReadOnlyMemory<byte>, bool> verify;
    private readonly Func<byte[], byte[]>? encrypt;
    private readonly Func<ReadOnlyMemory<byte>, byte[]>? decrypt;

    private ChunkProtection(int signatureLength, int plainBlock, int cipherBlock, bool extraPadding, Func<byte[], byte[]> sign,
        Func<ReadOnlyMemory<byte>, ReadOnlyMemory<byte>, bool> verify, Func<byte[], byte[]>? encrypt, Func<ReadOnlyMemory<byte>, byte[]>? decrypt)
    {
        SignatureLength = signatureLength;
        PlainBlock = plainBlock;
        CipherBlock = cipherBlock;
        ExtraPadding = extraPadding;
        this.sign = sign;
        this.verify = verify;
        this.encrypt = encrypt;
        this.decrypt = decrypt;
    }

    /// <summary>Chunks neither signed nor encrypted (SecurityPolicy None).</summary>
    public static ChunkProtection None { get; } = new(0, 0, 0, false, _ => [], (_, _) => true, null, null);

    public int SignatureLength { get; }

    public int PlainBlock { get; }

    public int CipherBlock { get; }

    public bool ExtraPadding { get; }

    public bool Encrypts => encrypt is not null || decrypt is not null;

    /// <summary>Chunks the client sends under a token: HMAC-SHA256 with the client signing key, AES-CBC when <paramref name="encrypted"/>.</summary>
    public static ChunkProtection SymmetricOutgoing(SecurityPolicy policy, ChannelKeys keys, bool encrypted)
    {
        var aes = encrypted ? NewAes(keys) : null;
        return new ChunkProtection(policy.SymmetricSignatureLength, 16, 16, false, data => HMACSHA256.HashData(keys.SigningKey, data),
            (_, _) => false, aes is null ? null : plain => aes.EncryptCbc(plain, keys.InitializationVector, PaddingMode.None), null);
    }

    /// <summary>Chunks the server sends under a token, checked with the server's keys.</summary>
    public static ChunkProtection SymmetricIncoming(SecurityPolicy policy, ChannelKeys keys, bool encrypted)
    {
        var aes = encrypted ? NewAes(keys) : null;
        return new ChunkProtection(policy.SymmetricSignatureLength, 16, 16, false, _ => [],
            (data, signature) => CryptographicOperations.FixedTimeEquals(HMACSHA256.HashData(keys.SigningKey, data.Span), signature.Span),
            null, aes is null ? null : cipher => aes.DecryptCbc(cipher.Span, keys.InitializationVector, PaddingMode.None));
    }

    /// <summary>OpenSecureChannel requests: signed with the client's private key, encrypted with the server's public key.</summary>
    public static ChunkProtection AsymmetricOutgoing(SecurityPolicy policy, RSA clientPrivate, RSA serverPublic)
    {
        int serverBytes = serverPublic.KeySize / 8;
        return new ChunkProtection(clientPrivate.KeySize / 8, policy.AsymmetricPlainBlockSize(serverBytes), serverBytes, serverBytes > 256,
            data => policy.Sign(clientPrivate, data), (_, _) => false, plain => policy.Encrypt(serverPublic, plain), null);
    }

    /// <summary>OpenSecureChannel responses: decrypted with the client's private key, verified with the server's public key.</summary>
    public static ChunkProtection AsymmetricIncoming(SecurityPolicy policy, RSA clientPrivate, RSA serverPublic)
    {
        int clientBytes = clientPrivate.KeySize / 8;
        return new ChunkProtection(serverPublic.KeySize / 8, policy.AsymmetricPlainBlockSize(clientBytes), clientBytes, clientBytes > 256,
            _ => [], (data, signature) => policy.Verify(serverPublic, data.Span, signature.Span), null, cipher => policy.Decrypt(clientPrivate, cipher.Span));
    }

    /// <summary>Body bytes that fit a chunk when <paramref name="room"/> bytes follow the security header.</summary>
    public int MaxBodySize(int room)
    {
        const int sequenceHeader = 8;
        if (!Encrypts)
        {
            return room - sequenceHeader - SignatureLength;
        }

        int plain = room / CipherBlock * PlainBlock;
        return plain - sequenceHeader - SignatureLength - 1 - (ExtraPadding ? 1 : 0);
    }

    /// <summary>Seals a chunk written in plain text; <paramref name="encryptFrom"/> is where the sequence header starts.</summary>
    public byte[] Seal(ReadOnlySpan<byte> plain, int encryptFrom)
    {
        int data = plain.Length - encryptFrom;
        int padding = 0;
        int paddingBytes = 0;
        if (encrypt is not null)
        {
            int fixedPart = data + SignatureLength + 1 + (ExtraPadding ? 1 : 0);
            padding = (PlainBlock - (fixedPart % PlainBlock)) % PlainBlock;
            paddingBytes = 1 + padding + (ExtraPadding ? 1 : 0);
        }

        int signedRegion = data + paddingBytes + SignatureLength;
        int frameSize = encrypt is null ? encryptFrom + signedRegion : encryptFrom + (signedRegion / PlainBlock * CipherBlock);
        var buffer = new byte[encryptFrom + signedRegion];
        plain.CopyTo(buffer);
        int at = plain.Length;
        if (encrypt is not null)
        {
            buffer.AsSpan(at, 1 + padding).Fill((byte)(padding & 0xFF));
            at += 1 + padding;
            if (ExtraPadding)
            {
                buffer[at++] = (byte)(padding >> 8);
            }
        }

        BinaryPrimitives.WriteUInt32LittleEndian(buffer.AsSpan(4), (uint)frameSize);
        if (SignatureLength > 0)
        {
            var signature = sign(buffer[..at]);
            signature.CopyTo(buffer, at);
        }

        if (encrypt is null)
        {
            return buffer;
        }

        var cipher = encrypt(buffer[encryptFrom..]);
        var frame = new byte[encryptFrom + cipher.Length];
        buffer.AsSpan(0, encryptFrom).CopyTo(frame);
        cipher.CopyTo(frame, encryptFrom);
        return frame;
    }

    /// <summary>
    /// Checks and decrypts a received chunk; returns the frame in plain text up to the end of the
    /// body (padding and signature removed). Throws BadSecurityChecksFailed on any mismatch.
    /// </summary>
    public ReadOnlyMemory<byte> Open(ReadOnlyMemory<byte> frame, int encryptFrom)
    {
        var region = frame[encryptFrom..];
        ReadOnlyMemory<byte> whole = frame;
        if (decrypt is not null)
        {
            if (region.Length == 0 || region.Length % CipherBlock != 0)
            {
                throw SecurityPolicy.SecurityFailure($"the encrypted part of the chunk is {region.Length} bytes, not a whole number of {CipherBlock}-byte blocks");
            }

            var plain = decrypt(region);
            var joined = new byte[encryptFrom + plain.Length];
            frame.Span[..encryptFrom].CopyTo(joined);
            plain.CopyTo(joined, encryptFrom);
            whole = joined;
        }

        int minimum = 8 + SignatureLength + (decrypt is null ? 0 : 1 + (ExtraPadding ? 1 : 0));
        if (whole.Length - encryptFrom < minimum)
        {
            throw SecurityPolicy.SecurityFailure($"the chunk holds {whole.Length - encryptFrom} bytes after its security header, fewer than the {minimum} its sequence header, padding and signature need");
        }

        int end = whole.Length - SignatureLength;
        if (SignatureLength > 0 && !verify(whole[..end], whole[end..]))
        {
            throw SecurityPolicy.SecurityFailure("the chunk's signature does not match");
        }

        if (decrypt is null)
        {
            return whole[..end];
        }

        var span = whole.Span;
        int high = ExtraPadding ? span[end - 1] : 0;
        int lowAt = end - 1 - (ExtraPadding ? 1 : 0);
        int count = (high << 8) | span[lowAt];
        int removed = count + 1 + (ExtraPadding ? 1 : 0);
        if (removed > end - encryptFrom - 8)
        {
            throw SecurityPolicy.SecurityFailure($"padding of {count} bytes is longer than the chunk");
        }

        byte low = span[lowAt];
        foreach (byte b in span[(end - removed)..lowAt])
        {
            if (b != low)
            {
                throw SecurityPolicy.SecurityFailure("the chunk's padding bytes are not all equal to its padding size");
            }
        }

        return whole[..(end - removed)];
    }

    private static Aes NewAes(ChannelKeys keys)
    {
        var aes = Aes.Create();
        aes.Key = keys.EncryptingKey;
        return aes;
    }
}
