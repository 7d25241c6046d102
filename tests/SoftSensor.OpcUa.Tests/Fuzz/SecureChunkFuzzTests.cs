using System.Buffers.Binary;
using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Pki;
using SoftSensor.OpcUa.SecureChannel;
using SoftSensor.OpcUa.SecureChannel.Security;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.Tests.Fuzz;

/// <summary>
/// The secure path of the reader (<see cref="InboundChunks"/>) against chunks a server would send,
/// sealed in memory with the keys of both sides: a tampered signature, wrong padding, a replayed
/// sequence number and truncated chunks are each refused with the status code Part 6 §6.7.2
/// prescribes (BadSecurityChecksFailed, BadSequenceNumberInvalid, BadDecodingError for headers
/// cut short), and random mutations raise <see cref="ServiceResultException"/> only.
/// </summary>
public sealed class SecureChunkFuzzTests
{
    private const uint ChannelId = 7;
    private const uint TokenId = 3;
    private static readonly byte[] Body = [.. Enumerable.Range(0, 300).Select(i => (byte)i)];

    public static TheoryData<string, bool> PolicyAndEncryption() => new()
    {
        { "Basic256Sha256", false }, { "Basic256Sha256", true },
        { "Aes128_Sha256_RsaOaep", false }, { "Aes128_Sha256_RsaOaep", true },
        { "Aes256_Sha256_RsaPss", false }, { "Aes256_Sha256_RsaPss", true },
    };

    [Theory]
    [MemberData(nameof(PolicyAndEncryption))]
    public void SymmetricChunk_Valid_IsReadBackExactly(string policy, bool encrypt)
    {
        var (reader, seal) = Symmetric(policy, encrypt);
        var (headers, body) = reader.Read(ToFrame(Seal(seal, 1)));
        Assert.Equal(1u, headers.SequenceNumber);
        Assert.Equal(Body, body.ToArray());
    }

    [Theory]
    [MemberData(nameof(PolicyAndEncryption))]
    public void SymmetricChunk_TamperedSignature_IsBadSecurityChecksFailed(string policy, bool encrypt)
    {
        var (reader, seal) = Symmetric(policy, encrypt);
        var frame = Seal(seal, 1);
        frame[^1] ^= 0x01; // last byte of the signature (or of the last cipher block)
        AssertRefused(reader, frame, StatusCodes.BadSecurityChecksFailed);
    }

    [Theory]
    [InlineData("Basic256Sha256")]
    [InlineData("Aes128_Sha256_RsaOaep")]
    public void SymmetricChunk_WrongPaddingUnderAValidSignature_IsBadSecurityChecksFailed(string policy)
    {
        var p = SecurityPolicy.Find(policy);
        var (client, server) = ChannelKeys.Derive(p, RandomNumberGenerator.GetBytes(32), RandomNumberGenerator.GetBytes(32));
        var reader = Reader(p, MessageSecurityMode.SignAndEncrypt, server);

        // Built here by hand (HMAC-SHA256 and AES-CBC from the framework): 16 data bytes, then a
        // PaddingSize of 15 followed by padding bytes that are not all 15.
        var plain = new List<byte>();
        plain.AddRange("MSGF"u8.ToArray());
        plain.AddRange(new byte[4]);
        plain.AddRange(BitConverter.GetBytes(ChannelId));
        plain.AddRange(BitConverter.GetBytes(TokenId));
        plain.AddRange(BitConverter.GetBytes(1u));
        plain.AddRange(BitConverter.GetBytes(9u));
        plain.AddRange(new byte[8]);
        plain.Add(15);
        plain.AddRange(Enumerable.Range(0, 15).Select(i => (byte)(i == 7 ? 14 : 15)));
        var bytes = plain.ToArray();
        BinaryPrimitives.WriteUInt32LittleEndian(bytes.AsSpan(4), (uint)(bytes.Length + 32));
        byte[] signed = [.. bytes, .. HMACSHA256.HashData(server.SigningKey, bytes)];
        using var aes = Aes.Create();
        aes.Key = server.EncryptingKey;
        var cipher = aes.EncryptCbc(signed.AsSpan(16), server.InitializationVector, PaddingMode.None);
        byte[] frame = [.. signed[..16], .. cipher];

        var e = AssertRefused(reader, frame, StatusCodes.BadSecurityChecksFailed);
        Assert.Contains("padding", e.Message, StringComparison.Ordinal);
        Assert.NotNull(client);
    }

