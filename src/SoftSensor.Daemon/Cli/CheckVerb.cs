using System.CommandLine;
using SoftSensor.Daemon.Cli.Check;
using SoftSensor.Daemon.Hosting;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor check --config FILE [--json]</c>: validates a daemon configuration without starting
/// anything (same layers and binding as <c>run</c>) and prints per reactor the tag map with units, the
/// model's element matrix, degrees of freedom, calculable and redundant rates, and the alarm rules.
/// Exit 0 when usable; 2 with every problem listed when not.
/// </summary>
internal sealed class CheckVerb : IVerb
{
    public Command Build()
    {
        var config = new Option<string>("--config") { Description = "Daemon configuration file (JSON), as given to run", Required = true };
        var json = new Option<bool>("--json") { Description = "print one JSON document instead of tables" };
        var command = new Command("check", "Validate a daemon configuration without starting anything: tag units, model structure, alarm rules; lists every problem")
        {
            config,
            json,
        };
        command.SetAction(parse => Run(new DaemonHostSettings { ConfigFile = parse.GetValue(config) }, parse.GetValue(json), Console.Out, Console.Error));
        return command;
    }

    /// <summary>Checks and prints; the exit code.</summary>
    public static int Run(DaemonHostSettings settings, bool json, TextWriter output, TextWriter error)
    {
        string file = settings.ConfigFile ?? "";
        if (!File.Exists(file))
        {
            return CliOutput.BadInput(error, $"--config: file '{file}' does not exist (expected a JSON daemon configuration file)");
        }

        var report = ConfigurationCheck.Run(settings);
        if (json)
        {
            CliOutput.WriteJson(output, report);
        }
        else
        {
            CheckText.Write(output, report);
        }

        return report.Usable
            ? ExitCodes.Ok
            : CliOutput.Problems(error, report.Problems);
    }
}
