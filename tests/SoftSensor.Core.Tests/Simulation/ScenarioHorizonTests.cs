using SoftSensor.Simulation;

namespace SoftSensor.Core.Tests.Simulation;

/// <summary>
/// The virtual reactor stays finite over its whole scenario and refuses a horizon past it (beyond it
/// the feed fills the vessel until the headspace vanishes; the model used to return NaN there).
/// </summary>
public class ScenarioHorizonTests
{
    [Fact]
    public void Step_to_the_scenario_end_gives_finite_tags_and_one_step_past_it_is_refused_naming_the_duration()
    {
        var s = ShippedScenarios.Load("glycerol");
        var r = VirtualReactor.Create(s, s.Seed);
        var v = new double[r.Tags.Count];
        for (int h = 0; h < s.DurationH; h++)
        {
            r.Step(TimeSpan.FromHours(1));
            r.ReadTags(v);
            Assert.All(v, x => Assert.True(double.IsFinite(x), $"a tag is {x} at {r.ElapsedH} h"));
        }

        var e = Assert.Throws<InvalidOperationException>(() => r.Step(TimeSpan.FromHours(1)));
        Assert.Contains("duration_h", e.Message, StringComparison.Ordinal);
        Assert.Contains("covers 24 h", e.Message, StringComparison.Ordinal);
        Assert.Equal(s.DurationH, r.ElapsedH, 6);
    }
}
