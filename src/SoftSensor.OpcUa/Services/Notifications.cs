using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>MonitoredItemNotification (Part 4 §7.25.2): the client handle and the new value.</summary>
public readonly record struct MonitoredItemNotification(uint ClientHandle, DataValue Value);

/// <summary>
/// Decodes the NotificationData bodies of a NotificationMessage (Part 4 §7.25):
/// DataChangeNotification (encoding i=811) and StatusChangeNotification (i=820); event lists
/// (i=916) are not used by this client and are skipped.
/// </summary>
public static class Notifications
{
    public const uint DataChangeEncodingId = 811;
    public const uint StatusChangeEncodingId = 820;

    /// <summary>The data changes in one notification body, or empty for other kinds.</summary>
    public static MonitoredItemNotification[] ReadDataChanges(ExtensionObject data, DecodeLimits? limits = null)
    {
        if (data.BodyKind != ExtensionObjectBody.Binary || !data.TypeId.Equals(NodeId.Numeric(DataChangeEncodingId)))
        {
            return [];
        }

        var r = new UaBinaryReader(data.Body, limits);
        var items = r.ReadArrayOrEmpty(static x => new MonitoredItemNotification(x.ReadUInt32(), x.ReadDataValue()));
        r.ReadArray(static x => x.ReadDiagnosticInfo());
        return items;
    }

    /// <summary>The subscription status of a StatusChangeNotification, or null for other kinds.</summary>
    public static StatusCode? ReadStatusChange(ExtensionObject data, DecodeLimits? limits = null)
    {
        if (data.BodyKind != ExtensionObjectBody.Binary || !data.TypeId.Equals(NodeId.Numeric(StatusChangeEncodingId)))
        {
            return null;
        }

        var r = new UaBinaryReader(data.Body, limits);
        return r.ReadStatusCode();
    }
}
