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
        if (settings.ConfigFile is { } file && !File.Exists(file))
        {
            return CliOutput.BadInput(error, $"--config: file '{file}' does not exist (expected a JSON reactor definition)");
        }

        var problems = DaemonDefinition.Problems(settings);
        if (problems.Count > 0)
        {
            return CliOutput.Problems(error, problems);
        }

        WebApplication app;
        try
        {
            app = DaemonHost.Build(settings);
        }
        catch (Exception e) when (e is FileNotFoundException or InvalidDataException or FormatException or DirectoryNotFoundException)
        {
            return CliOutput.BadInput(error, $"--config: {e.Message}");
        }
        catch (Exception e) when (ValidationFailures(e) is { Count: > 0 } failures)
        {
            // Options resolved while the host is built (the alarm rule files) fail here, not at start.
            return CliOutput.Problems(error, failures);
        }

        await using (app)
        {
            try
            {
                await app.StartAsync(cancellationToken);
            }
            catch (Exception e) when (ValidationFailures(e) is { Count: > 0 } failures)
            {
                return CliOutput.Problems(error, failures);
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

    /// <summary>Every validation failure inside <paramref name="e"/> (several options failing at start arrive as an AggregateException, a rule file failing in a factory as an inner exception).</summary>
    internal static List<string> ValidationFailures(Exception e)
    {
        var failures = new List<string>();
        void Walk(Exception? x)
        {
            switch (x)
            {
                case OptionsValidationException v:
                    failures.AddRange(v.Failures);
                    break;
                case AggregateException a:
                    foreach (var inner in a.InnerExceptions) Walk(inner);
                    break;
                case not null:
                    Walk(x.InnerException);
                    break;
            }
        }

        Walk(e);
        return failures;
    }
}
