using SoftSensor.Core.Estimation;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Replay;

/// <summary>
/// The replay configuration file (README section "replay"): how to read a historian export (column
/// to tag, role, unit, scale; timestamp format and time zone), the offline samples, the process
/// model and the estimator settings. Keys are camelCase in the file.
/// </summary>
internal sealed record ReplayConfig
{
    /// <summary>Reactor id written into every estimate.</summary>
    public string Reactor { get; init; } = "reactor";

    /// <summary>Batch id written into every estimate.</summary>
    public string BatchId { get; init; } = "batch";

    /// <summary>How the history CSV is laid out.</summary>
    public CsvLayout History { get; init; } = new();

    /// <summary>Offline samples (optional).</summary>
    public OfflineLayout? Offline { get; init; }

    /// <summary>Gas balance settings.</summary>
    public GasConfig Gas { get; init; } = new();

    /// <summary>Stoichiometric model file, relative to this configuration file.</summary>
    public string Model { get; init; } = string.Empty;

    /// <summary>Which rates besides OUR and CER enter the elemental balance.</summary>
    public BalanceConfig Balance { get; init; } = new();

    /// <summary>Estimator settings.</summary>
    public EstimatorSettings Estimator { get; init; } = new();

    /// <summary>Cycles written to the report's plots at most (the series are thinned evenly).</summary>
    public int ReportPoints { get; init; } = 2000;
}

/// <summary>Layout of a historian CSV export.</summary>
internal sealed record CsvLayout
{
    /// <summary>Field separator (one character).</summary>
    public string Delimiter { get; init; } = ",";

    /// <summary>The timestamp column.</summary>
    public TimestampSpec Timestamp { get; init; } = new();

    /// <summary>The mapped columns; other columns are ignored.</summary>
    public IReadOnlyList<ColumnMap> Columns { get; init; } = [];
}

/// <summary>The timestamp column: name, format and the time zone of times without an offset.</summary>
internal sealed record TimestampSpec
{
    /// <summary>Column header.</summary>
    public string Column { get; init; } = "timestamp";

    /// <summary><c>iso8601</c>, <c>unix-seconds</c>, <c>unix-milliseconds</c>, or a .NET custom date format such as <c>dd.MM.yyyy HH:mm:ss</c>.</summary>
    public string Format { get; init; } = "iso8601";

    /// <summary>IANA time zone of times that carry no offset, e.g. <c>UTC</c>, <c>Europe/Berlin</c>.</summary>
    public string TimeZone { get; init; } = "UTC";
}

/// <summary>One mapped column: role_value = unit_map(scale × cell + offset).</summary>
internal sealed record ColumnMap
{
    /// <summary>Column header in the CSV.</summary>
    public string Column { get; init; } = string.Empty;

    /// <summary>Plant tag name (defaults to the column header).</summary>
    public string? Tag { get; init; }

    /// <summary>Signal role (a name of <see cref="Core.Signals.SignalRole"/>).</summary>
    public string Role { get; init; } = string.Empty;

    /// <summary>The column's plant unit.</summary>
    public string Unit { get; init; } = string.Empty;

    /// <summary>Multiplier applied to the cell before the unit conversion.</summary>
    public double Scale { get; init; } = 1;

    /// <summary>Added after the scale, before the unit conversion.</summary>
    public double Offset { get; init; }
}

/// <summary>Offline sample file layout.</summary>
internal sealed record OfflineLayout
{
    /// <summary>Sample file, relative to the configuration file (the command line's --offline overrides it).</summary>
    public string? File { get; init; }

    /// <summary>Column of the sampling time (ISO 8601, UTC unless it carries an offset).</summary>
    public string TimeColumn { get; init; } = "time";

    /// <summary>Column of the dry cell weight, g/L.</summary>
    public string ValueColumn { get; init; } = "dcw_g_per_l";

    /// <summary>Column of the assay standard deviation, g/L (when absent, <see cref="DefaultSigmaGPerL"/>).</summary>
    public string? SigmaColumn { get; init; } = "sd_g_per_l";

    /// <summary>Column of the volume withdrawn, mL (optional).</summary>
    public string? VolumeMlColumn { get; init; } = "volume_ml";

    /// <summary>Assay standard deviation when the file has none, g/L.</summary>
    public double DefaultSigmaGPerL { get; init; } = 0.2;

    /// <summary>Time from sampling to the result reaching the estimator, minutes (the sample is then applied in the past).</summary>
    public double ReportDelayMinutes { get; init; } = 60;
}

/// <summary>Gas balance settings of the replay.</summary>
internal sealed record GasConfig
{
    /// <summary>Reference temperature of the mass flow controllers, °C, and pressure, kPa (docs/methods.md §1.1).</summary>
    public double ReferenceTemperatureC { get; init; }

    /// <inheritdoc cref="ReferenceTemperatureC"/>
    public double ReferencePressureKPa { get; init; } = 101.325;

    /// <summary>Analyser accuracy: O2 and CO2 in %-abs, flow in % of reading (standard uncertainties).</summary>
    public double O2AccuracyPercentAbs { get; init; } = 0.02;

    /// <inheritdoc cref="O2AccuracyPercentAbs"/>
    public double Co2AccuracyPercentAbs { get; init; } = 0.02;

    /// <inheritdoc cref="O2AccuracyPercentAbs"/>
    public double FlowAccuracyPercentOfReading { get; init; } = 1.0;

    /// <summary>CO2 in the inlet air when no inlet reading is mapped, mole fraction.</summary>
    public double AirCo2Fraction { get; init; } = 0.00042;

    /// <summary>Lowest aeration for a meaningful balance, NL/min.</summary>
    public double MinimumFlowNlPerMin { get; init; } = 0.5;

    /// <summary><c>measured</c>: inlet O2/CO2 from the analyser's reference stream (the InletO2Percent/InletCo2Percent roles); <c>gasLines</c>: mixed from the lines.</summary>
    public string Inlet { get; init; } = "gasLines";

    /// <summary>Largest age of an input at the cycle time, s.</summary>
    public double MaxInputAgeS { get; init; } = 120;
}
