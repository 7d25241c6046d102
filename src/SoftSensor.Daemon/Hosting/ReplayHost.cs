using System.Diagnostics.Metrics;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Replay;
using SoftSensor.Daemon.Sinks;
using StatusCodes = SoftSensor.OpcUa.Encoding.StatusCodes;

namespace SoftSensor.Daemon.Hosting;

/// <summary>What a replay did, with the causes of the cycles that were not good, most frequent first.</summary>
internal sealed record ReplayOutcome(
    long Rows,
    long SkippedRows,
    long DroppedCells,
    IReadOnlyList<SkippedRow> FirstSkipped,
    IReadOnlyList<string> Unmapped,
    long Cycles,
    long Good,
    long Uncertain,
    long Bad,
    IReadOnlyList<KeyValuePair<string, long>> Causes)
{
    /// <summary>True when at least one cycle gave a usable (good or uncertain) frame.</summary>
    public bool AnyUsable => Good + Uncertain > 0;
}

/// <summary>
/// Replays a historian export through the daemon's own reactor pipeline: the export is the source
/// (<see cref="HistorySource"/>) and its timestamps the clock (<see cref="ReplayClock"/>); the
/// pipeline is the one <c>run</c> builds for the reactor (the same tag binding and unit conversion,
/// signal store with dead-time shift and staleness, cycle factory, dispatcher), with the estimates
/// file as its sink instead of MQTT. The cycle runs on the reactor's period on the export's timeline:
/// a cycle at time T sees every row up to T, as the live cycle sees every sample that arrived before it.
/// </summary>
internal static class ReplayHost
{
    public static async Task<ReplayOutcome> RunAsync(ReactorOptions reactor, ConfigLocation location, string input, IReadOnlyList<IEstimateSink> sinks,
        ILogger logger, TimeProvider wall, CancellationToken cancellationToken)
    {
        var bindings = TagBinding.FromOptions(reactor);
        var cycle = new ReactorCycleFactory(location).Create(reactor, bindings);
        using var source = HistorySource.Open(input, reactor.History, TagBinding.Process(bindings), wall, logger);
        using var provider = new ServiceCollection().AddMetrics().BuildServiceProvider();
        var metrics = new DaemonMetrics(provider.GetRequiredService<IMeterFactory>());
        var clock = new ReplayClock(DateTimeOffset.MinValue);
        var dispatcher = new FrameDispatcher(sinks, metrics, clock, provider.GetService<ILoggerFactory>()?.CreateLogger<FrameDispatcher>()
            ?? Microsoft.Extensions.Logging.Abstractions.NullLogger<FrameDispatcher>.Instance);
        var board = new StatusBoard();
        var services = new PipelineServices(clock, dispatcher, board, null, metrics, logger, int.MaxValue);
        var pipeline = new ReactorPipeline(reactor, bindings, cycle, [], services);
        var causes = new Dictionary<string, long>(StringComparer.Ordinal);
        long cycles = 0, good = 0, uncertain = 0, bad = 0;
        DateTimeOffset? next = null;

        async Task CycleAt(DateTimeOffset t)
        {
            clock.Set(t);
            var frame = await pipeline.RunCycleAsync(cancellationToken);
            await dispatcher.FlushAsync(cancellationToken);
            cycles++;
            switch (frame.Quality)
            {
                case SampleQuality.Good: good++; return;
                case SampleQuality.Uncertain: uncertain++; break;
                default: bad++; break;
            }

            Count(causes, board.Get(reactor.Id), frame);
        }

        foreach (var row in source.Read())
        {
            next ??= row.Time;
            while (next < row.Time)
            {
                await CycleAt(next.Value);
                next = next.Value + reactor.CyclePeriod;
            }

            foreach (var s in row.Samples)
            {
                pipeline.Accept(s);
            }
        }

        if (next is { } last)
        {
            await CycleAt(last);
        }

        return new ReplayOutcome(source.Rows, source.SkippedRows, source.DroppedCells, source.FirstSkipped, source.Unmapped,
            cycles, good, uncertain, bad, [.. causes.OrderByDescending(kv => kv.Value).ThenBy(kv => kv.Key, StringComparer.Ordinal)]);
    }

    // A frame that is not good: the inputs that were stale or never came, else the status of its worst estimate.
    private static void Count(Dictionary<string, long> causes, ReactorSnapshot? snapshot, EstimateFrame frame)
    {
        bool any = false;
        foreach (var h in snapshot?.Inputs ?? [])
        {
            if (h.State != InputState.Ok)
            {
                string cause = h.State == InputState.Stale ? $"input {h.Tag} stale (older than its maxAge)" : $"input {h.Tag} has no value yet";
                causes[cause] = causes.GetValueOrDefault(cause) + 1;
                any = true;
            }
        }

        if (!any)
        {
            var worst = frame.Values.OrderByDescending(v => v.Quality).FirstOrDefault();
            string cause = $"{worst.Name}: {StatusCodes.NameOf(worst.StatusCode) ?? $"status 0x{worst.StatusCode:X8}"}";
            causes[cause] = causes.GetValueOrDefault(cause) + 1;
        }
    }
}
