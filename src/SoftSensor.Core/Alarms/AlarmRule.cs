namespace SoftSensor.Core.Alarms;

/// <summary>Which way a rate-of-change rule looks.</summary>
public enum RateDirection
{
    Either,
    Rising,
    Falling,
}

/// <summary>
/// One alarm rule from configuration. Values are in the source signal's unit; rates in that unit
/// per hour. Check a rule with <see cref="AlarmRuleValidation.Validate"/> before use.
/// </summary>
public sealed record AlarmRule
{
    /// <summary>Stable id: lowercase letters, digits, '_', '-' and '.'; used in topics and the journal.</summary>
    public required string Id { get; init; }

    /// <summary>What the operator reads, e.g. "Off-gas O2 above 23.5 % (oxygen-enriched)".</summary>
    public string Message { get; init; } = "";

    /// <summary>Grouping shown with the alarm: process, feed, quality, safety.</summary>
    public string Category { get; init; } = "process";

    /// <summary>The test made on the source.</summary>
    public required AlarmConditionKind Kind { get; init; }

    /// <summary>The signal watched.</summary>
    public required SignalRef Source { get; init; }

    /// <summary>The second signal: the setpoint of a deviation, the limit of an above-reference rule, the critical value of a consistency rule.</summary>
    public SignalRef? Reference { get; init; }

    /// <summary>Threshold of High/HighHigh/Low/LowLow; the allowed deviation; the largest rate (per hour); the smallest change of a flat-line rule.</summary>
    public double Limit { get; init; } = double.NaN;

    /// <summary>Lower edge of a window.</summary>
    public double Low { get; init; } = double.NaN;

    /// <summary>Upper edge of a window.</summary>
    public double High { get; init; } = double.NaN;

    /// <summary>Fixed setpoint of a deviation rule (used when <see cref="Reference"/> is absent).</summary>
    public double Setpoint { get; init; } = double.NaN;

    /// <summary>Above-reference margin as a fraction of the reference (0.1 = 10 %).</summary>
    public double MarginFraction { get; init; }

    /// <summary>Above-reference margin in the source unit, added to the fractional one.</summary>
    public double MarginAbsolute { get; init; }

    /// <summary>Hysteresis: the value must come back past the threshold by this much before the condition clears.</summary>
    public double Deadband { get; init; }

    /// <summary>The condition must hold this long before the alarm activates.</summary>
    public TimeSpan OnDelay { get; init; }

    /// <summary>The condition must be gone this long before the alarm returns to normal.</summary>
    public TimeSpan OffDelay { get; init; }

    /// <summary>Span over which a rate of change is measured, or for which a flat line must last.</summary>
    public TimeSpan RateWindow { get; init; }

    /// <summary>Direction of a rate-of-change rule.</summary>
    public RateDirection Direction { get; init; } = RateDirection.Either;

    /// <summary>A bad-quality rule also fires on uncertain readings.</summary>
    public bool IncludeUncertain { get; init; }

    /// <summary>When set, the rule only tests while this signal is above <see cref="GateAbove"/> (e.g. DO low while feeding).</summary>
    public SignalRef? Gate { get; init; }

    /// <summary>Threshold of the gate.</summary>
    public double GateAbove { get; init; }

    /// <summary>Priority of the alarm.</summary>
    public AlarmPriority Priority { get; init; } = AlarmPriority.Medium;

    /// <summary>
    /// Suppressed by design while the source (or reference, or gate) is missing or bad. Default:
    /// on for process rules on estimates, off for data-quality rules and for rules on inputs and
    /// tags (a safety limit on a failed sensor holds its state; a quality rule reports the sensor).
    /// </summary>
    public bool? SuppressWhenBad { get; init; }

    /// <summary>The effective suppression setting.</summary>
    public bool SuppressesWhenBad => SuppressWhenBad
        ?? (!AlarmConditionKinds.IsDataQuality(Kind) && Source.Origin == SignalOrigin.Estimate);
}
