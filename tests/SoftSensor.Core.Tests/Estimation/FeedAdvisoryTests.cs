using SoftSensor.Core.Estimation;

namespace SoftSensor.Core.Tests.Estimation;

public class FeedAdvisoryTests
{
    // Worked by hand from F = (mu_set / Y_XS + m_S) X V / c_S (docs/methods.md §4):
    // X = 20 g/L, V = 100 L, mu_set 0.15 1/h, Y_XS 0.5 g/g, m_S 0.02 g/(g·h), c_S 500 g/L
    // -> (0.3 + 0.02) × 2000 / 500 = 1.28 L/h.
    private static readonly EstimatorSettings Settings = new()
    {
        FeedSubstrateGPerL = 500,
        YieldXOGPerMmol = 0.035,
        MaintenanceOMmolPerGh = 0.4,
        Feed = new FeedAdvisorySettings
        {
            MuSetpointPerH = 0.15, YieldXSGPerG = 0.5, MaintenanceSGPerGh = 0.02, KlaPerH = 400,
            OxygenSaturationMmolPerL = 0.236, MinimumDissolvedOxygenFraction = 0.2, CriticalSubstrateUptakeGPerGh = 1.0,
        },
    };

    [Fact]
    public void Compute_below_every_cap_advises_the_setpoint_feed()
    {
        var a = FeedAdvisory.Compute(2000, 100, double.NaN, double.NaN, Settings);
        Assert.Equal(1.28, a.SetpointLPerH, 12);
        // OTR_max = 400 × 0.236 × 0.8 = 75.52 mmol/(L·h); mu_cap = (75.52 / 20 - 0.4) × 0.035 = 0.11816 1/h;
        // F_cap = (0.23632 + 0.02) × 2000 / 500 = 1.02528 L/h: the oxygen transfer is the limit.
        Assert.Equal(75.52, a.OxygenTransferCapacityMmolPerLh, 10);
        Assert.Equal(1.02528, a.OxygenCapLPerH, 10);
        Assert.Equal(4.0, a.OverflowCapLPerH, 12); // 1.0 g/(g·h) × 2000 g / 500 g/L
        Assert.Equal(FeedLimit.OxygenTransfer, a.Limit);
        Assert.Equal(a.OxygenCapLPerH, a.AdvisedLPerH);
    }

    [Fact]
    public void Compute_with_low_critical_uptake_is_limited_by_overflow()
    {
        var s = Settings with { Feed = Settings.Feed with { CriticalSubstrateUptakeGPerGh = 0.2, KlaPerH = 2000 } };
        var a = FeedAdvisory.Compute(2000, 100, double.NaN, double.NaN, s);
        Assert.Equal(FeedLimit.Overflow, a.Limit);
        Assert.Equal(0.8, a.AdvisedLPerH, 12);
    }

    [Fact]
    public void Compute_with_dissolved_oxygen_estimates_kla_from_our()
    {
        // kLa = OTR / (C* - C) (docs/methods.md §1.6): 50 / (0.236 × 0.6) = 353.1 1/h at DO 40 %.
        var a = FeedAdvisory.Compute(2000, 100, 50, 40, Settings);
        Assert.Equal(50 / (0.236 * 0.6), a.KlaPerH, 9);
        Assert.Equal(FeedLimit.None, FeedAdvisory.Compute(0, 100, 50, 40, Settings).Limit);
    }
}