    [Theory]
    [MemberData(nameof(PolicyAndEncryption))]
    public void SymmetricChunk_ReplayedSequenceNumber_IsBadSequenceNumberInvalid(string policy, bool encrypt)
    {
        var (reader, seal) = Symmetric(policy, encrypt);
        var frame = Seal(seal, 1);
        reader.Read(ToFrame(frame));
        AssertRefused(reader, frame, StatusCodes.BadSequenceNumberInvalid);
    }

    [Theory]
    [InlineData(true, 16, StatusCodes.BadSecurityChecksFailed)] // a whole block less: the signature no longer matches
    [InlineData(true, 5, StatusCodes.BadSecurityChecksFailed)] // not a whole number of cipher blocks
    [InlineData(false, 3, StatusCodes.BadSecurityChecksFailed)]
    public void SymmetricChunk_Truncated_IsRefused(bool encrypt, int cut, uint expected)
    {
        var (reader, seal) = Symmetric("Basic256Sha256", encrypt);
        var frame = Seal(seal, 1)[..^cut];
        BinaryPrimitives.WriteUInt32LittleEndian(frame.AsSpan(4), (uint)frame.Length);
        AssertRefused(reader, frame, expected);
    }

    [Fact]
    public void SymmetricChunk_CutInsideItsHeaders_IsBadDecodingError()
    {
        var (reader, seal) = Symmetric("Basic256Sha256", true);
        var frame = Seal(seal, 1)[..13];
        BinaryPrimitives.WriteUInt32LittleEndian(frame.AsSpan(4), 13);
        AssertRefused(reader, frame, StatusCodes.BadDecodingError);
    }

    [Fact]
    public void SymmetricChunk_UnknownToken_IsBadSecureChannelTokenUnknown()
    {
        var (reader, seal) = Symmetric("Basic256Sha256", true);
        var frame = Seal(seal, 1);
        BinaryPrimitives.WriteUInt32LittleEndian(frame.AsSpan(12), TokenId + 1);
        AssertRefused(reader, frame, StatusCodes.BadSecureChannelTokenUnknown);
    }

    [Theory]
    [InlineData("Basic256Sha256")]
    [InlineData("Aes256_Sha256_RsaPss")]
    public void AsymmetricChunk_ValidThenTampered(string policy)
    {
        var p = SecurityPolicy.Find(policy);
        var now = DateTimeOffset.UtcNow;
        using var clientCert = ApplicationCertificate.Create("urn:test:client", "client", "localhost", now, TimeSpan.FromDays(1));
        using var serverCert = ApplicationCertificate.Create("urn:test:server", "server", "localhost", now, TimeSpan.FromDays(1));
        var security = new ChannelSecurity { Policy = p, Mode = MessageSecurityMode.SignAndEncrypt, ClientCertificate = clientCert, ServerCertificate = serverCert };
        var reader = new InboundChunks(security);

        // What the server sends: signed with its private key, encrypted for the client's public key.
        var seal = ChunkProtection.AsymmetricOutgoing(p, serverCert.GetRSAPrivateKey()!, clientCert.GetRSAPublicKey()!);
        byte[] Opn(uint sequence) => MessageChunker.Build(MessageTypes.OpenChannel,
            w => ChunkHeaders.WriteAsymmetric(w, ChannelId, p.Uri, serverCert.RawData, clientCert.GetCertHash()), 1, Body, 65535, TransportLimits.ClientDefault, new SequenceNumbers(sequence), seal)[0];

        Assert.Equal(Body, reader.Read(ToFrame(Opn(1))).Body.ToArray());
        var tampered = Opn(2);
        tampered[^3] ^= 0x40;
        AssertRefused(reader, tampered, StatusCodes.BadSecurityChecksFailed);
        AssertRefused(new InboundChunks(security), Opn(1)[..^7], StatusCodes.BadSecurityChecksFailed, patchSize: true);
    }

