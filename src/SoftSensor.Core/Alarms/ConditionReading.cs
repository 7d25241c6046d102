namespace SoftSensor.Core.Alarms;

/// <summary>What a rule's test found in one evaluation.</summary>
public enum ConditionOutcome
{
    /// <summary>The condition is absent.</summary>
    Clear,
    /// <summary>The condition is present.</summary>
    Present,
    /// <summary>The test could not be made (a signal missing or bad, too little history).</summary>
    Unknown,
}

/// <summary>The outcome of a test, the source value, and whether a signal the test needs was missing or bad.</summary>
public readonly record struct ConditionReading(ConditionOutcome Outcome, double Value, bool SignalBad);
