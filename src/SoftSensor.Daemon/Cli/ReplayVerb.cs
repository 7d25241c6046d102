using System.CommandLine;
using Microsoft.Extensions.Logging;
using Spectre.Console;
using SoftSensor.Core.Estimation;
using SoftSensor.Daemon.Replay;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor replay --config FILE --input CSV --out DIR</c>: runs the live cycle over a
/// historian export and writes DIR/estimates.csv, DIR/report.html with its PNG figures and
/// DIR/estimator-state.bin (README section "replay").
/// </summary>
internal sealed class ReplayVerb : IVerb
{
    public Command Build()
    {
        var config = new Option<FileInfo>("--config") { Description = "reactor definition: the daemon configuration run and check take", Required = true };
        var reactor = new Option<string?>("--reactor") { Description = "id of the reactor to replay (may be left out when the definition has one)" };
        var input = new Option<FileInfo>("--input") { Description = "historian export, CSV with a timestamp column and one column per tag", Required = true };
        var output = new Option<DirectoryInfo>("--out") { Description = "output folder (created when missing)", Required = true };
        var offline = new Option<FileInfo?>("--offline") { Description = "offline samples CSV (overrides the configuration's offline.file)" };
        var stopAt = new Option<string?>("--stop-at") { Description = "stop after the first cycle at or after this ISO 8601 time and save the state" };
        var resume = new Option<FileInfo?>("--resume") { Description = "continue from a state file written by an earlier replay" };
        var noReport = new Option<bool>("--no-report") { Description = "write estimates.csv and the state only" };
        var quiet = new Option<bool>("--quiet") { Description = "no progress bar and no log lines below warning" };
        var json = new Option<bool>("--json") { Description = "print a JSON summary on stdout" };
        var cmd = new Command("replay", "run the estimation cycle over a historian export and write estimates.csv and report.html")
        {
            config, reactor, input, output, offline, stopAt, resume, noReport, quiet, json,
        };
        cmd.SetAction((parse, ct) => parse.GetValue(config) is { Exists: true } c && parse.GetValue(input) is { Exists: true } i && ReactorReplay.IsDefinition(c.FullName)
            ? ReactorRun(parse.GetValue(reactor), c, i, parse.GetValue(output)!, parse.GetValue(offline), parse.GetValue(stopAt), parse.GetValue(resume), parse.GetValue(noReport), parse.GetValue(quiet), parse.GetValue(json), ct)
            : Task.FromResult(new ReplayCommand(
            parse.GetValue(config)!, parse.GetValue(input)!, parse.GetValue(output)!, parse.GetValue(offline), parse.GetValue(stopAt),
            parse.GetValue(resume), parse.GetValue(noReport), parse.GetValue(quiet), parse.GetValue(json)).Run(Console.Out, Console.Error, ct)));
        return cmd;
    }

    private static Task<int> ReactorRun(string? reactor, FileInfo config, FileInfo input, DirectoryInfo output, FileInfo? offline, string? stopAt, FileInfo? resume, bool noReport, bool quiet, bool json, CancellationToken ct)
    {
        // Refused, not ignored: these belong to the older replay format and have no meaning for a reactor definition yet.
        string? unsupported = offline is not null ? "--offline" : stopAt is not null ? "--stop-at" : resume is not null ? "--resume" : noReport ? "--no-report" : null;
        return unsupported is not null
            ? Task.FromResult(CliOutput.BadInput(Console.Error, $"{unsupported}: not available when --config is a reactor definition (it replays the estimates file only)"))
            : ReactorReplay.RunAsync(config.FullName, reactor, input.FullName, output.FullName, quiet, json, Console.Out, Console.Error, ct);
    }
}

