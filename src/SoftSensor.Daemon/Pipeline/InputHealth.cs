using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>What the signal store knew of one input at a cycle: shown on the status page and used for quality.</summary>
/// <param name="Tag">Plant tag name.</param>
/// <param name="Role">Its role.</param>
/// <param name="Value">Value used by the cycle in the role's unit (NaN when none).</param>
/// <param name="SourceTime">Source timestamp of that value (default when none).</param>
/// <param name="AgeSeconds">Cycle time − dead time − source time, seconds (NaN when none).</param>
/// <param name="State">Why the quality is what it is.</param>
/// <param name="Quality">Quality the cycle sees.</param>
/// <param name="StatusCode">OPC UA status code the cycle sees (INTEGRATION.md "Estimate quality").</param>
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

/// <summary>OPC UA status codes used for estimates (OPC UA Part 8 §7.3.2, as listed in INTEGRATION.md).</summary>
internal static class StatusCodes
{
    public const uint Good = 0x00000000;
    public const uint UncertainLastUsableValue = 0x40900000;
    public const uint UncertainInitialValue = 0x40920000;
    public const uint UncertainSensorNotAccurate = 0x40930000;
    public const uint UncertainEngineeringUnitsExceeded = 0x40940000;
    public const uint UncertainSubNormal = 0x40950000;
    public const uint BadNoCommunication = 0x80310000;
    public const uint BadWaitingForInitialData = 0x80320000;
    public const uint BadConfigurationError = 0x80890000;
    public const uint BadOutOfService = 0x808D0000;

    /// <summary>Generic codes for a bare severity (Part 4 §7.39: top two bits).</summary>
    public const uint Uncertain = 0x40000000;
    public const uint Bad = 0x80000000;

    /// <summary>The generic code of a severity.</summary>
    public static uint Of(SampleQuality quality) => quality switch
    {
        SampleQuality.Good => Good,
        SampleQuality.Uncertain => Uncertain,
        _ => Bad,
    };
}
