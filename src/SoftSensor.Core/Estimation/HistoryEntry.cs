namespace SoftSensor.Core.Estimation;

/// <summary>One past cycle: its time, what it gave the observers, and their states after it.</summary>
public struct HistoryEntry
{
    /// <summary>Cycle time, UTC ticks.</summary>
    public long TimeTicks { get; set; }

    /// <summary>The cycle's observer inputs.</summary>
    public ObserverInputs Inputs { get; set; }

    /// <summary>Observer states after the cycle.</summary>
    public ObserverStates States { get; set; }
}
