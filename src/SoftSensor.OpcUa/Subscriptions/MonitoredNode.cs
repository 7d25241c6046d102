namespace SoftSensor.OpcUa.Subscriptions;

/// <summary>One node the caller wants to monitor: its own handle, the node reference and the item settings.</summary>
public sealed record MonitoredNode(int Handle, NodeReference Reference, MonitoredItemSettings Settings);
