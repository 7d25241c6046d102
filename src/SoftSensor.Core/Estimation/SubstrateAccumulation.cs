namespace SoftSensor.Core.Estimation;

/// <summary>
/// Residual substrate in the vessel (docs/methods.md §4): what was fed minus what the balance
/// says was consumed, less what left with removed broth.
/// </summary>
public static class SubstrateAccumulation
{
    /// <summary>
    /// New substrate mass in the vessel, g, after a step: feed (L/h × g/L) in, consumption
    /// (-r_S in C-mmol/(L·h) × V × g/C-mol) out. An unknown consumption counts as zero.
    /// </summary>
    public static double Advance(double substrateG, double removedFraction, double feedLPerH, double feedGPerL,
        double substrateRateCmmolPerLh, double volumeL, double substrateGPerCMol, double dtH)
    {
        double s = substrateG * (1.0 - removedFraction);
        if (dtH <= 0)
        {
            return s;
        }

        double fedGPerH = double.IsFinite(feedLPerH) && feedLPerH > 0 ? feedLPerH * feedGPerL : 0.0;
        double consumedGPerH = double.IsFinite(substrateRateCmmolPerLh)
            ? -substrateRateCmmolPerLh * volumeL * substrateGPerCMol / 1000.0
            : 0.0;
        return s + ((fedGPerH - consumedGPerH) * dtH);
    }
}
