namespace SoftSensor.Daemon.Alarming;

/// <summary>
/// The JSON form of an alarm rule file (config/alarms/*.json): the project's own layout. Keys are
/// camelCase; durations in seconds; <c>source</c>, <c>reference</c> and <c>gate</c> are signal
/// references (<c>rq</c>, <c>input:OutletO2Percent</c>, <c>tag:PT-101</c>).
/// </summary>
internal sealed class AlarmRuleFileDocument
{
    /// <summary>Longest shelve an operator may ask for, hours.</summary>
    public double? MaxShelveHours { get; set; }

    /// <summary>The rules.</summary>
    public List<AlarmRuleDocument> Rules { get; set; } = [];
}

/// <summary>One rule as written in a rule file.</summary>
internal sealed class AlarmRuleDocument
{
    public string? Id { get; set; }

    public string? Kind { get; set; }

    public string? Source { get; set; }

    public string? Reference { get; set; }

    public string? Gate { get; set; }

    public double? GateAbove { get; set; }

    public double? Limit { get; set; }

    public double? Low { get; set; }

    public double? High { get; set; }

    public double? Setpoint { get; set; }

    public double? MarginFraction { get; set; }

    public double? MarginAbsolute { get; set; }

    public double? Deadband { get; set; }

    public double? OnDelaySeconds { get; set; }

    public double? OffDelaySeconds { get; set; }

    public double? WindowSeconds { get; set; }

    public string? Direction { get; set; }

    public bool? IncludeUncertain { get; set; }

    public bool? SuppressWhenBad { get; set; }

    public string? Priority { get; set; }

    public string? Category { get; set; }

    public string? Message { get; set; }

    /// <summary>Free text for the reader of the file (the source of a limit); not used by the daemon.</summary>
    public string? Note { get; set; }
}
