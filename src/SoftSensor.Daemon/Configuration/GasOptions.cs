namespace SoftSensor.Daemon.Configuration;

/// <summary>Gas balance settings of one reactor (docs/methods.md §1).</summary>
internal sealed class GasOptions
{
    /// <summary>Reference temperature of the mass flow controllers, K (vendor-specific: 273.15, 288.15, 293.15 ...).</summary>
    public double MfcReferenceTemperatureK { get; set; } = 273.15;

    /// <summary>Reference pressure of the mass flow controllers, kPa (101.325 or 100).</summary>
    public double MfcReferencePressureKPa { get; set; } = 101.325;

    /// <summary>Analyser basis: <c>dry</c> (after a dryer) or <c>wet</c> (saturated at the analyser-cell temperature tag).</summary>
    public AnalyserBasisKind AnalyserBasis { get; set; } = AnalyserBasisKind.Dry;

    /// <summary>Absolute pressure of the analyser cell for the wet basis, kPa; leave out to use the vessel pressure tag.</summary>
    public double AnalyserPressureKPa { get; set; } = double.NaN;

    /// <summary>
    /// Where the inlet composition comes from: <c>lines</c> (the flow-weighted mix of the mapped gas
    /// lines, air at U.S. Standard Atmosphere 1976 O2 with <see cref="AirCo2Percent"/>), <c>fixed</c>
    /// (<see cref="InletO2Percent"/>, <see cref="InletCo2Percent"/>), or <c>measured</c> (the
    /// InletO2Percent and InletCo2Percent tags).
    /// </summary>
    public InletSetting Inlet { get; set; } = InletSetting.Lines;

    /// <summary>CO2 of the air line, % by volume (about 0.042, NOAA global mean 2024, from memory).</summary>
    public double AirCo2Percent { get; set; } = 0.042;

    /// <summary>Fixed inlet O2, % by volume (inlet = fixed).</summary>
    public double InletO2Percent { get; set; } = 20.9476;

    /// <summary>Fixed inlet CO2, % by volume (inlet = fixed).</summary>
    public double InletCo2Percent { get; set; } = 0.042;

    /// <summary>Liquid volume, L, used when no volume tag is mapped; leave out to require the tag.</summary>
    public double LiquidVolumeL { get; set; } = double.NaN;

    /// <summary>Below this total inlet flow the balance is meaningless (Bad), NL/min.</summary>
    public double MinAerationNlPerMin { get; set; } = 0.05;

    /// <summary>Analyser accuracy for O2, %-abs (standard uncertainty; 0 when not stated).</summary>
    public double O2AccuracyPercentAbs { get; set; }

    /// <summary>Analyser accuracy for CO2, %-abs.</summary>
    public double Co2AccuracyPercentAbs { get; set; }

    /// <summary>Mass flow controller accuracy, % of reading.</summary>
    public double FlowAccuracyPercentOfReading { get; set; }
}

/// <summary>The analyser's basis (section <c>gas:analyserBasis</c>).</summary>
internal enum AnalyserBasisKind
{
    /// <summary>After a dryer: the analyser reads dry gas.</summary>
    Dry,

    /// <summary>Saturated with water at the analyser-cell temperature tag.</summary>
    Wet,
}

/// <summary>Where the inlet composition comes from (section <c>gas:inlet</c>).</summary>
internal enum InletSetting
{
    /// <summary>The flow-weighted mix of the mapped gas lines.</summary>
    Lines,

    /// <summary>A constant measured composition (gas:inletO2Percent, gas:inletCo2Percent: the analyser's reading of the inlet air).</summary>
    Fixed,

    /// <summary>The InletO2Percent and InletCo2Percent tags.</summary>
    Measured,
}
