using SoftSensor.Daemon.Cli;

namespace SoftSensor.Daemon;

internal static class Program
{
    private static async Task<int> Main(string[] args)
    {
        var root = VerbCatalog.BuildRoot();
        var parse = root.Parse(args);
        if (parse.Errors.Count > 0 || args.Length == 0)
        {
            // One line for the whole parse, however many faults it found (scripts read one line).
            return CliOutput.BadInput(Console.Error, CliErrors.Describe(root, parse, args));
        }

        // On SIGTERM/Ctrl+C the verb's token is cancelled and the host drains (final checkpoint, outbox, MQTT
        // offline) within its shutdown budget; System.CommandLine's default 2 s would end the process first (exit 143).
        return await parse.InvokeAsync(new System.CommandLine.InvocationConfiguration { ProcessTerminationTimeout = Hosting.DaemonHost.ShutdownTimeout + TimeSpan.FromSeconds(5) });
    }
}
