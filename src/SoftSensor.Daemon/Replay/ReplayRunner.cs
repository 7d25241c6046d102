using Microsoft.Extensions.Logging;
using SoftSensor.Core.Estimation;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Replay;

/// <summary>Options of one replay run.</summary>
/// <param name="StopAfter">Stop after the first cycle at or after this time (for a save-and-resume); null runs to the end.</param>
/// <param name="Resume">A saved state to continue from: cycles up to its time are not run again.</param>
/// <param name="Progress">Called now and then with the bytes of the history file read so far.</param>
internal sealed record ReplayOptions(DateTimeOffset? StopAfter = null, EstimatorState? Resume = null, Action<long>? Progress = null);

/// <summary>What a replay did.</summary>
internal sealed record ReplayResult(
    long Rows,
    long Cycles,
    long SkippedRows,
    IReadOnlyList<SkippedRow> FirstSkipped,
    long SamplesApplied,
    EstimatorState State,
    ReplaySeries Series,
    IReadOnlyList<ScheduledSample> Samples,
    bool Stopped);

/// <summary>
/// Replays a historian export through the same <see cref="Cycle"/> the daemon runs: each good row
/// → analyser dead-time alignment → cycle → estimates.csv. Offline samples are applied when their
/// result arrives (at their sampling time, in the past); the broth they took is removed at the
/// sampling time. Malformed rows are skipped, counted and logged with their line number; the
/// replay never stops on them.
/// </summary>
internal sealed class ReplayRunner(Cycle cycle, ILogger logger, int maxLoggedSkips = 50)
{
    private const int ProgressEveryRows = 4096;

    public ReplayResult Run(string historyName, Stream history, CsvLayout layout, IReadOnlyList<ScheduledSample> samples,
        EstimatesCsvWriter? estimates, ReplaySeries series, ReplayOptions options, CancellationToken cancellationToken)
    {
        using var reader = new CsvLineReader(history);
        if (!reader.TryReadLine(out var header))
        {
            throw new ReplayInputException($"history file '{historyName}' is empty; expected a header line");
        }

        if (!HistoryRowParser.TryCreate(layout, header, out var parser, out var error))
        {
            throw new ReplayInputException(error!);
        }

        var state = options.Resume ?? cycle.NewState();
        long resumeTicks = options.Resume is { Initialised: true } r ? r.TimeTicks : long.MinValue;
        if (resumeTicks != long.MinValue)
        {
            ReplayLog.Resuming(logger, new DateTimeOffset(resumeTicks, TimeSpan.Zero), state.Cycles);
        }

        var est = cycle.Settings.Estimator;
        var alignment = new AnalyserAlignment(est.AnalyserDeadTimeS, 4096);
        var row = new AlignedInputs();
        var aligned = new AlignedInputs();
        var outputs = new CycleOutputs();
        var skipped = new List<SkippedRow>();
        long rows = 0, skippedCount = 0, cycles = 0, applied = 0;
        int nextRemoval = 0, nextResult = 0;
        bool stopped = false;

        // Samples already taken into the saved state are not applied twice.
        while (nextRemoval < samples.Count && samples[nextRemoval].Sample.SampledAt.UtcTicks <= resumeTicks)
        {
            nextRemoval++;
        }

        while (nextResult < samples.Count && samples[nextResult].ArrivesAt.UtcTicks <= resumeTicks)
        {
            nextResult++;
        }

        while (reader.TryReadLine(out var line))
        {
            var outcome = parser!.Parse(line, row);
            if (outcome == RowOutcome.Blank)
            {
                continue;
            }

            rows++;
            if (outcome != RowOutcome.Ok)
            {
                skippedCount++;
                if (skipped.Count < maxLoggedSkips)
                {
                    var s = new SkippedRow(historyName, reader.LineNumber, Reason(outcome));
                    skipped.Add(s);
                    ReplayLog.RowSkipped(logger, historyName, s.Line, s.Reason, parser.FaultColumn);
                }

                continue;
            }

            if ((rows % ProgressEveryRows) == 0)
            {
                cancellationToken.ThrowIfCancellationRequested();
                options.Progress?.Invoke(history.Position);
            }

            if (!alignment.Push(row, aligned) || aligned.Time.UtcTicks <= resumeTicks)
            {
                continue;
            }

            long t = aligned.Time.UtcTicks;
            while (nextRemoval < samples.Count && samples[nextRemoval].Sample.SampledAt.UtcTicks <= t)
            {
                state.RegisterRemoval(samples[nextRemoval].WithdrawnL);
                nextRemoval++;
            }

            cycle.Run(aligned, state, outputs);
            cycles++;
            estimates?.Write(outputs);
            series.Add(outputs, aligned[SignalRole.FeedRateLPerH]);

            while (nextResult < samples.Count && samples[nextResult].ArrivesAt.UtcTicks <= t)
            {
                var sample = samples[nextResult];
                var result = cycle.ApplyOfflineSample(state, sample.Sample);
                if (result == OfflineSampleOutcome.Applied)
                {
                    applied++;
                }
                else
                {
                    ReplayLog.SampleNotApplied(logger, sample.Sample.SampledAt, sample.LineNumber, result.ToString());
                }

                nextResult++;
            }

            if (options.StopAfter is { } stop && aligned.Time >= stop)
            {
                stopped = true;
                break;
            }
        }

        if (skippedCount > skipped.Count)
        {
            ReplayLog.MoreRowsSkipped(logger, historyName, skippedCount - skipped.Count);
        }

        options.Progress?.Invoke(history.CanSeek ? history.Position : 0);
        ReplayLog.Finished(logger, historyName, rows, skippedCount, cycles, applied);
        return new ReplayResult(rows, cycles, skippedCount, skipped, applied, state, series, samples, stopped);
    }

    internal static string Reason(RowOutcome outcome) => outcome switch
    {
        RowOutcome.MissingCell => "missing cell",
        RowOutcome.NotANumber => "text in a numeric column",
        RowOutcome.BadTimestamp => "timestamp not in the configured format",
        RowOutcome.TimeNotIncreasing => "timestamp not after the previous row's",
        _ => outcome.ToString(),
    };
}

/// <summary>A replay input that cannot be read at all (no header, a mapping that does not fit); the message names the field.</summary>
internal sealed class ReplayInputException : Exception
{
    public ReplayInputException(string message)
        : base(message)
    {
    }

    public ReplayInputException()
    {
    }

    public ReplayInputException(string message, Exception innerException)
        : base(message, innerException)
    {
    }
}
