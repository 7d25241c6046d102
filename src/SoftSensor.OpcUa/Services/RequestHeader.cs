using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>
/// The header of every service request (Part 4 §7.33): AuthenticationToken, Timestamp,
/// RequestHandle, ReturnDiagnostics, AuditEntryId, TimeoutHint (ms), AdditionalHeader.
/// </summary>
public sealed record RequestHeader
{
    public NodeId AuthenticationToken { get; init; } = NodeId.Null;

    public DateTime Timestamp { get; init; }

    public uint RequestHandle { get; init; }

    public uint ReturnDiagnostics { get; init; }

    public string? AuditEntryId { get; init; }

    public uint TimeoutHintMs { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        w.WriteNodeId(AuthenticationToken);
        w.WriteDateTime(Timestamp);
        w.WriteUInt32(RequestHandle);
        w.WriteUInt32(ReturnDiagnostics);
        w.WriteString(AuditEntryId);
        w.WriteUInt32(TimeoutHintMs);
        w.WriteExtensionObject(ExtensionObject.Null);
    }

    public static RequestHeader Decode(UaBinaryReader r)
    {
        var header = new RequestHeader
        {
            AuthenticationToken = r.ReadNodeId(),
            Timestamp = r.ReadDateTime(),
            RequestHandle = r.ReadUInt32(),
            ReturnDiagnostics = r.ReadUInt32(),
            AuditEntryId = r.ReadString(),
            TimeoutHintMs = r.ReadUInt32(),
        };
        r.ReadExtensionObject();
        return header;
    }
}
