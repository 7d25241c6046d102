using System.CommandLine;
using System.Globalization;
using SoftSensor.Daemon.Demo;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor demo [--speed N] [--for DURATION] [--data DIR] [--config FILE] [--scenario FILE]</c>:
/// an embedded MQTT broker on loopback, the virtual pilot reactor publishing its tags in accelerated
/// time, and the daemon reading them through the real MQTT path, storing, printing one line per cycle
/// and serving the status page. The demo's own definition, model, alarm rules and scenario are
/// embedded in the program and written to DIR/definition at start.
/// </summary>
internal sealed class DemoVerb : IVerb
{
    public Command Build()
    {
        var speed = new Option<double>("--speed") { Description = "Simulated seconds per real second (1 to 3600)", DefaultValueFactory = _ => 60 };
        var duration = new Option<string?>("--for") { Description = "Stop after this much simulated time: " + DurationText.Forms + " (default: the scenario's duration)" };
        var data = new Option<string>("--data") { Description = "Folder of the demo's store, definition and reports (recreated each run)", DefaultValueFactory = _ => "data" };
        var config = new Option<string?>("--config") { Description = "Run this reactor definition against the virtual reactor instead of the demo's own (each MQTT tag is fed the signal of its role)" };
        var scenario = new Option<string?>("--scenario") { Description = "Scenario of the virtual reactor (default: the demo's glycerol scenario)" };
        var command = new Command("demo", "Run the demo: embedded broker, virtual reactor in accelerated time, the daemon and its status page") { speed, duration, data, config, scenario };
        var influx = new InfluxShortcutOptions();
        influx.AddTo(command);
        command.SetAction((parse, ct) =>
        {
            var (output, error) = (parse.InvocationConfiguration.Output, parse.InvocationConfiguration.Error);
            var influxOverrides = new List<string>();
            if (influx.AppendTo(parse, influxOverrides, error) is { } bad)
            {
                return Task.FromResult(bad);
            }

            var request = Validate(parse.GetValue(speed), parse.GetValue(duration), parse.GetValue(data)!, parse.GetValue(config), parse.GetValue(scenario), out string? problem);
            return request is null
                ? Task.FromResult(CliOutput.BadInput(error, problem!))
                : DemoSession.RunAsync(request with { InfluxOverrides = influxOverrides }, output, error, ct);
        });
        return command;
    }

    /// <summary>The checked request, or null with the problem (naming the flag, the value and the expectation).</summary>
    internal static DemoRequest? Validate(double speed, string? forText, string dataDir, string? config, string? scenario, out string? problem)
    {
        problem = null;
        if (!(speed is >= 1 and <= 3600))
        {
            problem = $"--speed is {speed.ToString(CultureInfo.InvariantCulture)} (expected 1 to 3600 simulated seconds per second)";
            return null;
        }

        TimeSpan? simFor = null;
        if (forText is not null)
        {
            if (DurationText.Problem("--for", forText) is { } bad)
            {
                problem = bad;
                return null;
            }

            DurationText.TryParse(forText, out var d);
            simFor = d;
        }

        foreach (var (flag, file) in new[] { ("--config", config), ("--scenario", scenario) })
        {
            if (file is not null && !File.Exists(file))
            {
                problem = $"{flag} is '{file}': no such file (expected a {(flag == "--config" ? "reactor definition" : "scenario")} JSON file)";
                return null;
            }
        }

        return new DemoRequest(speed, simFor, Path.GetFullPath(dataDir), config is null ? null : Path.GetFullPath(config), scenario is null ? null : Path.GetFullPath(scenario));
    }
}
