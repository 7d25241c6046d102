using SoftSensor.Core.Alarms;
using SoftSensor.Core.Estimation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Tests.Alarming;

/// <summary>
/// The alarms on a simulated batch (the yeast scenario of the simulator, invented demo data): the
/// overflow episode and an aeration trip. The estimator is set up as a plant engineer would for
/// that strain; its critical uptake (0.70 g/(g·h)) is a configured, conservative value below the
/// simulated strain's 0.79 g/(g·h) (onset of aerobic ethanol formation near D = 0.38 1/h in
/// S. cerevisiae, Postma et al. 1989, Appl. Environ. Microbiol. 55, is where such values come from).
/// </summary>
public class SimulatedEpisodeTests(Xunit.Abstractions.ITestOutputHelper output)
{
    /// <summary>Ethanol level the operators do not want exceeded, g/L (demo value).</summary>
    private const double EthanolLimitGPerL = 0.5;

    private static EstimatorSettings Yeast() => new()
    {
        InitialBiomassGPerL = 0.5,
        InitialBiomassSigmaGPerL = 0.1,
        InitialVolumeL = 30,
        BrothDensityKgPerL = 1.03,
        InitialSubstrateGPerL = 10,
        BiomassGPerCMol = 24.63,       // CH1.8O0.5N0.2 (docs/methods.md §2.1)
        AshFraction = 0.08,
        SubstrateGPerCMol = 28.525,    // sucrose C12H22O11, 342.30 g/mol / 12 (recomputed)
        FeedSubstrateGPerL = 500,
        AnalyserDeadTimeS = 45,
        YieldXOGPerMmol = 0.03,
        MaintenanceOMmolPerGh = 0.5,
        HistoryCapacity = 2048,
        Feed = new FeedAdvisorySettings
        {
            MuSetpointPerH = 0.15, YieldXSGPerG = 0.49, MaintenanceSGPerGh = 0.015, KlaPerH = 1100,
            OxygenSaturationMmolPerL = 0.2, MinimumDissolvedOxygenFraction = 0.2, CriticalSubstrateUptakeGPerGh = 0.70,
        },
    };

    [Fact]
    public void OverflowEpisode_FeedAboveOverflowLimitAlertRaisedBeforeEthanolPassesItsLimit()
    {
        var rig = new SimulatedEpisodeRig(s => s, Yeast());
        DateTimeOffset? alert = null;
        DateTimeOffset? ethanol = null;
        bool ethanolLowAgain = false;
        while (rig.Truth.ElapsedH < 18 && ethanol is null)
        {
            foreach (var t in rig.Step())
            {
                if (t.RuleId == "feed_above_overflow_limit" && t.To == AlarmState.Unacknowledged && rig.Truth.ElapsedH > 12)
                {
                    alert ??= t.Time;
                }
            }

            var truth = rig.Truth;
            if (truth.ElapsedH > 12)
            {
                // the batch phase made ethanol and the culture took it up again: wait until it is low, then watch for the rise
                ethanolLowAgain |= truth.OverflowGPerL < EthanolLimitGPerL;
                if (ethanolLowAgain && truth.OverflowGPerL > EthanolLimitGPerL)
                {
                    ethanol = truth.Time;
                }
            }
        }

        output.WriteLine($"feed alert {alert:O}, ethanol above {EthanolLimitGPerL} g/L {ethanol:O}");
        Assert.True(ethanolLowAgain, "the scenario should have re-consumed the batch-phase ethanol by 12 h");
        Assert.NotNull(ethanol);
        Assert.NotNull(alert);
        Assert.True(alert < ethanol, $"feed alert at {alert:O}, ethanol above {EthanolLimitGPerL} g/L at {ethanol:O}");
    }

    [Fact]
    public void AerationTrip_RaisesTheDataQualityAlarmAndSuppressesEstimateAlarms()
    {
        var rig = new SimulatedEpisodeRig(s => s with { Faults = [new FaultSpec { Kind = "aeration_trip", FromH = 10, ToH = 10.5 }] }, Yeast());
        var journal = new List<AlarmTransition>();
        while (rig.Truth.ElapsedH < 10.45)
        {
            journal.AddRange(rig.Step());
        }

        output.WriteLine(string.Join("\n", journal.Where(t => t.Time >= rig.Truth.Time.AddHours(-0.6)).Select(t => $"{t.Time:HH:mm:ss} {t.RuleId} {t.From}->{t.To} {t.Cause}")));
        string State(string id) => rig.Engine.States().Single(s => s.Alarm == id).State;
        Assert.Equal("unacknowledged", State("our_bad"));
        var during = journal.Where(t => t.Time >= rig.Truth.Time.AddHours(-0.45)).ToList();
        Assert.Contains(during, t => t.RuleId == "our_bad" && t.To == AlarmState.Unacknowledged);
        foreach (var id in new[] { "rq_window", "our_above_capacity", "our_rising_fast", "mu_above_setpoint" })
        {
            Assert.Equal("suppressed", State(id));
        }

        Assert.DoesNotContain(during, t => t.To == AlarmState.Unacknowledged && t.RuleId is "rq_window" or "our_rising_fast" or "mu_above_setpoint");
    }
}
