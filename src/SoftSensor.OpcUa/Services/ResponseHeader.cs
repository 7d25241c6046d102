using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>
/// The header of every service response (Part 4 §7.34): Timestamp, RequestHandle, ServiceResult,
/// ServiceDiagnostics, StringTable, AdditionalHeader.
/// </summary>
public sealed record ResponseHeader
{
    public DateTime Timestamp { get; init; }

    public uint RequestHandle { get; init; }

    public StatusCode ServiceResult { get; init; }

    public DiagnosticInfo? ServiceDiagnostics { get; init; }

    public string?[] StringTable { get; init; } = [];

    public void Encode(UaBinaryWriter w)
    {
        w.WriteDateTime(Timestamp);
        w.WriteUInt32(RequestHandle);
        w.WriteStatusCode(ServiceResult);
        w.WriteDiagnosticInfo(ServiceDiagnostics);
        w.WriteArray(StringTable, static (x, s) => x.WriteString(s));
        w.WriteExtensionObject(ExtensionObject.Null);
    }

    public static ResponseHeader Decode(UaBinaryReader r)
    {
        var header = new ResponseHeader
        {
            Timestamp = r.ReadDateTime(),
            RequestHandle = r.ReadUInt32(),
            ServiceResult = r.ReadStatusCode(),
            ServiceDiagnostics = r.ReadDiagnosticInfo(),
            StringTable = r.ReadArrayOrEmpty(static x => x.ReadString()),
        };
        r.ReadExtensionObject();
        return header;
    }
}
