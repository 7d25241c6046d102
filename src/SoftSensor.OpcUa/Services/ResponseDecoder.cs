using System.Collections.Frozen;
using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>
/// Decodes a service response body: the NodeId of its binary encoding, then the structure
/// (Part 6 §7.1.2.2 message body). Unknown ids are a decode error.
/// </summary>
public static class ResponseDecoder
{
    private static readonly FrozenDictionary<uint, Func<UaBinaryReader, IServiceResponse>> Decoders =
        new Dictionary<uint, Func<UaBinaryReader, IServiceResponse>>
        {
            [ServiceFault.EncodingId] = ServiceFault.Decode,
            [OpenSecureChannelResponse.EncodingId] = OpenSecureChannelResponse.Decode,
            [GetEndpointsResponse.EncodingId] = GetEndpointsResponse.Decode,
            [CreateSessionResponse.EncodingId] = CreateSessionResponse.Decode,
            [ActivateSessionResponse.EncodingId] = ActivateSessionResponse.Decode,
            [CloseSessionResponse.EncodingId] = CloseSessionResponse.Decode,
            [ReadResponse.EncodingId] = ReadResponse.Decode,
            [WriteResponse.EncodingId] = WriteResponse.Decode,
            [BrowseResponse.EncodingId] = BrowseResponse.Decode,
            [BrowseResponse.NextEncodingId] = BrowseResponse.Decode,
            [TranslateBrowsePathsResponse.EncodingId] = TranslateBrowsePathsResponse.Decode,
            [CreateSubscriptionResponse.EncodingId] = CreateSubscriptionResponse.Decode,
            [StatusResultsResponse.DeleteSubscriptionsEncodingId] = StatusResultsResponse.Decode,
            [TransferSubscriptionsResponse.EncodingId] = TransferSubscriptionsResponse.Decode,
            [CreateMonitoredItemsResponse.EncodingId] = CreateMonitoredItemsResponse.Decode,
            [PublishResponse.EncodingId] = PublishResponse.Decode,
            [RepublishResponse.EncodingId] = RepublishResponse.Decode,
        }.ToFrozenDictionary();

    public static IServiceResponse Decode(ReadOnlyMemory<byte> body, DecodeLimits? limits = null)
    {
        var r = new UaBinaryReader(body, limits);
        var typeId = r.ReadNodeId();
        if (typeId.NamespaceIndex != 0 || typeId.IdType != NodeIdType.Numeric || !Decoders.TryGetValue(typeId.NumericId, out var decode))
        {
            throw new UaDecodeException($"Unknown response type {typeId}.");
        }

        return decode(r);
    }

    /// <summary>Encodes a request body: the encoding NodeId then the structure.</summary>
    public static void EncodeRequest(UaBinaryWriter w, IServiceRequest request)
    {
        w.WriteNodeId(NodeId.Numeric(request.BinaryEncodingId));
        request.Encode(w);
    }
}
