using System.CommandLine;
using SoftSensor.Daemon.Hosting;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor run --config FILE [--key=value ...]</c>: the daemon. Further <c>--section:key=value</c>
/// tokens override the configuration (highest priority, above <c>SOFTSENSOR_*</c> environment
/// variables, <c>/etc/softsensor/*.json</c> and the file).
/// </summary>
internal sealed class RunVerb : IVerb
{
    public Command Build()
    {
        var config = new Option<string>("--config")
        {
            Description = "Configuration file (JSON; docs/configuration.md describes its keys)",
            Required = true,
        };
        var command = new Command("run", "Run the soft sensor daemon: one pipeline per configured reactor, MQTT in and out, embedded store, status page")
        {
            config,
        };
        var influx = new InfluxShortcutOptions();
        influx.AddTo(command);
        command.TreatUnmatchedTokensAsErrors = false;
        command.SetAction(async (parse, ct) =>
        {
            string file = parse.GetValue(config)!;
            if (!File.Exists(file))
            {
                return CliOutput.BadInput(Console.Error, $"--config: file '{file}' does not exist (expected a JSON configuration file)");
            }

            var overrides = parse.UnmatchedTokens.ToList();
            if (overrides.Count > 0 && !overrides[0].StartsWith("--", StringComparison.Ordinal))
            {
                return CliOutput.BadInput(Console.Error, $"'{overrides[0]}' is not an option (expected --section:key=value overrides)");
            }

            if (influx.AppendTo(parse, overrides, Console.Error) is { } bad)
            {
                return bad;
            }

            var settings = new DaemonHostSettings { ConfigFile = file, CommandLine = overrides };
            return await DaemonRunner.RunAsync(settings, Console.Error, null, ct);
        });
        return command;
    }
}