    [Fact]
    public async Task SymmetricChunks_TwentyThousandMutations_OnlyServiceResultExceptions()
    {
        var random = new Random(62541);
        var (_, seal) = Symmetric("Aes128_Sha256_RsaOaep", true);
        var valid = Seal(seal, 1);
        int refused = await Task.Run(() =>
        {
            int count = 0;
            for (int i = 0; i < 20_000; i++)
            {
                var (reader, _) = Symmetric("Aes128_Sha256_RsaOaep", true, seal);
                var frame = (byte[])valid.Clone();
                switch (i % 3)
                {
                    case 0:
                        frame[random.Next(8, frame.Length)] ^= (byte)(1 << random.Next(8));
                        break;
                    case 1:
                        frame = frame[..random.Next(8, frame.Length)];
                        BinaryPrimitives.WriteUInt32LittleEndian(frame.AsSpan(4), (uint)frame.Length);
                        break;
                    default:
                        random.NextBytes(frame.AsSpan(16 + random.Next(frame.Length - 16)));
                        break;
                }

                try
                {
                    reader.Read(ToFrame(frame));
                }
                catch (ServiceResultException)
                {
                    count++;
                }
            }

            return count;
        }).WaitAsync(TimeSpan.FromMinutes(2));

        // Every mutation touches the encrypted, signed part or its headers: none may pass.
        Assert.True(refused >= 19_990, $"{20_000 - refused} mutated chunks were accepted");
    }

    private static ChannelKeys? sharedServerKeys;
    private static SecurityPolicy? sharedPolicy;

    private static (InboundChunks Reader, ChunkProtection Seal) Symmetric(string policy, bool encrypt, ChunkProtection? reuse = null)
    {
        var p = SecurityPolicy.Find(policy);
        if (reuse is null || sharedServerKeys is null || sharedPolicy != p)
        {
            var (_, server) = ChannelKeys.Derive(p, RandomNumberGenerator.GetBytes(32), RandomNumberGenerator.GetBytes(32));
            sharedServerKeys = server;
            sharedPolicy = p;
        }

        var mode = encrypt ? MessageSecurityMode.SignAndEncrypt : MessageSecurityMode.Sign;
        return (Reader(p, mode, sharedServerKeys), reuse ?? ChunkProtection.SymmetricOutgoing(p, sharedServerKeys, encrypt));
    }

    private static InboundChunks Reader(SecurityPolicy p, MessageSecurityMode mode, ChannelKeys server)
    {
        var reader = new InboundChunks(new ChannelSecurity { Policy = p, Mode = mode }) { ChannelId = ChannelId };
        reader.AddToken(TokenId, ChunkProtection.SymmetricIncoming(p, server, mode == MessageSecurityMode.SignAndEncrypt));
        return reader;
    }

    private static byte[] Seal(ChunkProtection seal, uint sequence) =>
        MessageChunker.Build(MessageTypes.Message, w => ChunkHeaders.WriteSymmetric(w, ChannelId, TokenId), 9, Body, 65535, TransportLimits.ClientDefault, new SequenceNumbers(sequence), seal)[0];

    private static Frame ToFrame(byte[] frame) => new(FrameHeader.Parse(frame.AsSpan(0, 8), 1 << 20), frame.AsMemory(8));

    private static ServiceResultException AssertRefused(InboundChunks reader, byte[] frame, uint expected, bool patchSize = false)
    {
        if (patchSize)
        {
            BinaryPrimitives.WriteUInt32LittleEndian(frame.AsSpan(4), (uint)frame.Length);
        }

        var e = Assert.Throws<ServiceResultException>(() => reader.Read(ToFrame(frame)));
        Assert.True(e.Status.Is(expected), $"{e.Status}: {e.Message}");
        return e;
    }
}
