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
            foreach (var e in parse.Errors)
            {
                await Console.Error.WriteLineAsync("error: " + e.Message);
            }

            return ExitCodes.BadInput;
        }

        return await parse.InvokeAsync();
    }
}
