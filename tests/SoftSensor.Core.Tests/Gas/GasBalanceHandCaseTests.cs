using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Gas;

public class GasBalanceHandCaseTests
{
    // docs/methods.md §6, "an off-gas case worked by hand" (inert balance, recomputed twice
    // independently), with the equations of docs/methods.md §1.1 and 1.3:
    //   V_m   = R T / p = 8.314462618 * 273.15 / 101.325       = 22.413 970 L/mol (CODATA 2018)
    //   n_in  = 10.0 NL/min * 60 / 22.413 970                  = 26.769 020 mol/h
    //   inert in  = 1 - 0.20946 - 0.00042                      = 0.790 12
    //   inert out = 1 - 0.19500 - 0.01500                      = 0.790 00
    //   n_out = 26.769 020 * 0.790 12 / 0.790 00               = 26.773 086 mol/h
    //   O2:  26.769 020 * 0.20946 - 26.773 086 * 0.195         = 5.607 039 - 5.220 752 = 0.386 287 mol/h
    //   CO2: 26.773 086 * 0.015   - 26.769 020 * 0.00042       = 0.401 596 - 0.011 243 = 0.390 353 mol/h
    //   OTR = 0.386 287 / 10 L = 38.629 mmol/(L h);  CTR = 39.035 mmol/(L h);  RQ = 39.035 / 38.629 = 1.0105
    //   outlet flow = 26.773 086 * 22.413 970 / 60             = 10.001 519 NL/min
    private static readonly InletComposition Inlet = InletComposition.Measured(0.20946, 0.00042);
    private static readonly GasLineFlows Air10 = GasLineFlows.AirOnly(10.0);

    [Fact]
    public void Compute_hand_worked_case_gives_published_OTR_CTR_RQ()
    {
        var r = GasBalance.Compute(Air10, Inlet, AnalyserReading.Dry(0.195, 0.015), 10.0, GasBalanceSettings.Default);

        Assert.Equal(38.629, r.OurMmolPerLh, 0.0005);
        Assert.Equal(39.035, r.CerMmolPerLh, 0.0005);
        Assert.Equal(1.0105, r.Rq, 0.00005);
        Assert.Equal(10.001519, r.OutletFlowNlPerMin, 0.000001);
        Assert.Equal(10.0, r.InletFlowNlPerMin, 12);
        Assert.Equal(GasBalanceFlags.None, r.Flags);
        Assert.Equal(SampleQuality.Good, r.Quality);
    }

    [Fact]
    public void Compute_saturated_outlet_read_as_dry_differs_and_saturated_basis_recovers_dry_answer()
    {
        // The same off-gas, saturated with water in a 30 °C analyser cell at 101.325 kPa:
        // y_H2O = p_sat(303.15 K) / p = 4.2467 kPa / 101.325 kPa = 0.041911 (IAPWS-IF97 region 4),
        // so the analyser reads y_wet = y_dry (1 - y_H2O) (docs/methods.md §1.3).
        double w = WaterVapour.SaturationPressureKPa(303.15) / 101.325;
        Assert.Equal(0.041911, w, 0.000001);
        double o2Wet = 0.195 * (1 - w);
        double co2Wet = 0.015 * (1 - w);

        var readAsDry = GasBalance.Compute(Air10, Inlet, AnalyserReading.Dry(o2Wet, co2Wet), 10.0, GasBalanceSettings.Default);
        var saturated = GasBalance.Compute(Air10, Inlet, AnalyserReading.Saturated(o2Wet, co2Wet, 30.0, 101.325), 10.0, GasBalanceSettings.Default);
        var humidity = GasBalance.Compute(Air10, Inlet, AnalyserReading.WithHumidity(o2Wet, co2Wet, w), 10.0, GasBalanceSettings.Default);

        // Read as dry, the water dilutes O2 and the "uptake" comes out 1.7 times too high. By hand:
        //   y_wet = 0.195 * 0.958088 = 0.186827 and 0.015 * 0.958088 = 0.014371; inert out = 0.798801
        //   n_out = 26.769020 * 0.79012 / 0.798801 = 26.478093 mol/h
        //   OTR = (5.607039 - 26.478093 * 0.186827) / 10 L = 66.021 mmol/(L h)
        Assert.Equal(66.021, readAsDry.OurMmolPerLh, 0.0005);
        Assert.Equal(38.629, saturated.OurMmolPerLh, 0.0005);
        Assert.Equal(39.035, saturated.CerMmolPerLh, 0.0005);
        Assert.Equal(1.0105, saturated.Rq, 0.00005);
        Assert.Equal(w, saturated.OutletWaterFraction, 15);
        Assert.Equal(saturated.OurMmolPerLh, humidity.OurMmolPerLh, 12);
    }

    [Fact]
    public void Compute_air_line_mix_uses_US_Standard_Atmosphere_O2()
    {
        // Inlet mixed from an air line: O2 0.209476 (U.S. Standard Atmosphere 1976), CO2 as configured.
        var r = GasBalance.Compute(Air10, InletComposition.FromGasLines(0.00042), AnalyserReading.Dry(0.195, 0.015), 10.0, GasBalanceSettings.Default);
        Assert.Equal(0.209476, r.InletO2Fraction, 15);
        Assert.Equal(0.00042, r.InletCo2Fraction, 15);

        // Hand check as above with 0.209476: inert in 0.790104; n_out = 26.769020 * 0.790104 / 0.79 = 26.772544;
        // OTR = (26.769020 * 0.209476 - 26.772544 * 0.195) / 10 L = (5.607467 - 5.220646) / 10 = 38.682 mmol/(L h).
        Assert.Equal(38.682, r.OurMmolPerLh, 0.0005);
    }

    [Fact]
    public void Compute_oxygen_enriched_mix_weights_lines_by_flow()
    {
        // 8 NL/min air + 2 NL/min O2: yO2_in = (8 * 0.209476 + 2) / 10 = 0.3675808; yCO2_in = 8 * 0.00042 / 10 = 0.000336.
        var flows = new GasLineFlows(8.0, 2.0, 0, 0);
        var r = GasBalance.Compute(flows, InletComposition.FromGasLines(0.00042), AnalyserReading.Dry(0.35, 0.015), 10.0, GasBalanceSettings.Default);
        Assert.Equal(0.3675808, r.InletO2Fraction, 12);
        Assert.Equal(0.000336, r.InletCo2Fraction, 12);
        Assert.Equal(SampleQuality.Good, r.Quality);
    }
}
