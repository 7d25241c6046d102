using Microsoft.AspNetCore.Builder;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Hosting;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// Starts a daemon host and runs it until cancelled, turning configuration errors into the CLI's
/// bad-input result (one line on stderr naming every offending key, exit code 2).
/// </summary>
internal static class DaemonRunner
{
    /// <summary>Builds, starts, runs and stops a daemon; <paramref name="started"/> runs once it is up.</summary>
    public static async Task<int> RunAsync(DaemonHostSettings settings, TextWriter error, Func<WebApplication, CancellationToken, Task>? started, CancellationToken cancellationToken)
    {
        WebApplication app;
        try
        {
            app = DaemonHost.Build(settings);
        }
        catch (Exception e) when (e is FileNotFoundException or InvalidDataException or FormatException or DirectoryNotFoundException)
        {
            return CliOutput.BadInput(error, $"--config: {e.Message}");
        }

        await using (app)
        {
            try
            {
                await app.StartAsync(cancellationToken);
            }
            catch (OptionsValidationException e)
            {
                return CliOutput.BadInput(error, "configuration is invalid: " + e.Message);
            }
            catch (InvalidOperationException e) when (e.InnerException is FormatException || e.Message.Contains("Failed to convert", StringComparison.Ordinal))
            {
                return CliOutput.BadInput(error, "configuration is invalid: " + (e.InnerException?.Message is { } inner ? e.Message + " " + inner : e.Message));
            }
            catch (IOException e)
            {
                await error.WriteLineAsync("error: could not start: " + e.Message);
                return ExitCodes.Failure;
            }

            if (started is not null)
            {
                await started(app, cancellationToken);
            }

            try
            {
                using var either = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken, app.Lifetime.ApplicationStopping);
                await Task.Delay(Timeout.Infinite, either.Token);
            }
            catch (OperationCanceledException)
            {
                // Stop requested (Ctrl+C, SIGTERM, the demo's --for, or the host itself).
            }

            await app.StopAsync(CancellationToken.None);
        }

        return ExitCodes.Ok;
    }
}
