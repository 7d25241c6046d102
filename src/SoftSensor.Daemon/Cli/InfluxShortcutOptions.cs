using System.CommandLine;
using SoftSensor.Daemon.Cli;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>--influx URL</c>, <c>--influx-org</c>, <c>--influx-bucket</c> on <c>run</c> and <c>demo</c>:
/// shortcuts for <c>timeseries:url</c>, <c>timeseries:org</c>, <c>timeseries:bucket</c> (the token
/// only from the environment variable <c>SOFTSENSOR_INFLUX_TOKEN</c>, never on a command line).
/// </summary>
internal sealed class InfluxShortcutOptions
{
    private readonly Option<string?> _url = new("--influx") { Description = "InfluxDB v2 base URL for the estimates, e.g. http://127.0.0.1:8086 (token from SOFTSENSOR_INFLUX_TOKEN)" };
    private readonly Option<string?> _org = new("--influx-org") { Description = "InfluxDB organisation (default softsensor)" };
    private readonly Option<string?> _bucket = new("--influx-bucket") { Description = "InfluxDB bucket (default softsensor)" };

    /// <summary>Adds the three options to a verb.</summary>
    public void AddTo(Command command)
    {
        command.Options.Add(_url);
        command.Options.Add(_org);
        command.Options.Add(_bucket);
    }

    /// <summary>Appends the configuration overrides (<c>--timeseries:url=...</c>); an error line and exit code 2 for a bad value, else null.</summary>
    public int? AppendTo(ParseResult parse, List<string> commandLine, TextWriter error)
    {
        if (parse.GetValue(_url) is { } url)
        {
            if (!Uri.TryCreate(url, UriKind.Absolute, out var uri) || (uri.Scheme != Uri.UriSchemeHttp && uri.Scheme != Uri.UriSchemeHttps))
            {
                return CliOutput.BadInput(error, $"--influx: '{url}' is not an absolute http:// or https:// URL (expected e.g. http://127.0.0.1:8086)");
            }

            commandLine.Add("--timeseries:url=" + url);
        }

        foreach (var (option, key) in new[] { (_org, "org"), (_bucket, "bucket") })
        {
            if (parse.GetValue(option) is { } v)
            {
                if (string.IsNullOrWhiteSpace(v))
                {
                    return CliOutput.BadInput(error, $"{option.Name}: empty (expected a name)");
                }

                commandLine.Add($"--timeseries:{key}={v}");
            }
        }

        return null;
    }
}
