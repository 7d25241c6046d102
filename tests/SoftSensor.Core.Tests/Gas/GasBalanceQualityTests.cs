using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Gas;

/// <summary>Data-quality findings are results, never exceptions (docs/methods.md §1.8).</summary>
public class GasBalanceQualityTests
{
    private static readonly InletComposition Air = InletComposition.FromGasLines();
    private static readonly AnalyserReading Outlet = AnalyserReading.Dry(0.195, 0.015);

    private static GasBalanceResult Run(GasLineFlows flows, InletComposition inlet, AnalyserReading outlet, double volume, GasBalanceSettings settings) =>
        GasBalance.Compute(flows, inlet, outlet, volume, settings);

    [Theory]
    [InlineData(1.2, 0.015)]
    [InlineData(-0.01, 0.015)]
    [InlineData(0.195, double.NaN)]
    [InlineData(0.6, 0.5)]
    public void Compute_fraction_out_of_range_is_bad_without_numbers(double o2, double co2)
    {
        var r = Run(GasLineFlows.AirOnly(10), Air, AnalyserReading.Dry(o2, co2), 10, GasBalanceSettings.Default);
        Assert.True(r.Flags.HasFlag(GasBalanceFlags.FractionOutOfRange));
        Assert.Equal(SampleQuality.Bad, r.Quality);
        Assert.True(double.IsNaN(r.OurMmolPerLh));
    }

    [Fact]
    public void Compute_negative_flow_is_bad()
    {
        var r = Run(new GasLineFlows(10, -0.1, 0, 0), Air, Outlet, 10, GasBalanceSettings.Default);
        Assert.Equal(GasBalanceFlags.FlowOutOfRange, r.Flags);
        Assert.Equal(SampleQuality.Bad, r.Quality);
    }

    [Fact]
    public void Compute_aeration_below_minimum_is_bad_but_still_computed()
    {
        var settings = GasBalanceSettings.Default with { MinAerationNlPerMin = 2.0 };
        var r = Run(GasLineFlows.AirOnly(1.0), Air, Outlet, 10, settings);
        Assert.Equal(GasBalanceFlags.AerationBelowMinimum, r.Flags);
        Assert.Equal(SampleQuality.Bad, r.Quality);
        Assert.True(double.IsFinite(r.OurMmolPerLh));
        Assert.Equal(["aeration-below-minimum"], r.Flags.ReasonIds());
    }

    [Fact]
    public void Compute_zero_aeration_is_bad_without_numbers()
    {
        var r = Run(GasLineFlows.AirOnly(0), Air, Outlet, 10, GasBalanceSettings.Default);
        Assert.Equal(GasBalanceFlags.AerationBelowMinimum, r.Flags);
        Assert.True(double.IsNaN(r.OurMmolPerLh));
    }

    [Fact]
    public void Compute_outlet_O2_above_inlet_gives_negative_OTR_and_undefined_RQ_as_uncertain()
    {
        var r = Run(GasLineFlows.AirOnly(10), Air, AnalyserReading.Dry(0.212, 0.0005), 10, GasBalanceSettings.Default);
        Assert.True(r.OurMmolPerLh < 0);
        Assert.Equal(GasBalanceFlags.NegativeOtr | GasBalanceFlags.RqUndefined, r.Flags);
        Assert.Equal(SampleQuality.Uncertain, r.Quality);
        Assert.Equal(["negative-otr", "rq-undefined"], r.Flags.ReasonIds());
    }

    [Fact]
    public void Compute_implausible_inert_change_is_bad()
    {
        // Outlet O2 0.10 and CO2 0.40: dry inert fraction 0.50 against 0.79 at the inlet (-37 %).
        var r = Run(GasLineFlows.AirOnly(10), Air, AnalyserReading.Dry(0.10, 0.40), 10, GasBalanceSettings.Default);
        Assert.True(r.Flags.HasFlag(GasBalanceFlags.InertFractionImplausible));
        Assert.Equal(SampleQuality.Bad, r.Quality);
    }

    [Fact]
    public void Compute_pure_oxygen_inlet_has_implausible_inert_fraction()
    {
        var r = Run(new GasLineFlows(0, 5, 0, 0), Air, AnalyserReading.Dry(0.9, 0.05), 10, GasBalanceSettings.Default);
        Assert.True(r.Flags.HasFlag(GasBalanceFlags.InertFractionImplausible));
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-3.0)]
    [InlineData(double.NaN)]
    public void Compute_volume_not_positive_is_bad(double volume)
    {
        var r = Run(GasLineFlows.AirOnly(10), Air, Outlet, volume, GasBalanceSettings.Default);
        Assert.Equal(GasBalanceFlags.VolumeOutOfRange, r.Flags);
    }

    [Fact]
    public void Compute_saturated_cell_above_critical_temperature_is_bad()
    {
        var r = Run(GasLineFlows.AirOnly(10), Air, AnalyserReading.Saturated(0.19, 0.015, 400, 101.325), 10, GasBalanceSettings.Default);
        Assert.Equal(GasBalanceFlags.ConditionsOutOfRange, r.Flags);
    }

    [Fact]
    public void Compute_saturated_cell_at_boiling_gives_water_fraction_out_of_range()
    {
        // p_sat(105 °C) = 120.8 kPa > 101.325 kPa: the sample cannot be saturated there.
        var r = Run(GasLineFlows.AirOnly(10), Air, AnalyserReading.Saturated(0.19, 0.015, 105, 101.325), 10, GasBalanceSettings.Default);
        Assert.Equal(GasBalanceFlags.FractionOutOfRange, r.Flags);
    }

    [Fact]
    public void ToQuality_of_no_flags_is_good()
    {
        Assert.Equal(SampleQuality.Good, GasBalanceFlags.None.ToQuality());
        Assert.Empty(GasBalanceFlags.None.ReasonIds());
    }
}
