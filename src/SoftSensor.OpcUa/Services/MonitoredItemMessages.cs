using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>DataChangeFilter (Part 4 §7.22.2): the trigger and an absolute or percent deadband.</summary>
public sealed record DataChangeFilter(DataChangeTrigger Trigger, DeadbandType DeadbandType, double DeadbandValue) : IUaEncodeable
{
    public uint BinaryEncodingId => 724;

    public void Encode(UaBinaryWriter w)
    {
        w.WriteInt32((int)Trigger);
        w.WriteUInt32((uint)DeadbandType);
        w.WriteDouble(DeadbandValue);
    }
}

/// <summary>MonitoredItemCreateRequest with its MonitoringParameters (Part 4 §5.12.2.2, §7.21).</summary>
public sealed record MonitoredItemCreateRequest(ReadValueId ItemToMonitor, uint ClientHandle)
{
    public MonitoringMode MonitoringMode { get; init; } = MonitoringMode.Reporting;

    public double SamplingIntervalMs { get; init; } = -1;

    public DataChangeFilter? Filter { get; init; }

    public uint QueueSize { get; init; } = 1;

    public bool DiscardOldest { get; init; } = true;

    public void Encode(UaBinaryWriter w)
    {
        ItemToMonitor.Encode(w);
        w.WriteInt32((int)MonitoringMode);
        w.WriteUInt32(ClientHandle);
        w.WriteDouble(SamplingIntervalMs);
        w.WriteExtensionObject(Filter);
        w.WriteUInt32(QueueSize);
        w.WriteBoolean(DiscardOldest);
    }
}

/// <summary>CreateMonitoredItems request (Part 4 §5.12.2.2).</summary>
public sealed record CreateMonitoredItemsRequest : IServiceRequest
{
    public uint BinaryEncodingId => 751;

    public RequestHeader Header { get; set; } = new();

    public uint SubscriptionId { get; init; }

    public TimestampsToReturn TimestampsToReturn { get; init; } = TimestampsToReturn.Both;

    public required IReadOnlyList<MonitoredItemCreateRequest> ItemsToCreate { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteUInt32(SubscriptionId);
        w.WriteInt32((int)TimestampsToReturn);
        w.WriteArray(ItemsToCreate, static (x, i) => i.Encode(x));
    }
}

/// <summary>MonitoredItemCreateResult (Part 4 §5.12.2.2).</summary>
public sealed record MonitoredItemCreateResult(StatusCode Status, uint MonitoredItemId, double RevisedSamplingIntervalMs, uint RevisedQueueSize)
{
    public static MonitoredItemCreateResult Decode(UaBinaryReader r)
    {
        var result = new MonitoredItemCreateResult(r.ReadStatusCode(), r.ReadUInt32(), r.ReadDouble(), r.ReadUInt32());
        r.ReadExtensionObject(); // FilterResult
        return result;
    }
}

/// <summary>CreateMonitoredItems response (Part 4 §5.12.2.2).</summary>
public sealed record CreateMonitoredItemsResponse(ResponseHeader Header, MonitoredItemCreateResult[] Results) : IServiceResponse
{
    public const uint EncodingId = 754;

    public static CreateMonitoredItemsResponse Decode(UaBinaryReader r)
    {
        var response = new CreateMonitoredItemsResponse(ResponseHeader.Decode(r), r.ReadArrayOrEmpty(MonitoredItemCreateResult.Decode));
        r.ReadArray(static x => x.ReadDiagnosticInfo());
        return response;
    }
}
