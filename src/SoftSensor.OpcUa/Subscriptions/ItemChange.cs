using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Subscriptions;

/// <summary>
/// A new value of a monitored node, as the client hands it on: the caller's handle, the node's
/// reference as configured, and the DataValue (value, status, timestamps).
/// </summary>
public readonly record struct ItemChange(int Handle, string Reference, DataValue Value);
