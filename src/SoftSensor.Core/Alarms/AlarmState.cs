namespace SoftSensor.Core.Alarms;

/// <summary>
/// The states of an alarm in the alarm state model of ANSI/ISA-18.2-2016 (IEC 62682:2014), clause
/// "alarm states": A normal, B unacknowledged alarm, C acknowledged alarm, D return-to-normal
/// unacknowledged, F shelved, G suppressed by design, H out of service. The optional latched state
/// (E) is not used: no rule here latches.
/// </summary>
public enum AlarmState
{
    /// <summary>A: process normal, alarm acknowledged (nothing to do).</summary>
    Normal = 0,
    /// <summary>B: process abnormal, alarm not yet acknowledged (annunciated).</summary>
    Unacknowledged,
    /// <summary>C: process abnormal, the operator acknowledged.</summary>
    Acknowledged,
    /// <summary>D: process back to normal before anyone acknowledged.</summary>
    ReturnedUnacknowledged,
    /// <summary>F: the operator shelved the alarm until an expiry time.</summary>
    Shelved,
    /// <summary>G: suppressed by design logic (here: while the estimate it watches is bad).</summary>
    SuppressedByDesign,
    /// <summary>H: removed from service for maintenance.</summary>
    OutOfService,
}

/// <summary>Helpers on <see cref="AlarmState"/>.</summary>
public static class AlarmStates
{
    /// <summary>True for the states an operator sees as an active or pending alarm (B, C, D).</summary>
    public static bool IsAnnunciated(AlarmState state) =>
        state is AlarmState.Unacknowledged or AlarmState.Acknowledged or AlarmState.ReturnedUnacknowledged;

    /// <summary>True for the states in which the alarm is not annunciated whatever the process does (F, G, H).</summary>
    public static bool IsMasked(AlarmState state) =>
        state is AlarmState.Shelved or AlarmState.SuppressedByDesign or AlarmState.OutOfService;

    /// <summary>A stable lowercase id for journals, payloads and the status page.</summary>
    public static string Id(AlarmState state) => state switch
    {
        AlarmState.Normal => "normal",
        AlarmState.Unacknowledged => "unacknowledged",
        AlarmState.Acknowledged => "acknowledged",
        AlarmState.ReturnedUnacknowledged => "returned_unacknowledged",
        AlarmState.Shelved => "shelved",
        AlarmState.SuppressedByDesign => "suppressed",
        AlarmState.OutOfService => "out_of_service",
        _ => throw new ArgumentOutOfRangeException(nameof(state), state, "unknown alarm state"),
    };

    /// <summary>Parses an id written by <see cref="Id"/>.</summary>
    public static bool TryParse(string? id, out AlarmState state)
    {
        foreach (var s in Enum.GetValues<AlarmState>())
        {
            if (string.Equals(Id(s), id, StringComparison.Ordinal))
            {
                state = s;
                return true;
            }
        }

        state = AlarmState.Normal;
        return false;
    }
}
