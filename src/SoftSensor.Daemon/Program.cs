using SoftSensor.Daemon.Cli;

namespace SoftSensor.Daemon;

internal static class Program
{
    private static async Task<int> Main(string[] args)
    {
        var root = VerbCatalog.BuildRoot();
        var parse = root.Parse(args);
        if (parse.Errors.Count > 0)
        {
            // One line for the whole parse, however many faults it found (scripts read one line).
            return CliOutput.BadInput(Console.Error, string.Join("; ", parse.Errors.Select(e => e.Message)));
        }

        return await parse.InvokeAsync();
    }
}
