using Microsoft.Extensions.Logging;
using SoftSensor.Core.Estimation;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Samples;

/// <summary>
/// Applies a reactor's pending operator inputs on its pipeline's cycle task, before the cycle runs (so
/// an application never races a cycle): inputs of another batch are closed, those sampled after the
/// last cycle wait, the others go to the estimator at their sampling time (the withdrawal first, then
/// the assay of the same broth). Each resolution is stored with the checkpoint taken after it.
/// </summary>
internal static class SampleApplier
{
    /// <summary>Applies what can be applied now; true when the estimator state changed.</summary>
    public static bool ApplyPending(SampleBook book, string reactor, string batch, IReactorCycle cycle, Func<string?, Checkpoint?> checkpoint, ILogger logger)
    {
        if (!book.HasPending(reactor))
        {
            return false;
        }

        bool changed = false;
        var target = cycle as IOfflineInputTarget;
        foreach (var p in book.Pending(reactor))
        {
            if (p.Batch != batch)
            {
                Close(book, p, SampleOutcomes.BatchEnded, $"entered for batch '{p.Batch}'; reactor '{reactor}' now runs '{batch}'", logger);
                continue;
            }

            if (target is null)
            {
                Close(book, p, SampleOutcomes.Unsupported, $"reactor '{reactor}' runs no biomass estimator (no modelFile)", logger);
                continue;
            }

            if (target.ReachedAt is not { } reached || p.SampledAt > reached)
            {
                continue; // waits for a cycle at or after its sampling time
            }

            OfflineCorrection? removal = null;
            if (p.WithdrawnL > 0)
            {
                removal = target.ApplyRemoval(p.SampledAt, p.WithdrawnL);
                changed |= removal.Outcome == OfflineSampleOutcome.Applied;
            }

            var result = removal;
            if (p.Kind is "dcw" or "od" && p.ValueGPerL is { } x && p.SigmaGPerL is { } s)
            {
                result = target.ApplySample(new OfflineSample(p.SampledAt, x, s));
                changed |= result.Outcome == OfflineSampleOutcome.Applied;
            }

            if (result is null)
            {
                continue;
            }

            var (outcome, detail) = Describe(result, removal, p);
            var resolved = book.Resolve(p, outcome, detail, result, result.Outcome == OfflineSampleOutcome.Applied || removal?.Outcome == OfflineSampleOutcome.Applied ? checkpoint(cycle.SaveState()) : null);
            SampleLog.Resolved(logger, reactor, resolved.Id, resolved.Kind, resolved.SampledAt, resolved.Outcome, resolved.Detail ?? "");
        }

        return changed;
    }

    private static (string Outcome, string? Detail) Describe(OfflineCorrection result, OfflineCorrection? removal, SampleRecord p)
    {
        string? removed = removal is null || ReferenceEquals(result, removal) ? null
            : removal.Outcome == OfflineSampleOutcome.Applied ? $"{p.WithdrawnL * 1000:0.###} mL withdrawn taken out" : $"withdrawal not applied ({removal.Outcome})";
        string? Join(string? a) => removed is null ? a : a is null ? removed : a + "; " + removed;
        return result.Outcome switch
        {
            OfflineSampleOutcome.Applied => (SampleOutcomes.Applied, Join($"applied at the cycle of {p.SampledAt:O} or just before, re-propagated over {result.Trajectory.Count} kept cycles")),
            OfflineSampleOutcome.TooOld => (SampleOutcomes.TooOld, Join("sampled before the oldest cycle the estimator keeps (estimator.historyCapacity)")),
            _ => (SampleOutcomes.Invalid, Join($"the estimator refused it ({result.Outcome})")),
        };
    }

    private static void Close(SampleBook book, SampleRecord p, string outcome, string detail, ILogger logger)
    {
        var r = book.Resolve(p, outcome, detail, null, null);
        SampleLog.Resolved(logger, r.Reactor, r.Id, r.Kind, r.SampledAt, r.Outcome, detail);
    }
}

/// <summary>Log messages of the operator inputs (event ids 1700–1719).</summary>
internal static partial class SampleLog
{
    [LoggerMessage(1700, LogLevel.Information, "Reactor {Reactor}: operator input {Id} ({Kind}, sampled {SampledAt:o}) {Outcome}. {Detail}")]
    public static partial void Resolved(ILogger logger, string reactor, long id, string kind, DateTimeOffset sampledAt, string outcome, string detail);

    [LoggerMessage(1701, LogLevel.Warning, "Reactor {Reactor}: operator input refused from {Path}: {Problems}")]
    public static partial void Refused(ILogger logger, string reactor, string path, string problems);

    [LoggerMessage(1702, LogLevel.Information, "Reactor {Reactor}: operator input {Id} ({Kind}, sampled {SampledAt:o}) stored as {Outcome}")]
    public static partial void Entered(ILogger logger, string reactor, long id, string kind, DateTimeOffset sampledAt, string outcome);
}
