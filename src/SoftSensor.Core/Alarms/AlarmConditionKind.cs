namespace SoftSensor.Core.Alarms;

/// <summary>What an alarm rule tests on its source signal.</summary>
public enum AlarmConditionKind
{
    /// <summary>Value above <c>Limit</c>.</summary>
    High,
    /// <summary>Value above <c>Limit</c>; the second, more severe high limit.</summary>
    HighHigh,
    /// <summary>Value below <c>Limit</c>.</summary>
    Low,
    /// <summary>Value below <c>Limit</c>; the second, more severe low limit.</summary>
    LowLow,
    /// <summary>Value outside [<c>Low</c>, <c>High</c>] (e.g. an RQ window).</summary>
    Window,
    /// <summary>Rate of change over <c>RateWindow</c> larger than <c>Limit</c> (source unit per hour).</summary>
    RateOfChange,
    /// <summary>|value − setpoint| above <c>Limit</c>; the setpoint is <c>Setpoint</c> or the <c>Reference</c> signal.</summary>
    Deviation,
    /// <summary>Value above the <c>Reference</c> signal by more than its margin (feed above the advisory, the cap, the overflow limit).</summary>
    AboveReference,
    /// <summary>The source is missing or its quality is bad (or uncertain, when <c>IncludeUncertain</c>).</summary>
    BadQuality,
    /// <summary>The consistency statistic (source, default <c>h</c>) above its critical value (reference, default <c>h_critical</c>).</summary>
    Inconsistent,
    /// <summary>The source changed by less than <c>Limit</c> for at least <c>RateWindow</c> (a flat-lined analyser).</summary>
    FlatLine,
}

/// <summary>Helpers on <see cref="AlarmConditionKind"/>.</summary>
public static class AlarmConditionKinds
{
    /// <summary>True for kinds that watch the quality of data rather than the process.</summary>
    public static bool IsDataQuality(AlarmConditionKind kind) =>
        kind is AlarmConditionKind.BadQuality or AlarmConditionKind.Inconsistent or AlarmConditionKind.FlatLine;
}
