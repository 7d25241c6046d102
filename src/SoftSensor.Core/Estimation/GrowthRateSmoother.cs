namespace SoftSensor.Core.Estimation;

/// <summary>
/// mu raw and smoothed (docs/methods.md §4: report both). Raw mu = r_X / X; the smoothed value is
/// a first-order low-pass filter with a time constant, exact for irregular steps
/// (alpha = 1 - exp(-dt / tau); common practice).
/// </summary>
public static class GrowthRateSmoother
{
    /// <summary>Raw specific growth rate, 1/h (NaN when X is not positive or the rate unknown).</summary>
    public static double RawMuPerH(double growthGPerLh, double biomassGPerL) =>
        biomassGPerL > 0 && double.IsFinite(growthGPerLh) ? growthGPerLh / biomassGPerL : double.NaN;

    /// <summary>The filtered value after a step of <paramref name="dtH"/> towards <paramref name="raw"/>; holds when raw is NaN.</summary>
    public static double Smooth(double previous, double raw, double dtH, double timeConstantH)
    {
        if (!double.IsFinite(raw))
        {
            return previous;
        }

        if (!double.IsFinite(previous))
        {
            return raw;
        }

        double alpha = 1.0 - Math.Exp(-Math.Max(dtH, 0.0) / timeConstantH);
        return previous + (alpha * (raw - previous));
    }
}
