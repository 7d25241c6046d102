using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>
/// The headers that follow the frame header in a secure-conversation chunk (Part 6 §6.7.2):
/// SecureChannelId, then the asymmetric security header (OPN: SecurityPolicyUri, SenderCertificate,
/// ReceiverCertificateThumbprint) or the symmetric one (MSG, CLO: TokenId), then the sequence
/// header (SequenceNumber, RequestId). Under SecurityPolicy None certificate and thumbprint are null.
/// </summary>
public readonly record struct ChunkHeaders(uint ChannelId, string? SecurityPolicyUri, uint TokenId, uint SequenceNumber, uint RequestId)
{
    public static void WriteAsymmetric(UaBinaryWriter w, uint channelId) => WriteAsymmetric(w, channelId, SecurityPolicies.None, null, null);

    /// <summary>The asymmetric header of a secured OPN: the client's certificate and the SHA-1 thumbprint of the server's.</summary>
    public static void WriteAsymmetric(UaBinaryWriter w, uint channelId, string policyUri, byte[]? senderCertificate, byte[]? receiverThumbprint)
    {
        w.WriteUInt32(channelId);
        w.WriteString(policyUri);
        w.WriteByteString(senderCertificate);
        w.WriteByteString(receiverThumbprint);
    }

    public static void WriteSymmetric(UaBinaryWriter w, uint channelId, uint tokenId)
    {
        w.WriteUInt32(channelId);
        w.WriteUInt32(tokenId);
    }

    /// <summary>Reads the headers of an OPN chunk (asymmetric) or a MSG/CLO chunk (symmetric).</summary>
    public static ChunkHeaders Read(UaBinaryReader r, bool asymmetric)
    {
        uint channelId = r.ReadUInt32();
        string? policy = null;
        uint tokenId = 0;
        if (asymmetric)
        {
            policy = r.ReadString();
            r.ReadByteString();
            r.ReadByteString();
        }
        else
        {
            tokenId = r.ReadUInt32();
        }

        return new ChunkHeaders(channelId, policy, tokenId, r.ReadUInt32(), r.ReadUInt32());
    }
}
