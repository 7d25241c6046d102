using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// The dissolved-CO2 correction of the cycle (docs/methods.md §1.5): CER = CTR + (1/V_L) d(V_L C_TIC)/dt,
/// C_TIC = H_CO2(T) p_CO2 (1 + K1/[H+] + K1 K2/[H+]²) from the broth pH and temperature and the CO2
/// partial pressure over the broth, p_CO2 = y_CO2,dry (p - p_sat(T)) (Dalton's law, headspace
/// saturated with water at the broth temperature; p_sat from IAPWS-IF97). pK1 from Harned &amp; Davis
/// 1943 shifted by the medium (docs/methods.md §1.5: media read 0.1-0.25 lower), pK2 from Harned &amp;
/// Scholes 1941, H_CO2 from Sander's compilation (see <see cref="CarbonateEquilibrium"/>). C_TIC is
/// smoothed with a first-order filter before the finite difference, since pH noise of 0.01 moves it
/// by about 2 %; broth removed between two cycles takes its inorganic carbon with it and is not
/// counted as production. Applied only when configured and when pH, temperature and pressure are
/// usable this cycle; otherwise CER = CTR and the output says so.
/// </summary>
public static class CerCorrectionStep
{
    /// <summary>
    /// The corrected CER, or false (CER = CTR) when the correction is off, an input is missing or this
    /// is the first usable cycle (the filter starts). Updates <see cref="EstimatorState.TicMmolPerL"/>.
    /// </summary>
    /// <param name="inputs">The cycle's inputs (Ph, TemperatureC, PressureKPa).</param>
    /// <param name="ctrMmolPerLh">CO2 transfer rate of the gas balance.</param>
    /// <param name="outletCo2DryFraction">Dry outlet CO2 mole fraction of the gas balance.</param>
    /// <param name="volumeL">Liquid volume after this cycle's step, L.</param>
    /// <param name="removedL">Broth removed since the previous cycle, L.</param>
    /// <param name="dtH">Time since the previous cycle, h.</param>
    /// <param name="state">The estimator state (its VolumeL is still the previous cycle's).</param>
    /// <param name="settings">Mode, pK1 shift and filter time constant.</param>
    /// <param name="cerMmolPerLh">The corrected CER.</param>
    /// <param name="sigmaMmolPerLh">
    /// Standard uncertainty the correction adds (0 when not applied): pH noise u_pH moves the bicarbonate by
    /// ln(10) C_HCO3 u_pH; through the filter f += a (x - f), a = dt/(tau + dt), the difference of two
    /// filtered values has the standard deviation a σ_x sqrt(2/(2 - a)) for white noise of σ_x
    /// (first-order propagation, GUM JCGM 100:2008 5.1), divided by dt.
    /// </param>
    public static bool TryCorrect(AlignedInputs inputs, double ctrMmolPerLh, double outletCo2DryFraction, double volumeL, double removedL,
        double dtH, EstimatorState state, CycleSettings settings, out double cerMmolPerLh, out double sigmaMmolPerLh)
    {
        cerMmolPerLh = ctrMmolPerLh;
        sigmaMmolPerLh = 0;
        if (settings.CerCorrection != CerCorrection.DissolvedInorganicCarbon)
        {
            return false;
        }

        double tic = double.NaN, dissolved = double.NaN;
        if (VolumeTracker.Usable(inputs, SignalRole.Ph, out double ph) && VolumeTracker.Usable(inputs, SignalRole.TemperatureC, out double tC)
            && VolumeTracker.Usable(inputs, SignalRole.PressureKPa, out double pKPa) && double.IsFinite(outletCo2DryFraction))
        {
            double pSat = WaterVapour.SaturationPressureKPa(tC + ReferenceConditions.ZeroCelsiusK);
            double pCo2 = outletCo2DryFraction * Math.Max(pKPa - pSat, 0.0);
            tic = CarbonateEquilibrium.TotalInorganicCarbonMmolPerL(ph, tC, pCo2, settings.Pk1MediumShift);
            dissolved = CarbonateEquilibrium.HenryMolPerM3Pa(tC + ReferenceConditions.ZeroCelsiusK) * pCo2 * 1000.0; // mol/m³ = mmol/L
        }

        double previous = state.TicMmolPerL;
        if (!double.IsFinite(tic))
        {
            state.TicMmolPerL = double.NaN;
            return false;
        }

        if (!double.IsFinite(previous) || !(dtH > 0) || !double.IsFinite(ctrMmolPerLh))
        {
            state.TicMmolPerL = tic;
            return false;
        }

        // First-order filter, f += dt/(tau + dt) (x - f) (a stable discretisation for any step).
        double a = dtH / (settings.TicFilterTimeConstantH + dtH);
        double filtered = previous + (a * (tic - previous));
        state.TicMmolPerL = filtered;
        double kept = Math.Max(state.VolumeL - removedL, 0.0);
        cerMmolPerLh = DissolvedCarbonDioxide.CorrectedCerMmolPerLh(ctrMmolPerLh, previous, kept, filtered, volumeL, dtH);
        if (!double.IsFinite(cerMmolPerLh))
        {
            cerMmolPerLh = ctrMmolPerLh;
            return false;
        }

        double sigmaTic = Math.Log(10) * Math.Max(tic - dissolved, 0.0) * settings.PhSigma;
        sigmaMmolPerLh = a * sigmaTic * Math.Sqrt(2.0 / (2.0 - a)) / dtH;
        return true;
    }
}
