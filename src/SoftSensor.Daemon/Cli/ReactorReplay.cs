using System.Text.Json;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.Logging;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Hosting;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Replay;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor replay --config DEFINITION [--reactor ID] --input CSV --out DIR</c>: replays one
/// reactor of a daemon definition (the file <c>run</c> takes) through the daemon's pipeline
/// (<see cref="ReplayHost"/>). The definition is read strictly, with the same messages as run and
/// check (one line per problem, exit 2). Ends with what happened: rows, skipped rows, cycles by
/// quality and, when cycles were not good, their causes by count; exit 1 when no cycle was usable.
/// </summary>
internal static class ReactorReplay
{
    public const string EstimatesFileName = "estimates.csv";

    /// <summary>True when <paramref name="path"/> is a daemon definition (a top-level <c>reactors</c>), not a file of the older replay format.</summary>
    public static bool IsDefinition(string path)
    {
        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllText(path), new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
            return doc.RootElement.ValueKind == JsonValueKind.Object && doc.RootElement.EnumerateObject().Any(p => string.Equals(p.Name, "reactors", StringComparison.OrdinalIgnoreCase));
        }
        catch (JsonException)
        {
            return true; // the definition reader names the line and position
        }
    }

    public static async Task<int> RunAsync(string config, string? reactorId, string input, string outDir, bool quiet, bool json, TextWriter stdout, TextWriter stderr, CancellationToken ct)
    {
        var settings = new DaemonHostSettings { ConfigFile = config, SystemFolder = Path.Combine(Path.GetTempPath(), "softsensor-replay-no-system-folder") };
        var problems = DaemonDefinition.Problems(settings);
        if (problems.Count > 0)
        {
            return CliOutput.Problems(stderr, problems);
        }

        var manager = new ConfigurationManager();
        DaemonConfiguration.Apply(manager, settings);
        var options = new SoftSensorOptions();
        manager.Bind(options);
        var validation = new SoftSensorOptionsValidator().Validate(null, options);
        if (validation.Failed)
        {
            return CliOutput.Problems(stderr, validation.Failures);
        }

        ReactorOptions? reactor = reactorId is null
            ? (options.Reactors.Count == 1 ? options.Reactors[0] : null)
            : options.Reactors.FirstOrDefault(r => string.Equals(r.Id, reactorId, StringComparison.Ordinal));
        if (reactor is null)
        {
            return CliOutput.BadInput(stderr, reactorId is null
                ? $"--reactor: the definition has {options.Reactors.Count} reactors (expected --reactor with one of {string.Join(", ", options.Reactors.Select(r => r.Id))})"
                : $"--reactor is '{reactorId}' (expected one of {string.Join(", ", options.Reactors.Select(r => r.Id))})");
        }

        Directory.CreateDirectory(outDir);
        using var loggerFactory = LoggerFactory.Create(b => b
            .SetMinimumLevel(quiet ? LogLevel.Warning : LogLevel.Information)
            .AddSimpleConsole(o => o.SingleLine = true)
            .AddConsole(o => o.LogToStandardErrorThreshold = LogLevel.Trace));
        var logger = loggerFactory.CreateLogger("softsensor.replay");
        string estimatesPath = Path.Combine(outDir, EstimatesFileName);
        ReplayOutcome outcome;
        try
        {
            await using var writer = new StreamWriter(estimatesPath, false, new System.Text.UTF8Encoding(false));
            var csv = new EstimateFramesCsv(writer);
            outcome = await ReplayHost.RunAsync(reactor, new ConfigLocation(Path.GetDirectoryName(Path.GetFullPath(config))!), input, [csv], logger, TimeProvider.System, ct);
        }
        catch (ReplayInputException e)
        {
            return CliOutput.BadInput(stderr, e.Message);
        }
        catch (InvalidOperationException e) when (e.Message.Contains("modelFile", StringComparison.Ordinal))
        {
            return CliOutput.BadInput(stderr, e.Message);
        }

        Summarise(outcome, reactor.Id, estimatesPath, json, stdout);
        return outcome.AnyUsable ? ExitCodes.Ok : ExitCodes.Failure;
    }

    private static void Summarise(ReplayOutcome o, string reactor, string estimates, bool json, TextWriter stdout)
    {
        if (json)
        {
            CliOutput.WriteJson(stdout, new
            {
                reactor, estimates, rows = o.Rows, skippedRows = o.SkippedRows, droppedCells = o.DroppedCells,
                firstSkipped = o.FirstSkipped.Select(s => new { line = s.Line, reason = s.Reason }),
                unmappedTags = o.Unmapped, cycles = o.Cycles, good = o.Good, uncertain = o.Uncertain, bad = o.Bad,
                causes = o.Causes.Select(c => new { cause = c.Key, cycles = c.Value }),
            });
            return;
        }

        stdout.WriteLine($"replayed reactor {reactor}: {o.Rows} rows ({o.SkippedRows} skipped, {o.DroppedCells} cells dropped), {o.Cycles} cycles: {o.Good} good, {o.Uncertain} uncertain, {o.Bad} bad");
        foreach (var s in o.FirstSkipped.Take(5))
        {
            stdout.WriteLine($"  skipped line {s.Line}: {s.Reason}");
        }

        if (o.Unmapped.Count > 0)
        {
            stdout.WriteLine($"  tags without a column in the export: {string.Join(", ", o.Unmapped)}");
        }

        if (o.Cycles > 0 && o.Good * 2 < o.Cycles)
        {
            stdout.WriteLine($"  most cycles were not good; causes by count:");
            foreach (var (cause, n) in o.Causes.Take(10))
            {
                stdout.WriteLine($"    {n,8} cycles  {cause}");
            }
        }

        if (!o.AnyUsable)
        {
            stdout.WriteLine("  no cycle gave a usable estimate");
        }

        stdout.WriteLine($"  estimates: {estimates}");
    }
}