/// <summary>One invocation of the replay verb (separate from the option plumbing so tests can run it).</summary>
internal sealed record ReplayCommand(
    FileInfo Config, FileInfo Input, DirectoryInfo Out, FileInfo? Offline, string? StopAt, FileInfo? Resume, bool NoReport, bool Quiet, bool Json)
{
    public const string StateFileName = "estimator-state.bin";

    public int Run(TextWriter stdout, TextWriter stderr, CancellationToken ct)
    {
        if (!Config.Exists)
        {
            return CliOutput.BadInput(stderr, $"--config '{Config.FullName}' does not exist; expected a replay configuration file");
        }

        if (!Input.Exists)
        {
            return CliOutput.BadInput(stderr, $"--input '{Input.FullName}' does not exist; expected a CSV file");
        }

        DateTimeOffset? stop = null;
        if (StopAt is not null)
        {
            if (!DateTimeOffset.TryParse(StopAt, System.Globalization.CultureInfo.InvariantCulture,
                    System.Globalization.DateTimeStyles.AssumeUniversal | System.Globalization.DateTimeStyles.AdjustToUniversal, out var s))
            {
                return CliOutput.BadInput(stderr, $"--stop-at '{StopAt}' is not a time; expected ISO 8601 such as 2026-03-02T18:00:00Z");
            }

            stop = s;
        }

        if (!ReplayConfigLoader.TryLoad(Config.FullName, out var config, out var cycle, out var error))
        {
            return CliOutput.BadInput(stderr, error!);
        }

        EstimatorState? resumed = null;
        if (Resume is not null)
        {
            if (!Resume.Exists || !EstimatorStateCodec.TryDecode(File.ReadAllBytes(Resume.FullName), out resumed, out var stateError))
            {
                return CliOutput.BadInput(stderr, $"--resume '{Resume.FullName}': {(Resume.Exists ? "not a state file of this version" : "does not exist")}");
            }

            _ = stateError;
        }

        using var loggerFactory = LoggerFactory.Create(b => b
            .SetMinimumLevel(Quiet ? LogLevel.Warning : LogLevel.Information)
            .AddSimpleConsole(o => o.SingleLine = true)
            .AddConsole(o => o.LogToStandardErrorThreshold = LogLevel.Trace));
        var logger = loggerFactory.CreateLogger("softsensor.replay");

        var samples = new List<ScheduledSample>();
        string? offlinePath = Offline?.FullName
            ?? (config!.Offline?.File is { } f ? Path.Combine(Path.GetDirectoryName(Config.FullName)!, f) : null);
        if (offlinePath is not null)
        {
            var skippedSamples = new List<SkippedRow>();
            if (!File.Exists(offlinePath))
            {
                return CliOutput.BadInput(stderr, $"offline samples '{offlinePath}' do not exist");
            }

            if (!OfflineSampleFile.TryRead(offlinePath, config!.Offline ?? new OfflineLayout(), samples, skippedSamples, out var offlineError))
            {
                return CliOutput.BadInput(stderr, offlineError!);
            }

            foreach (var s in skippedSamples)
            {
                ReplayLog.SampleRowSkipped(logger, s.File, s.Line, s.Reason);
            }
        }

        Out.Create();
        try
        {
            var result = Execute(config!, cycle!, samples, stop, resumed, logger, stderr, ct);
            File.WriteAllBytes(Path.Combine(Out.FullName, StateFileName), EstimatorStateCodec.Encode(result.State));
            if (!NoReport)
            {
                var figures = Report.ReportPlots.Draw(Out.FullName, result.Series, samples);
                Report.ReportWriter.Write(Out.FullName, $"Replay of {Input.Name} ({config!.Reactor}, batch {config.BatchId})", result, figures);
            }

            if (Json)
            {
                CliOutput.WriteJson(stdout, Summary(result));
            }
            else
            {
                stdout.WriteLine($"replayed {result.Rows} rows ({result.SkippedRows} skipped), {result.Cycles} cycles; output in {Out.FullName}");
            }

            return ExitCodes.Ok;
        }
        catch (ReplayInputException e)
        {
            return CliOutput.BadInput(stderr, $"{Input.FullName}: {e.Message}");
        }
        catch (IOException e)
        {
            stderr.WriteLine("error: " + e.Message);
            return ExitCodes.Failure;
        }
    }

    private ReplayResult Execute(ReplayConfig config, Cycle cycle, List<ScheduledSample> samples, DateTimeOffset? stop, EstimatorState? resumed,
        ILogger logger, TextWriter stderr, CancellationToken ct)
    {
        using var history = new FileStream(Input.FullName, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16, FileOptions.SequentialScan);
        using var csv = new StreamWriter(Path.Combine(Out.FullName, "estimates.csv"), false, new System.Text.UTF8Encoding(false), 1 << 16);
        using var estimates = new EstimatesCsvWriter(csv);
        var series = new ReplaySeries(config.ReportPoints);
        var runner = new ReplayRunner(cycle, logger);
        bool bar = !Quiet && !Json && !Console.IsErrorRedirected;
        if (!bar)
        {
            return runner.Run(Input.FullName, history, config.History, samples, estimates, series, new ReplayOptions(stop, resumed), ct);
        }

        var console = AnsiConsole.Create(new AnsiConsoleSettings { Out = new AnsiConsoleOutput(stderr) });
        ReplayResult? result = null;
        console.Progress().AutoClear(false).Start(ctx =>
        {
            var task = ctx.AddTask($"replay {Input.Name}", maxValue: Math.Max(history.Length, 1));
            result = runner.Run(Input.FullName, history, config.History, samples, estimates, series,
                new ReplayOptions(stop, resumed, bytes => task.Value = bytes), ct);
            task.Value = task.MaxValue;
        });
        return result!;
    }

    private object Summary(ReplayResult r) => new
    {
        input = Input.FullName,
        output = Out.FullName,
        rows = r.Rows,
        skippedRows = r.SkippedRows,
        skipped = r.FirstSkipped.Select(s => new { line = s.Line, reason = s.Reason }),
        cycles = r.Cycles,
        offlineSamplesApplied = r.SamplesApplied,
        stopped = r.Stopped,
        finalBiomassGPerL = CliOutput.Finite(r.Series.Biomass.Count > 0 ? r.Series.Biomass[^1] : double.NaN),
        inconsistentCycles = r.Series.InconsistentCycles,
        suspects = r.Series.Suspects,
    };
}
