using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Core.Tests.Simulation;

public class FaultInjectionTests
{
    private static readonly Scenario Clean = ShippedScenarios.Load("glycerol");

    /// <summary>Tag readings every 10 minutes for 16 h; column <paramref name="tag"/>.</summary>
    private static List<(double H, double Value, ReactorTruth Truth)> Series(Scenario s, string tag)
    {
        var r = VirtualReactor.Create(s, 5);
        int col = r.Tags.Select(t => t.Name).ToList().IndexOf(tag);
        var v = new double[r.Tags.Count];
        var list = new List<(double, double, ReactorTruth)>();
        for (int i = 0; i <= 96; i++)
        {
            if (i > 0)
            {
                r.Step(TimeSpan.FromMinutes(10));
            }

            r.ReadTags(v);
            list.Add((r.ElapsedH, v[col], r.Truth()));
        }

        return list;
    }

    [Fact]
    public void ReadTags_co2_offset_of_5_percent_of_reading_shows_only_in_its_window()
    {
        // The scenario of issue 5: "co2 offset +5 % of reading from 10 h to 14 h".
        var faulty = Clean with { Faults = [new FaultSpec { Kind = "analyser_offset", Gas = "co2", FromH = 10, ToH = 14, RelativePercent = 5 }] };
        var a = Series(Clean, "R1.OFFGAS.CO2");
        var b = Series(faulty, "R1.OFFGAS.CO2");
        for (int i = 0; i < a.Count; i++)
        {
            double h = a[i].H;
            if (h >= 10 && h < 14)
            {
                Assert.Equal(1.05, b[i].Value / a[i].Value, 9);
                Assert.True(b[i].Truth.FaultActive);
            }
            else
            {
                Assert.Equal(a[i].Value, b[i].Value);
                Assert.False(b[i].Truth.FaultActive);
            }
        }
    }

    [Fact]
    public void ReadTags_o2_drift_grows_linearly_inside_its_window()
    {
        var faulty = Clean with { Faults = [new FaultSpec { Kind = "analyser_drift", Gas = "o2", FromH = 4, ToH = 8, RatePercentPerH = 0.05 }] };
        var a = Series(Clean, "R1.OFFGAS.O2");
        var b = Series(faulty, "R1.OFFGAS.O2");
        for (int i = 0; i < a.Count; i++)
        {
            double h = a[i].H;
            double expected = h >= 4 && h < 8 ? 0.05 * (h - 4) : 0;
            Assert.Equal(expected, b[i].Value - a[i].Value, 9);
        }
    }

    [Fact]
    public void ReadTags_frozen_feed_signal_holds_while_the_true_feed_grows()
    {
        var faulty = Clean with { Faults = [new FaultSpec { Kind = "feed_signal_frozen", FromH = 10, ToH = 12 }] };
        var b = Series(faulty, "R1.FEED.RATE");
        var inside = b.Where(p => p.H > 10 && p.H < 12).ToList();
        Assert.All(inside, p => Assert.Equal(inside[0].Value, p.Value));
        Assert.True(inside[^1].Truth.FeedLPerH > inside[0].Truth.FeedLPerH * 1.1);
        var after = b.First(p => p.H >= 12.1);
        Assert.NotEqual(inside[0].Value, after.Value);
    }

    [Fact]
    public void Step_aeration_trip_stops_the_gas_and_the_dissolved_oxygen_falls()
    {
        var faulty = Clean with { Faults = [new FaultSpec { Kind = "aeration_trip", FromH = 9, ToH = 9.5 }] };
        var b = Series(faulty, "R1.AIR.FLOW");
        var inside = b.Where(p => p.H > 9 && p.H < 9.5).ToList();
        Assert.All(inside, p => Assert.Equal(0, p.Value));
        Assert.True(inside[^1].Truth.DissolvedOxygenPercent < 5, $"DO {inside[^1].Truth.DissolvedOxygenPercent} %");
        var before = b.Last(p => p.H < 9);
        Assert.True(before.Truth.DissolvedOxygenPercent > 40);
        Assert.True(b.First(p => p.H > 10).Value > 40);
        Assert.Equal(1.0, b[^1].Truth.CarbonRecovery, 1e-6);
    }
}
