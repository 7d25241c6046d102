using System.CommandLine;
using SoftSensor.Daemon.Cli;

namespace SoftSensor.Daemon.Tests.Cli;

/// <summary>Runs a verb in-process as Program does (parse errors: one line each on stderr, exit 2), capturing stdout and stderr.</summary>
internal static class CliRunner
{
    public static (int ExitCode, string Output, string Error) Run(params string[] args)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        var parse = VerbCatalog.BuildRoot().Parse(args);
        int code;
        if (parse.Errors.Count > 0 || args.Length == 0)
        {
            code = CliOutput.BadInput(error, CliErrors.Describe(VerbCatalog.BuildRoot(), parse, args));
        }
        else
        {
            code = parse.Invoke(new InvocationConfiguration { Output = output, Error = error });
        }

        return (code, output.ToString(), error.ToString());
    }
}
