using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Alarms;

/// <summary>The tests of each rule kind. Limits are demo values unless a source is named.</summary>
public class AlarmConditionTests
{
    [Fact]
    public void Evaluate_RateOfChangeOverWindow_FiresOnFastRiseOnly()
    {
        // OUR rising by more than 20 mmol/(L·h) per hour, measured over 5 minutes.
        var rule = new AlarmRule
        {
            Id = "our_rate", Kind = AlarmConditionKind.RateOfChange, Source = SignalRef.Estimate(EstimateNames.Our),
            Limit = 20, RateWindow = TimeSpan.FromMinutes(5), Direction = RateDirection.Rising,
        };
        var kit = new AlarmTestKit(rule);
        Assert.Equal(AlarmState.Normal, kit.Set(EstimateNames.Our, 50).Step(60));
        Assert.Equal(AlarmState.Normal, kit.Set(EstimateNames.Our, 51).Step(300));    // 12 per hour
        Assert.Equal(AlarmState.Normal, kit.Set(EstimateNames.Our, 40).Step(300));    // falling fast: ignored
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Our, 44).Step(300)); // +4 in 5 min = 48 per hour
    }

    [Fact]
    public void Evaluate_RateOfChangeFirstReading_IsUnknownAndHoldsNormal()
    {
        var rule = new AlarmRule
        {
            Id = "our_rate", Kind = AlarmConditionKind.RateOfChange, Source = SignalRef.Estimate(EstimateNames.Our),
            Limit = 20, RateWindow = TimeSpan.FromMinutes(10),
        };
        var kit = new AlarmTestKit(rule);
        Assert.Equal(AlarmState.Normal, kit.Set(EstimateNames.Our, 500).Step());
        Assert.Empty(kit.Journal);
    }

    [Fact]
    public void Evaluate_DeviationFromFixedSetpoint_FiresBothSidesWithDeadband()
    {
        var rule = new AlarmRule
        {
            Id = "temp_dev", Kind = AlarmConditionKind.Deviation, Source = SignalRef.Input(SignalRole.TemperatureC),
            Setpoint = 30, Limit = 1.5, Deadband = 0.2,
        };
        var kit = new AlarmTestKit(rule);
        Assert.Equal(AlarmState.Normal, kit.Set(SignalRole.TemperatureC, 31.4).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(SignalRole.TemperatureC, 28.4).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(SignalRole.TemperatureC, 28.7).Step());
        Assert.Equal(AlarmState.ReturnedUnacknowledged, kit.Set(SignalRole.TemperatureC, 28.8).Step());
    }

    [Fact]
    public void Evaluate_DeviationFromReferenceSignal_UsesTheReference()
    {
        var rule = new AlarmRule
        {
            Id = "mu_dev", Kind = AlarmConditionKind.Deviation, Source = SignalRef.Estimate(EstimateNames.MuPerH),
            Reference = SignalRef.Estimate("mu_setpoint_per_h"), Limit = 0.02,
        };
        var kit = new AlarmTestKit(rule);
        kit.Set("mu_setpoint_per_h", 0.15);
        Assert.Equal(AlarmState.Normal, kit.Set(EstimateNames.MuPerH, 0.165).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.MuPerH, 0.175).Step());
    }

    [Fact]
    public void Evaluate_FeedAboveAdvisoryByMargin_FiresAboveAdvisoryTimesOnePlusFractionPlusAbsolute()
    {
        var rule = new AlarmRule
        {
            Id = "feed_above_advisory", Kind = AlarmConditionKind.AboveReference, Category = "feed",
            Source = SignalRef.Input(SignalRole.FeedRateLPerH), Reference = SignalRef.Estimate(EstimateNames.FeedAdvisoryLPerH),
            MarginFraction = 0.10, MarginAbsolute = 0.05,
        };
        var kit = new AlarmTestKit(rule);
        kit.Set(EstimateNames.FeedAdvisoryLPerH, 2.0);   // threshold 2.0 · 1.1 + 0.05 = 2.25 L/h
        Assert.Equal(AlarmState.Normal, kit.Set(SignalRole.FeedRateLPerH, 2.25).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(SignalRole.FeedRateLPerH, 2.26).Step());
        kit.Set(EstimateNames.FeedAdvisoryLPerH, 3.0);   // the advisory rose: the same feed is fine
        Assert.Equal(AlarmState.ReturnedUnacknowledged, kit.Step());
    }

    [Fact]
    public void Evaluate_BadQuality_FiresOnBadOrMissingNotOnGood()
    {
        var rule = new AlarmRule
        {
            Id = "our_bad", Kind = AlarmConditionKind.BadQuality, Source = SignalRef.Estimate(EstimateNames.Our), Category = "quality",
        };
        var kit = new AlarmTestKit(rule);
        Assert.Equal(AlarmState.Unacknowledged, kit.Step());              // missing
        Assert.Equal(AlarmState.ReturnedUnacknowledged, kit.Set(EstimateNames.Our, 30, SampleQuality.Uncertain).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Our, double.NaN, SampleQuality.Bad).Step());
        Assert.False(rule.SuppressesWhenBad);
    }

    [Fact]
    public void Evaluate_BadQualityIncludingUncertain_FiresOnUncertain()
    {
        var rule = new AlarmRule
        {
            Id = "our_doubt", Kind = AlarmConditionKind.BadQuality, Source = SignalRef.Estimate(EstimateNames.Our), IncludeUncertain = true,
        };
        var kit = new AlarmTestKit(rule);
        Assert.Equal(AlarmState.Normal, kit.Set(EstimateNames.Our, 30).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Our, 30, SampleQuality.Uncertain).Step());
    }

    [Fact]
    public void Evaluate_Inconsistent_FiresWhenHExceedsItsCriticalValue()
    {
        // χ² with 2 degrees of freedom at 95 %: 5.99 (NIST/SEMATECH e-Handbook, table of the chi-square distribution).
        var rule = new AlarmRule { Id = "balance", Kind = AlarmConditionKind.Inconsistent, Source = SignalRef.Estimate(EstimateNames.ConsistencyH) };
        var kit = new AlarmTestKit(rule);
        kit.Set(EstimateNames.ConsistencyCritical, 5.99);
        Assert.Equal(AlarmState.Normal, kit.Set(EstimateNames.ConsistencyH, 0.137).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.ConsistencyH, 17.0).Step());
    }

    [Fact]
    public void Evaluate_FlatLine_FiresWhenTheAnalyserHasNotMovedForTheWindow()
    {
        var rule = new AlarmRule
        {
            Id = "o2_flat", Kind = AlarmConditionKind.FlatLine, Source = SignalRef.Input(SignalRole.OutletO2Percent),
            Limit = 0.001, RateWindow = TimeSpan.FromMinutes(15),
        };
        var kit = new AlarmTestKit(rule);
        Assert.Equal(AlarmState.Normal, kit.Set(SignalRole.OutletO2Percent, 19.5).Step(0));
        Assert.Equal(AlarmState.Normal, kit.Set(SignalRole.OutletO2Percent, 19.5004).Step(600));
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(SignalRole.OutletO2Percent, 19.5).Step(300));
        Assert.Equal(AlarmState.ReturnedUnacknowledged, kit.Set(SignalRole.OutletO2Percent, 19.48).Step(10));
    }

    [Fact]
    public void Evaluate_DoLowWhileFeeding_FiresOnlyWhileTheFeedRuns()
    {
        var rule = new AlarmRule
        {
            Id = "do_low_feeding", Kind = AlarmConditionKind.Low, Source = SignalRef.Input(SignalRole.DissolvedOxygenPercent),
            Limit = 15, Gate = SignalRef.Input(SignalRole.FeedRateLPerH), GateAbove = 0.01,
        };
        var kit = new AlarmTestKit(rule);
        kit.Set(SignalRole.DissolvedOxygenPercent, 5);
        Assert.Equal(AlarmState.Normal, kit.Set(SignalRole.FeedRateLPerH, 0).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(SignalRole.FeedRateLPerH, 1.2).Step());
        Assert.Equal(AlarmState.ReturnedUnacknowledged, kit.Set(SignalRole.FeedRateLPerH, 0).Step());
    }

    [Fact]
    public void Evaluate_EstimateRuleWhenEstimateBad_IsSuppressedByDesign_InputRuleHoldsItsState()
    {
        var estimateRule = AlarmTestKit.High(1.2);
        var inputRule = new AlarmRule
        {
            Id = "o2_enriched", Kind = AlarmConditionKind.High, Source = SignalRef.Input(SignalRole.OutletO2Percent), Limit = 23.5,
        };
        var kit = new AlarmTestKit(estimateRule, inputRule);
        kit.Set(EstimateNames.Rq, 1.5).Set(SignalRole.OutletO2Percent, 24).Step();
        Assert.Equal((AlarmState.Unacknowledged, AlarmState.Unacknowledged), (kit.State(0), kit.State(1)));
        kit.Set(EstimateNames.Rq, double.NaN, SampleQuality.Bad).Set(SignalRole.OutletO2Percent, double.NaN, SampleQuality.Bad).Step();
        Assert.Equal((AlarmState.SuppressedByDesign, AlarmState.Unacknowledged), (kit.State(0), kit.State(1)));
        Assert.True(estimateRule.SuppressesWhenBad);
        Assert.False(inputRule.SuppressesWhenBad);
    }

    [Fact]
    public void Evaluate_AfterSuppressionTheOnDelayRunsAgain()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(limit: 1.2, onDelayS: 60));
        kit.Set(EstimateNames.Rq, 1.5).Step(0);
        Assert.Equal(AlarmState.Unacknowledged, kit.Step(60));
        Assert.Equal(AlarmState.SuppressedByDesign, kit.Set(EstimateNames.Rq, 1.5, SampleQuality.Bad).Step());
        Assert.Equal(AlarmState.Normal, kit.Set(EstimateNames.Rq, 1.5).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Step(60));
    }
}
