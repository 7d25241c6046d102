using Microsoft.Extensions.Configuration;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Cli;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;
using SoftSensor.Daemon.Hosting;

namespace SoftSensor.Daemon.Tests.Configuration;

/// <summary>
/// The reactor definition is read strictly, the same way by <c>check</c> and <c>run</c>: a misspelt
/// key names the key and its nearest valid name, an unparsable value the expected form, a unit the
/// tag, the unit and the units accepted, a JSON syntax error the file, line and position; exit code 2,
/// one line per problem.
/// </summary>
public sealed class StrictDefinitionTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("softsensor-strict-").FullName;

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    private const string Broken = """
        {
          "site": "pilot",
          "area": "hall-1",
          "reactors": [
            {
              "id": "r1",
              "cyclePeriode": "00:00:10",
              "gas": { "liquidVolumeL": 30 },
              "tags": {
                "R1.AIR":  { "role": "AirFlowNlPerMin",  "unit": "NL/min",  "topic": "p/air", "scal": 2 },
                "R1.O2":   { "role": "OutletO2Percent",  "unit": "%",       "topic": "p/o2", "scale": "abc" },
                "R1.CO2":  { "role": "OutletCo2Percent", "unit": "%",       "topic": "p/co2", "maxAge": "abc" },
                "R1.TEMP": { "role": "TemperatureC",     "unit": "furlong", "topic": "p/t" }
              }
            }
          ]
        }
        """;

    [Fact]
    public void Check_names_the_misspelt_key_its_nearest_name_the_expected_form_and_the_unit_exit_two()
    {
        var (code, error) = Check(Write("broken.json", Broken));

        Assert.Equal(ExitCodes.BadInput, code);
        var lines = error.Trim().Split('\n').Select(l => l.TrimEnd('\r')).ToList();
        Assert.All(lines, l => Assert.StartsWith("error: ", l, StringComparison.Ordinal));
        Assert.Contains(lines, l => l.Contains("reactors:0:cyclePeriode is not a setting", StringComparison.Ordinal) && l.Contains("did you mean 'cyclePeriod'?", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.Contains("reactors:0:tags:R1.AIR:scal is not a setting", StringComparison.Ordinal) && l.Contains("did you mean 'scale'?", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.Contains("reactors:0:tags:R1.O2:scale is 'abc' (expected a number", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.Contains("reactors:0:tags:R1.CO2:maxAge is 'abc' (expected a duration hh:mm:ss", StringComparison.Ordinal));
        Assert.Equal(4, lines.Count); // the unit is checked once the file reads (next test)
    }

    [Fact]
    public void A_furlong_temperature_names_the_tag_the_unit_and_the_units_accepted()
    {
        string file = Write("furlong.json", Broken
            .Replace("\"cyclePeriode\"", "\"cyclePeriod\"", StringComparison.Ordinal)
            .Replace(", \"scal\": 2", "", StringComparison.Ordinal)
            .Replace(", \"scale\": \"abc\"", "", StringComparison.Ordinal)
            .Replace(", \"maxAge\": \"abc\"", "", StringComparison.Ordinal));
        var (code, error) = Check(file);

        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("reactors:0:tags:R1.TEMP:unit is 'furlong' is not a unit the daemon knows (expected one of °C, degC, K, °F, degF", error, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_json_syntax_error_names_the_file_line_and_position_in_check_and_run()
    {
        // Line 3 lacks the comma after "pilot": the reader stops at the next property name, line 3 position 3.
        string file = Write("syntax.json", "{\n  \"site\": \"pilot\"\n  \"area\": \"hall-1\"\n}\n");
        var (code, error) = Check(file);
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains(file + ": line 3, position 3: JSON syntax error", error, StringComparison.Ordinal);

        using var runError = new StringWriter();
        int runCode = await DaemonRunner.RunAsync(Settings(file), runError, null, CancellationToken.None);
        Assert.Equal(ExitCodes.BadInput, runCode);
        Assert.Equal(error.Trim(), runError.ToString().Trim());
    }

    [Fact]
    public async Task Run_gives_the_same_lines_as_check_for_a_misspelt_key()
    {
        string file = Write("broken.json", Broken);
        var (_, checkError) = Check(file);
        using var runError = new StringWriter();
        int code = await DaemonRunner.RunAsync(Settings(file), runError, null, CancellationToken.None);

        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Equal(checkError.Trim(), runError.ToString().Trim());
    }

    [Fact]
    public void An_enum_setting_names_its_values_and_refuses_a_number()
    {
        var keys = new Dictionary<string, string?>
        {
            ["reactors:0:gas:analyserBasis"] = "humid",
            ["reactors:0:gas:inlet"] = "1",
            ["reactors:0:tags:T:payload:format"] = "Number",
        };
        var c = new Microsoft.Extensions.Configuration.ConfigurationBuilder().AddInMemoryCollection(keys).Build();
        var problems = DefinitionSchema.Problems(c, typeof(SoftSensorOptions), DaemonDefinition.Sections);

        Assert.Equal(
            ["reactors:0:gas:analyserBasis is 'humid' (expected one of dry, wet)", "reactors:0:gas:inlet is '1' (expected one of lines, fixed, measured)"],
            problems);
    }

    [Fact]
    public async Task A_bad_alarm_rule_file_is_one_line_and_exit_two_from_run_not_a_stack_trace()
    {
        string rules = Write("rules.json", """{ "rules": [ { "id": "rq_hi", "kind": "hihg", "source": "rq", "limit": 1.2 } ] }""");
        string file = Write("alarms.json", Broken
            .Replace("\"cyclePeriode\"", "\"cyclePeriod\"", StringComparison.Ordinal)
            .Replace(", \"scal\": 2", "", StringComparison.Ordinal)
            .Replace(", \"scale\": \"abc\"", "", StringComparison.Ordinal)
            .Replace(", \"maxAge\": \"abc\"", "", StringComparison.Ordinal)
            .Replace("\"furlong\"", "\"K\"", StringComparison.Ordinal)
            .Replace("\n  ]\n}", "\n  ],\n  \"alarms\": { \"ruleFiles\": [ \"rules.json\" ] },\n  \"store\": { \"path\": \"" + Path.Combine(_folder, "s.db").Replace("\\", "/", StringComparison.Ordinal) + "\" },\n  \"status\": { \"url\": \"http://127.0.0.1:0\" }\n}", StringComparison.Ordinal));
        using var runError = new StringWriter();
        int code = await DaemonRunner.RunAsync(Settings(file), runError, null, CancellationToken.None);

        Assert.Equal(ExitCodes.BadInput, code);
        var lines = runError.ToString().Trim().Split('\n');
        Assert.Single(lines);
        Assert.Contains("rule 1 ('rq_hi'): kind is 'hihg'", lines[0], StringComparison.Ordinal);
        _ = rules;
    }

    [Fact]
    public void Nearest_name_is_found_within_a_third_of_the_key_and_not_beyond()
    {
        Assert.Equal("deadTime", DefinitionSchema.Nearest("deadtim", ["deadTime", "maxAge", "topic"]));
        Assert.Equal("analyserBasis", DefinitionSchema.Nearest("analyzerBasis", ["analyserBasis", "inlet"]));
        Assert.Null(DefinitionSchema.Nearest("colour", ["deadTime", "maxAge", "topic"]));
    }

    // Exact unit definitions: SI brochure 9th ed. and NIST SP 811 appendix B (1 bar = 100 kPa,
    // 1 psi = 6.894 757 293 168 kPa, standard atmosphere 101.325 kPa = 14.695 95 psi, t/°C = T/K − 273.15,
    // t/°C = (t/°F − 32)·5/9; 1 Nm³ = 1000 NL).
    [Theory]
    [InlineData(SignalRole.PressureKPa, "bar(g)", 1.0, 201.325)]
    [InlineData(SignalRole.PressureKPa, "psi", 14.69595, 101.325)]
    [InlineData(SignalRole.PressureKPa, "mbar", 1013.25, 101.325)]
    [InlineData(SignalRole.PressureKPa, "Pa", 101325, 101.325)]
    [InlineData(SignalRole.TemperatureC, "°F", 212, 100)]
    [InlineData(SignalRole.TemperatureC, "K", 310.15, 37)]
    [InlineData(SignalRole.AirFlowNlPerMin, "Nm³/h", 0.06, 1)]
    [InlineData(SignalRole.AirFlowNlPerMin, "NL/h", 60, 1)]
    [InlineData(SignalRole.AirFlowNlPerMin, "mL/min", 1000, 1)]
    [InlineData(SignalRole.AirFlowNlPerMin, "SLPM", 2.5, 2.5)]
    [InlineData(SignalRole.LiquidVolumeL, "m³", 0.3, 300)]
    [InlineData(SignalRole.LiquidVolumeL, "mL", 500, 0.5)]
    [InlineData(SignalRole.WeightKg, "g", 1500, 1.5)]
    [InlineData(SignalRole.OutletO2Percent, "fraction", 0.2095, 20.95)]
    [InlineData(SignalRole.FeedRateLPerH, "mL/min", 10, 0.6)]
    public void A_tag_unit_converts_in_the_tag_binding(SignalRole role, string unit, double raw, double expected)
    {
        var reactor = new ReactorOptions { Id = "r1" };
        reactor.Tags["T"] = new TagOptions { Role = role.ToString(), Unit = unit, Topic = "p/t", AtmosphereKPa = 101.325 };
        var binding = TagBinding.FromOptions(reactor).Single();
        Assert.Equal(expected, binding.ToRoleUnit(raw), 1e-3);
    }

    [Fact]
    public void A_unit_of_the_wrong_quantity_or_a_gauge_without_its_atmosphere_is_refused_naming_the_tag()
    {
        var o = Minimal();
        o.Reactors[0].Tags["R1.TEMP"] = new TagOptions { Role = "TemperatureC", Unit = "bar", Topic = "p/t" };
        o.Reactors[0].Tags["R1.P"] = new TagOptions { Role = "PressureKPa", Unit = "psig", Topic = "p/p" };
        var failures = new SoftSensorOptionsValidator().Validate(null, o).Failures ?? [];

        Assert.Contains(failures, f => f.StartsWith("reactors:0:tags:R1.TEMP:unit is 'bar' is a unit of pressure (expected a unit of temperature", StringComparison.Ordinal));
        Assert.Contains(failures, f => f.StartsWith("reactors:0:tags:R1.P:atmosphereKPa is missing", StringComparison.Ordinal) && f.Contains("'psig'", StringComparison.Ordinal));
    }

    [Fact]
    public void Defaults_fill_what_tags_share_reactor_over_file_tag_over_both()
    {
        string file = Write("defaults.json", """
            {
              "site": "pilot", "area": "hall-1",
              "defaults": { "payload": { "format": "number" }, "maxAge": "00:02:00", "topicPrefix": "plant/hall-1" },
              "reactors": [
                {
                  "id": "r1",
                  "defaults": { "maxAge": "00:00:30", "topicPrefix": "plant/r1" },
                  "gas": { "liquidVolumeL": 30 },
                  "tags": {
                    "AIR": { "role": "AirFlowNlPerMin" },
                    "O2":  { "role": "OutletO2Percent", "maxAge": "00:05:00", "topic": "gw/o2" },
                    "CO2": { "role": "OutletCo2Percent", "payload": { "format": "json" } }
                  }
                }
              ]
            }
            """);
        var manager = new Microsoft.Extensions.Configuration.ConfigurationManager();
        DaemonConfiguration.Apply(manager, Settings(file));
        var o = new SoftSensorOptions();
        Microsoft.Extensions.Configuration.ConfigurationBinder.Bind(manager, o);
        var tags = o.Reactors[0].Tags;

        Assert.Equal("plant/r1/AIR", tags["AIR"].Topic);
        Assert.Equal(TimeSpan.FromSeconds(30), tags["AIR"].MaxAge);
        Assert.Equal(PayloadFormat.Number, tags["AIR"].Payload.Format);
        Assert.Equal("gw/o2", tags["O2"].Topic);
        Assert.Equal(TimeSpan.FromMinutes(5), tags["O2"].MaxAge);
        Assert.Equal(PayloadFormat.Json, tags["CO2"].Payload.Format);
        Assert.Empty(DaemonDefinition.Problems(Settings(file)));
        Assert.True(new SoftSensorOptionsValidator().Validate(null, o).Succeeded);
    }

    private static SoftSensorOptions Minimal()
    {
        var o = new SoftSensorOptions { Site = "pilot", Area = "hall-1" };
        var r = new ReactorOptions { Id = "r1" };
        r.Gas.LiquidVolumeL = 30;
        r.Tags["R1.AIR"] = new TagOptions { Role = "AirFlowNlPerMin", Unit = "NL/min", Topic = "p/air" };
        r.Tags["R1.O2"] = new TagOptions { Role = "OutletO2Percent", Unit = "%", Topic = "p/o2" };
        r.Tags["R1.CO2"] = new TagOptions { Role = "OutletCo2Percent", Unit = "%", Topic = "p/co2" };
        o.Reactors.Add(r);
        return o;
    }

    private string Write(string name, string text)
    {
        string path = Path.Combine(_folder, name);
        File.WriteAllText(path, text);
        return path;
    }

    private DaemonHostSettings Settings(string file) => new() { ConfigFile = file, SystemFolder = Path.Combine(_folder, "no-system-folder") };

    private (int Code, string Error) Check(string file)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        int code = CheckVerb.Run(Settings(file), json: false, output, error);
        return (code, error.ToString());
    }
}
