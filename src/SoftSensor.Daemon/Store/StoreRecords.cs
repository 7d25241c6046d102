using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Store;

/// <summary>One stored estimate value.</summary>
internal readonly record struct StoredEstimate(
    long FrameId,
    string Reactor,
    string Name,
    DateTimeOffset Time,
    double Value,
    double Sigma,
    string Unit,
    SampleQuality Quality,
    uint StatusCode);


/// <summary>
/// One alarm state change as the store keeps it (the alarm engine maps its own types onto this).
/// </summary>
/// <param name="Reactor">Reactor id.</param>
/// <param name="AlarmId">Stable id of the alarm (rule), e.g. <c>rq_high</c>.</param>
/// <param name="Time">Time of the change (UTC).</param>
/// <param name="State">State after the change (the engine's own name for it).</param>
/// <param name="Priority">Priority (the engine's own name for it).</param>
/// <param name="Active">True while the alarm should be shown as active.</param>
/// <param name="Value">The value that caused the change (NaN when none).</param>
/// <param name="Message">Text for the operator.</param>
internal sealed record StoredAlarm(
    string Reactor,
    string AlarmId,
    DateTimeOffset Time,
    string State,
    string Priority,
    bool Active,
    double Value,
    string Message);

/// <summary>One stored frame with its values by estimate name (the batch report reads these).</summary>
internal sealed record StoredFrameValues(DateTimeOffset Time, SampleQuality Quality, IReadOnlyDictionary<string, EstimateValue> Values);
