using SoftSensor.Daemon.Demo;

namespace SoftSensor.Daemon.Tests.Demo;

public class DemoPartsTests
{
    [Theory]
    [InlineData("90s", 90)]
    [InlineData("15m", 900)]
    [InlineData("1.5h", 5400)]
    [InlineData("01:00:00", 3600)]
    public void DurationText_TryParse_accepts_units_and_clock_text(string text, double seconds)
    {
        Assert.True(DurationText.TryParse(text, out var d));
        Assert.Equal(seconds, d.TotalSeconds);
    }

    [Theory]
    [InlineData("soon")]
    [InlineData("-5m")]
    [InlineData("0s")]
    [InlineData("2min")]
    [InlineData("90")]
    [InlineData("1.5")]
    public void DurationText_TryParse_rejects_nonsense_and_a_number_without_a_unit(string text) => Assert.False(DurationText.TryParse(text, out _));

    [Fact]
    public void DurationText_Problem_for_a_bare_number_says_it_needs_a_unit_and_lists_the_accepted_forms()
    {
        // .NET's TimeSpan.Parse would read "90" as 90 days: the unit must be written.
        Assert.Equal("--for is '90': a number needs a unit (expected a number with a unit s, m or h (90s, 30m, 2h, 1.5h) or hh:mm:ss (01:30:00); e.g. 90s, 90m or 90h)",
            DurationText.Problem("--for", "90"));
        Assert.Equal("--for is '2min' (expected a number with a unit s, m or h (90s, 30m, 2h, 1.5h) or hh:mm:ss (01:30:00))", DurationText.Problem("--for", "2min"));
        Assert.Null(DurationText.Problem("--for", "01:30:00"));
    }

    [Fact]
    public void Demo_with_a_bare_number_for_its_duration_exits_2_naming_the_flag()
    {
        var (code, _, error) = Cli.CliRunner.Run("demo", "--for", "90");
        Assert.Equal(Daemon.Cli.ExitCodes.BadInput, code);
        Assert.Contains("--for is '90': a number needs a unit", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Demo_with_a_missing_definition_exits_2_naming_the_flag()
    {
        var (code, _, error) = Cli.CliRunner.Run("demo", "--config", "/nonexistent/plant.json");
        Assert.Equal(Daemon.Cli.ExitCodes.BadInput, code);
        Assert.Contains("--config is '/nonexistent/plant.json': no such file", error, StringComparison.Ordinal);
    }

    [Fact]
    public void DemoFiles_WriteTo_writes_the_embedded_definition_model_alarm_rules_and_scenario_as_the_repository_holds_them()
    {
        string dir = Directory.CreateTempSubdirectory("softsensor-demofiles-").FullName;
        try
        {
            DemoFiles.WriteTo(dir);
            string repo = Fixtures.RepositoryRoot.Path;
            foreach (var (written, shipped) in new[]
            {
                ("demo.json", "config/demo.json"), ("estimator-glycerol-model.json", "config/estimator-glycerol-model.json"),
                ("demo-alarms.json", "config/demo-alarms.json"), ("scenarios/glycerol.json", "config/scenarios/glycerol.json"),
            })
            {
                Assert.Equal(File.ReadAllText(Path.Combine(repo, shipped)), File.ReadAllText(Path.Combine(dir, written)));
            }
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void ScaledTimeProvider_runs_faster_than_the_wall_clock_from_its_start()
    {
        var start = new DateTimeOffset(2026, 3, 2, 6, 0, 0, TimeSpan.Zero);
        var clock = new ScaledTimeProvider(start, 3600);
        var now = clock.GetUtcNow();
        Assert.InRange(now, start, start.AddHours(1)); // well under a second of real time has passed
    }

    [Fact]
    public void DemoPublisher_Topic_drops_the_reactor_prefix_and_lowercases()
    {
        Assert.Equal("demo/r1/offgas.o2", DemoPublisher.Topic("r1", "R1.OFFGAS.O2"));
    }
}
