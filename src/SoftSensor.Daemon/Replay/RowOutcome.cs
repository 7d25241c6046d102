namespace SoftSensor.Daemon.Replay;

/// <summary>What became of one line of the history file.</summary>
internal enum RowOutcome
{
    /// <summary>A good row.</summary>
    Ok = 0,

    /// <summary>An empty line; ignored without counting.</summary>
    Blank,

    /// <summary>Fewer cells than the mapped columns need, or an empty mapped cell.</summary>
    MissingCell,

    /// <summary>A mapped cell that is not a number.</summary>
    NotANumber,

    /// <summary>A timestamp cell that is not a time of the configured format.</summary>
    BadTimestamp,

    /// <summary>A timestamp not later than the previous good row's.</summary>
    TimeNotIncreasing,
}
