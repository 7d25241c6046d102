using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Core.Tests.Simulation;

public class ScenarioLoaderTests
{
    [Theory]
    [InlineData("glycerol")]
    [InlineData("yeast")]
    public void Load_shipped_scenario_is_valid(string name)
    {
        var s = ShippedScenarios.Load(name);
        Assert.Equal(24, s.DurationH);
        Assert.NotEmpty(s.Samples.Plan);
    }

    [Fact]
    public void Parse_unknown_key_names_it()
    {
        var e = Assert.Throws<ScenarioException>(() => ScenarioLoader.Parse("""{ "vessel": { "volume": 5 } }"""));
        Assert.Contains("vessel.volume", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_bad_value_names_the_key_the_value_and_the_expectation()
    {
        var e = Assert.Throws<ScenarioException>(() => ScenarioLoader.Parse("""{ "culture": { "mu_max_per_h": -0.2 } }"""));
        Assert.Contains("key 'culture.mu_max_per_h' is -0.2: expected a positive number", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_bad_formula_and_fault_kind_are_reported_together()
    {
        var e = Assert.Throws<ScenarioException>(() => ScenarioLoader.Parse(
            """{ "culture": { "biomass": { "formula": "CH1.8Xx" } }, "faults": [ { "kind": "meltdown", "from_h": 1, "to_h": 2 } ] }"""));
        Assert.Contains("culture.biomass.formula", e.Message, StringComparison.Ordinal);
        Assert.Contains("key 'faults[0].kind' is 'meltdown'", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_wrong_type_names_the_key()
    {
        var e = Assert.Throws<ScenarioException>(() => ScenarioLoader.Parse("""{ "duration_h": "long" }"""));
        Assert.Contains("duration_h", e.Message, StringComparison.Ordinal);
    }
}
