using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Gas;

public class AlignedGasBalanceTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 2, 8, 0, 0, TimeSpan.Zero);

    private static AlignedInputs HandCase()
    {
        // The hand-worked case of docs/methods.md §6 as a cycle's inputs, in the roles' units (%).
        var a = new AlignedInputs { Time = T0 };
        a.Set(SignalRole.AirFlowNlPerMin, 10.0, SampleQuality.Good, T0);
        a.Set(SignalRole.InletO2Percent, 20.946, SampleQuality.Good, T0);
        a.Set(SignalRole.InletCo2Percent, 0.042, SampleQuality.Good, T0);
        a.Set(SignalRole.OutletO2Percent, 19.5, SampleQuality.Good, T0);
        a.Set(SignalRole.OutletCo2Percent, 1.5, SampleQuality.Good, T0);
        a.Set(SignalRole.LiquidVolumeL, 10.0, SampleQuality.Good, T0);
        return a;
    }

    private static readonly AlignedGasBalanceSettings Measured =
        AlignedGasBalanceSettings.Default with { Inlet = InletSource.Measured };

    [Fact]
    public void Compute_aligned_hand_case_matches_direct_balance()
    {
        var r = GasBalance.Compute(HandCase(), Measured);
        Assert.Equal(38.629, r.OurMmolPerLh, 0.0005);
        Assert.Equal(39.035, r.CerMmolPerLh, 0.0005);
        Assert.Equal(SampleQuality.Good, r.Quality);
    }

    [Fact]
    public void Compute_aligned_missing_outlet_is_bad_input_missing()
    {
        var a = HandCase();
        a.Remove(SignalRole.OutletO2Percent);
        var r = GasBalance.Compute(a, Measured);
        Assert.True(r.Flags.HasFlag(GasBalanceFlags.InputMissing));
        Assert.Equal(SampleQuality.Bad, r.Quality);
        Assert.True(double.IsNaN(r.OurMmolPerLh));
    }

    [Fact]
    public void Compute_aligned_stale_uncertain_and_calibrating_inputs_are_flagged()
    {
        var a = HandCase();
        a.Set(SignalRole.OutletCo2Percent, 1.5, SampleQuality.Uncertain, T0 - TimeSpan.FromMinutes(5));
        a.Set(SignalRole.AnalyserCalibrating, 1, SampleQuality.Good, T0);
        var r = GasBalance.Compute(a, Measured);
        Assert.Equal(GasBalanceFlags.InputStale | GasBalanceFlags.InputUncertain | GasBalanceFlags.AnalyserCalibrating, r.Flags);
        Assert.Equal(SampleQuality.Bad, r.Quality);
    }

    [Fact]
    public void Compute_aligned_saturated_basis_uses_analyser_temperature_and_head_pressure()
    {
        double w = WaterVapour.SaturationPressureKPa(303.15) / 101.325;
        var a = HandCase();
        a.Set(SignalRole.OutletO2Percent, 19.5 * (1 - w), SampleQuality.Good, T0);
        a.Set(SignalRole.OutletCo2Percent, 1.5 * (1 - w), SampleQuality.Good, T0);
        a.Set(SignalRole.AnalyserTemperatureC, 30.0, SampleQuality.Good, T0);
        a.Set(SignalRole.PressureKPa, 101.325, SampleQuality.Good, T0);
        var r = GasBalance.Compute(a, Measured with { AnalyserBasis = AnalyserBasis.Saturated });
        Assert.Equal(38.629, r.OurMmolPerLh, 0.0005);
    }

    [Fact]
    public void Compute_aligned_gas_line_mix_uses_configured_air_CO2()
    {
        // Air line at 20.9476 % O2 (U.S. Standard Atmosphere 1976) and 0.042 % CO2; the Inlet* roles are ignored.
        var r = GasBalance.Compute(HandCase(), AlignedGasBalanceSettings.Default);
        Assert.Equal(0.209476, r.InletO2Fraction, 15);
        Assert.Equal(0.00042, r.InletCo2Fraction, 15);
        Assert.Equal(38.682, r.OurMmolPerLh, 0.0005);
    }

    [Fact]
    public void Constructor_with_inlet_composition_keeps_source_and_air_CO2()
    {
        var lines = new AlignedGasBalanceSettings(GasBalanceSettings.Default, InstalledGasLines.Air, InletComposition.FromGasLines(0.0005), AnalyserBasis.Dry, double.NaN, TimeSpan.FromSeconds(60));
        var measured = new AlignedGasBalanceSettings(GasBalanceSettings.Default, InstalledGasLines.Air, InletComposition.Measured(double.NaN, double.NaN), AnalyserBasis.Dry, double.NaN, TimeSpan.FromSeconds(60));
        Assert.Equal((InletSource.GasLines, 0.0005), (lines.Inlet, lines.AirCo2Fraction));
        Assert.Equal(InletSource.Measured, measured.Inlet);
        Assert.Equal(38.629, GasBalance.Compute(HandCase(), measured).OurMmolPerLh, 0.0005);
    }

    [Fact]
    public void Compute_aligned_installed_line_missing_is_flagged()
    {
        var r = GasBalance.Compute(HandCase(), Measured with { Lines = InstalledGasLines.Air | InstalledGasLines.Oxygen });
        Assert.True(r.Flags.HasFlag(GasBalanceFlags.InputMissing));
    }
}
