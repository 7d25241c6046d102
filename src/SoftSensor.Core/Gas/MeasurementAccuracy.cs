namespace SoftSensor.Core.Gas;

/// <summary>
/// Standard uncertainties of the raw measurements, as instrument data sheets state them: the
/// analyser in percentage points of mole fraction ("%-abs"), the mass flow controllers in % of
/// reading. They are treated as independent standard uncertainties (one sigma) of every reading;
/// a measured inlet reference reading carries the analyser's uncertainty independently of the
/// outlet reading (conservative: a shared offset of the same analyser would partly cancel).
/// </summary>
/// <param name="O2PercentAbs">O2 reading, %-abs (e.g. 0.02 for ±0.02 % O2).</param>
/// <param name="Co2PercentAbs">CO2 reading, %-abs.</param>
/// <param name="FlowPercentOfReading">Every gas-line flow, % of its reading.</param>
public readonly record struct MeasurementAccuracy(double O2PercentAbs, double Co2PercentAbs, double FlowPercentOfReading)
{
    /// <summary>No uncertainty stated: sigmas come out 0.</summary>
    public static MeasurementAccuracy None { get; } = new(0, 0, 0);

    /// <summary>True when at least one accuracy is stated (positive).</summary>
    public bool IsStated => O2PercentAbs > 0 || Co2PercentAbs > 0 || FlowPercentOfReading > 0;

    /// <summary>True when every accuracy is finite and not negative.</summary>
    public bool IsValid => Ok(O2PercentAbs) && Ok(Co2PercentAbs) && Ok(FlowPercentOfReading);

    private static bool Ok(double v) => double.IsFinite(v) && v >= 0;
}
