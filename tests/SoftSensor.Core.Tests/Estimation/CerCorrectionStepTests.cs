using SoftSensor.Core.Estimation;
using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Estimation;

/// <summary>
/// The cycle's dissolved-CO2 correction against docs/methods.md §1.5, CER = CTR + (1/V) d(V C_TIC)/dt with
/// C_TIC = H_CO2(T) p_CO2 (1 + K1/[H+] + K1 K2/[H+]²), computed here from the published constants:
/// pK1 = 3404.71/T - 14.8435 + 0.032786 T (Harned &amp; Davis 1943, J. Am. Chem. Soc. 65), pK2 =
/// 2902.39/T - 6.4980 + 0.02379 T (Harned &amp; Scholes 1941, J. Am. Chem. Soc. 63; from memory, see
/// CarbonateEquilibriumTests), H_CO2 = 3.3e-4 mol/(m³·Pa) at 298.15 K with d ln H/d(1/T) = 2400 K
/// (Sander's compilation), p_CO2 = y_CO2,dry (p - p_sat(T)) (Dalton's law) with p_sat(37 °C) =
/// 6281.9 Pa (IAPWS-IF97, docs/methods.md §1.3). Inputs are invented values of a culture at 37 °C.
/// </summary>
public class CerCorrectionStepTests
{
    private const double TemperatureC = 37.0;
    private const double PressureKPa = 150.0;
    private const double Co2Dry = 0.03;
    private const double Ctr = 40.0;

    private static readonly CycleSettings On = new()
    {
        CerCorrection = CerCorrection.DissolvedInorganicCarbon,
        Pk1MediumShift = -0.15,
        TicFilterTimeConstantH = 1e-9, // no smoothing: the raw finite difference
    };

    [Fact]
    public void Rising_pH_adds_the_bicarbonate_the_broth_takes_up()
    {
        var state = new EstimatorState(8) { VolumeL = 10 };
        Assert.False(Step(6.8, 10, 0, 0.1, state, On, out double first)); // the first usable cycle starts the filter
        Assert.Equal(Ctr, first);
        Assert.True(Step(6.9, 10, 0, 0.1, state, On, out double cer));

        double expected = Ctr + ((Tic(6.9) - Tic(6.8)) / 0.1);
        // Tolerance: p_sat(37 °C) is quoted to five digits, 1e-5 of the correction.
        Assert.Equal(expected, cer, 1e-5 * (expected - Ctr));
        Assert.True(cer - Ctr > 5, $"pH 6.8 -> 6.9 in 6 min at 4.4 kPa CO2 should add several mmol/(L h); got {cer - Ctr}");
    }

    [Fact]
    public void Dilution_by_feed_counts_the_inorganic_carbon_the_new_volume_holds()
    {
        // Constant C, volume 10 -> 10.5 L in 0.1 h: (1/V_mean) C dV/dt.
        var state = new EstimatorState(8) { VolumeL = 10 };
        Step(6.9, 10, 0, 0.1, state, On, out _);
        Assert.True(Step(6.9, 10.5, 0, 0.1, state, On, out double cer));
        double correction = Tic(6.9) * 0.5 / 0.1 / 10.25;
        Assert.Equal(Ctr + correction, cer, 1e-5 * correction);
    }

    [Fact]
    public void Broth_removed_takes_its_inorganic_carbon_and_is_not_production()
    {
        var state = new EstimatorState(8) { VolumeL = 10 };
        Step(6.9, 10, 0, 0.1, state, On, out _);
        state.VolumeL = 10;
        Assert.True(Step(6.9, 9.5, 0.5, 0.1, state, On, out double cer));
        Assert.Equal(Ctr, cer, 1e-9 * Ctr);
    }

    [Fact]
    public void Off_or_without_pH_the_CER_is_the_CTR()
    {
        var state = new EstimatorState(8) { VolumeL = 10 };
        Assert.False(Step(6.9, 10, 0, 0.1, state, new CycleSettings(), out double off));
        Assert.Equal(Ctr, off);
        Assert.False(Step(double.NaN, 10, 0, 0.1, state, On, out double noPh));
        Assert.Equal(Ctr, noPh);
        Assert.True(double.IsNaN(state.TicMmolPerL));
    }

    [Fact]
    public void Filter_smooths_pH_noise_before_the_derivative()
    {
        // pH alternating ±0.01 around 6.9 (an electrode's noise): with a 6 min filter the correction stays
        // within a few percent of CTR, while the raw difference swings by about ten times more.
        var smooth = On with { TicFilterTimeConstantH = 0.1 };
        var a = new EstimatorState(8) { VolumeL = 10 };
        var b = new EstimatorState(8) { VolumeL = 10 };
        double worstSmooth = 0, worstRaw = 0;
        for (int i = 0; i < 200; i++)
        {
            double ph = 6.9 + (i % 2 == 0 ? 0.01 : -0.01);
            if (Step(ph, 10, 0, 10.0 / 3600, a, smooth, out double s) && i > 100)
            {
                worstSmooth = Math.Max(worstSmooth, Math.Abs(s - Ctr));
            }

            if (Step(ph, 10, 0, 10.0 / 3600, b, On, out double r))
            {
                worstRaw = Math.Max(worstRaw, Math.Abs(r - Ctr));
            }
        }

        Assert.True(worstSmooth < 0.05 * Ctr, $"smoothed correction {worstSmooth}");
        Assert.True(worstRaw > 10 * worstSmooth, $"raw {worstRaw} vs smoothed {worstSmooth}");
    }

    private static bool Step(double ph, double volumeL, double removedL, double dtH, EstimatorState state, CycleSettings settings, out double cer)
    {
        var t = new DateTimeOffset(2026, 3, 2, 6, 0, 0, TimeSpan.Zero);
        var inputs = new AlignedInputs { Time = t };
        if (double.IsFinite(ph))
        {
            inputs.Set(SignalRole.Ph, ph, SampleQuality.Good, t);
        }

        inputs.Set(SignalRole.TemperatureC, TemperatureC, SampleQuality.Good, t);
        inputs.Set(SignalRole.PressureKPa, PressureKPa, SampleQuality.Good, t);
        bool ok = CerCorrectionStep.TryCorrect(inputs, Ctr, Co2Dry, volumeL, removedL, dtH, state, settings, out cer, out _);
        state.VolumeL = volumeL;
        return ok;
    }

    // C_TIC in mmol/L from the published constants (class summary), pK1 shifted by -0.15 for the medium.
    private static double Tic(double ph)
    {
        const double t = 310.15;
        double pk1 = (3404.71 / t) - 14.8435 + (0.032786 * t) - 0.15;
        double pk2 = (2902.39 / t) - 6.4980 + (0.02379 * t);
        double henry = 3.3e-4 * Math.Exp(2400 * ((1 / t) - (1 / 298.15)));
        double pCo2Pa = Co2Dry * ((PressureKPa * 1000) - 6281.9);
        return henry * pCo2Pa * (1 + Math.Pow(10, ph - pk1) + Math.Pow(10, (2 * ph) - pk1 - pk2));
    }
}
