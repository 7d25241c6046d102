using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.SecureChannel.Security;

/// <summary>
/// Checks every secure-conversation chunk the server sends, before any of its body is decoded:
/// channel id, security policy and certificates (OPN), token (MSG, CLO: the current one or the one
/// before a renewal), signature, decryption and padding (through <see cref="ChunkProtection"/>),
/// then the sequence number (Part 6 §6.7.2.4: one more than the previous, or below 1024 after a
/// wrap). Any failure is a <see cref="ServiceResultException"/> naming the check; the channel
/// closes on it. Not thread-safe: the channel's reader is its only caller.
/// </summary>
public sealed class InboundChunks(ChannelSecurity security)
{
    private readonly Dictionary<uint, ChunkProtection> tokens = [];
    private uint? lastSequence;
    private uint currentToken;
    private ChunkProtection? asymmetric;

    /// <summary>The channel id the server assigned (0 until the first OpenSecureChannel response).</summary>
    public uint ChannelId { get; set; }

    /// <summary>Adds the keys of a new token; only the newest two are kept.</summary>
    public void AddToken(uint tokenId, ChunkProtection incoming)
    {
        foreach (var old in tokens.Keys.Where(k => k != currentToken && k != tokenId).ToList())
        {
            tokens.Remove(old);
        }

        tokens[tokenId] = incoming;
        currentToken = tokenId;
    }

    /// <summary>Checks a frame; returns its headers and the plain body after the sequence header.</summary>
    public (ChunkHeaders Headers, ReadOnlyMemory<byte> Body) Read(Frame frame)
    {
        var whole = new byte[FrameHeader.Size + frame.Body.Length];
        var header = new UaBinaryWriter(FrameHeader.Size);
        FrameHeader.Write(header, frame.Header.MessageType, frame.Header.ChunkType);
        header.WrittenSpan[..4].CopyTo(whole);
        System.Buffers.Binary.BinaryPrimitives.WriteUInt32LittleEndian(whole.AsSpan(4), frame.Header.MessageSize);
        frame.Body.Span.CopyTo(whole.AsSpan(FrameHeader.Size));

        bool opn = frame.Header.MessageType == MessageTypes.OpenChannel;
        ChunkProtection protection;
        uint channelId;
        string? policyUri = null;
        uint tokenId = 0;
        int securityEnd;
        try
        {
            var r = new UaBinaryReader(frame.Body);
            channelId = r.ReadUInt32();
            if (opn)
            {
                policyUri = r.ReadString();
                var sender = r.ReadByteString();
                var thumbprint = r.ReadByteString();
                protection = CheckAsymmetricHeader(policyUri, sender, thumbprint);
            }
            else
            {
                tokenId = r.ReadUInt32();
                protection = tokens.GetValueOrDefault(tokenId)
                    ?? throw Fail(StatusCodes.BadSecureChannelTokenUnknown, $"chunk with token {tokenId}, known: {string.Join(", ", tokens.Keys)}");
            }

            securityEnd = FrameHeader.Size + r.Position;
        }
        catch (UaDecodeException e)
        {
            throw Fail(StatusCodes.BadDecodingError, $"chunk headers cannot be read: {e.Message}");
        }

        if (ChannelId != 0 && channelId != ChannelId)
        {
            throw Fail(StatusCodes.BadSecureChannelIdInvalid, $"chunk for channel {channelId}, this is {ChannelId}");
        }

        var opened = protection.Open(whole, securityEnd);
        if (opened.Length < securityEnd + 8)
        {
            throw Fail(StatusCodes.BadDecodingError, "the chunk ends inside its sequence header");
        }

        var seq = new UaBinaryReader(opened[securityEnd..]);
        uint sequence = seq.ReadUInt32();
        uint requestId = seq.ReadUInt32();
        if (!SequenceNumbers.IsValidSuccessor(lastSequence, sequence))
        {
            throw Fail(StatusCodes.BadSequenceNumberInvalid, $"sequence number {sequence} after {lastSequence}");
        }

        lastSequence = sequence;
        return (new ChunkHeaders(channelId, policyUri, tokenId, sequence, requestId), opened[(securityEnd + 8)..]);
    }

    private ChunkProtection CheckAsymmetricHeader(string? policyUri, byte[]? sender, byte[]? thumbprint)
    {
        if (policyUri != security.Policy.Uri)
        {
            throw Fail(StatusCodes.BadSecurityPolicyRejected, $"OpenSecureChannel response under policy '{policyUri}', the channel asked for {security.Policy.Uri}");
        }

        if (security.IsNone)
        {
            return ChunkProtection.None;
        }

        var expected = security.Server.RawData;
        if (sender is null || !sender.AsSpan().StartsWith(expected))
        {
            throw Fail(StatusCodes.BadCertificateInvalid, "the OpenSecureChannel response is signed with another certificate than the server's endpoint advertised");
        }

        if (thumbprint is null || !thumbprint.AsSpan().SequenceEqual(security.Client.GetCertHash()))
        {
            throw Fail(StatusCodes.BadCertificateInvalid, "the OpenSecureChannel response is encrypted for another certificate than this client's");
        }

        return asymmetric ??= ChunkProtection.AsymmetricIncoming(security.Policy, security.ClientKey(), security.ServerKey());
    }

    private static ServiceResultException Fail(uint code, string reason) => new(new StatusCode(code), reason);
}
