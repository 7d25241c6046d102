namespace SoftSensor.Core.Gas;

/// <summary>Which CER the caller reports (the output says which one was used, docs/methods.md §1.5).</summary>
public enum CerCorrection
{
    /// <summary>CER = CTR: the CO2 transfer rate to the gas (steady pH and CO2 partial pressure).</summary>
    None = 0,

    /// <summary>CER = CTR + (1/V) d(V C_TIC)/dt: the CO2 that stays in the broth as dissolved CO2 and bicarbonate counted.</summary>
    DissolvedInorganicCarbon = 1,
}

/// <summary>
/// The dissolved-CO2 correction of CER (docs/methods.md §1.5): CER = CTR + (1/V_L) d(V_L C_TIC)/dt, by a
/// finite difference between two cycles, with C_TIC from <see cref="CarbonateEquilibrium"/>.
/// </summary>
public static class DissolvedCarbonDioxide
{
    /// <summary>
    /// CER in mmol/(L·h) from the CTR and the total inorganic carbon (mmol/L) and volume (L) at the
    /// previous and the current cycle, <paramref name="elapsedHours"/> apart; (1/V) uses the mean
    /// volume of the interval. NaN when the interval is not positive or an input is not finite.
    /// </summary>
    public static double CorrectedCerMmolPerLh(
        double ctrMmolPerLh, double previousTicMmolPerL, double previousVolumeL, double currentTicMmolPerL, double currentVolumeL, double elapsedHours)
    {
        double meanVolume = 0.5 * (previousVolumeL + currentVolumeL);
        if (!(elapsedHours > 0) || !(meanVolume > 0) || !double.IsFinite(elapsedHours))
        {
            return double.NaN;
        }

        double accumulation = ((currentVolumeL * currentTicMmolPerL) - (previousVolumeL * previousTicMmolPerL)) / elapsedHours;
        return ctrMmolPerLh + (accumulation / meanVolume);
    }
}
