using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Contracts;

/// <summary>What the signal store knew of one input at a cycle: shown on the status page and used for quality.</summary>
/// <param name="Tag">Plant tag name.</param>
/// <param name="Role">Its role.</param>
/// <param name="Value">Value used by the cycle in the role's unit (NaN when none).</param>
/// <param name="SourceTime">Source timestamp of that value (default when none).</param>
/// <param name="AgeSeconds">Cycle time − dead time − source time, seconds (NaN when none).</param>
/// <param name="State">Why the quality is what it is.</param>
/// <param name="Quality">Quality the cycle sees.</param>
/// <param name="StatusCode">OPC UA status code the cycle sees (OPC UA Part 8 §7.3.2).</param>
internal readonly record struct InputHealth(
    string Tag,
    SignalRole Role,
    double Value,
    DateTimeOffset SourceTime,
    double AgeSeconds,
    InputState State,
    SampleQuality Quality,
    uint StatusCode);

/// <summary>State of an input at a cycle.</summary>
internal enum InputState
{
    /// <summary>A fresh value, with the sample's own quality.</summary>
    Ok,
    /// <summary>No value yet (BadWaitingForInitialData).</summary>
    Waiting,
    /// <summary>The newest usable value is older than the tag's maximum age (BadNoCommunication).</summary>
    Stale,
}
