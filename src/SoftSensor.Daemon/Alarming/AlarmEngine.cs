using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Alarming;

/// <summary>One reactor's changes of one evaluation or command, ready to journal and publish.</summary>
internal sealed record AlarmChanges(string Reactor, IReadOnlyList<(AlarmTransition Transition, AlarmRule Rule, AlarmStatus Status)> Items)
{
    /// <summary>Set when the frame's batch is not the one the states belonged to: the batch to record.</summary>
    public string? NewBatch { get; init; }

    /// <summary>The batch the states belonged to before <see cref="NewBatch"/> (null on the first frame ever: nothing was reset).</summary>
    public string? PreviousBatch { get; init; }

    /// <summary>How many alarms the new batch returned to normal.</summary>
    public int Reset { get; init; }
}

/// <summary>
/// The alarm rules applied to every reactor: one <see cref="AlarmEvaluator"/> per reactor, created
/// on its first frame and restored from the journal. Serialises evaluations and commands per
/// reactor (a lock), so the frame task and an operator command never race. Thread-safe.
/// Batches: alarm states belong to the batch of the frames that raised them; the first frame of
/// another batch id returns every alarm of that reactor to normal (<see cref="AlarmEvaluator.BeginBatch"/>)
/// before it is evaluated, in frame order, so no late frame of the old batch re-raises them.
/// </summary>
internal sealed class AlarmEngine
{
    private readonly AlarmRuleSet _rules;
    private readonly Func<string, IReadOnlyList<AlarmStatus>> _restore;
    private readonly Func<string, string?> _restoreBatch;
    private readonly Dictionary<string, Reactor> _reactors = new(StringComparer.Ordinal);
    private readonly Lock _gate = new();

    /// <summary>Creates the engine; <paramref name="restore"/> gives a reactor's saved statuses, <paramref name="restoreBatch"/> the batch they belong to.</summary>
    public AlarmEngine(AlarmRuleSet rules, Func<string, IReadOnlyList<AlarmStatus>> restore, Func<string, string?>? restoreBatch = null)
    {
        if (rules.Errors.Count > 0)
        {
            throw new ArgumentException(string.Join(Environment.NewLine, rules.Errors), nameof(rules));
        }

        _rules = rules;
        _restore = restore;
        _restoreBatch = restoreBatch ?? (_ => null);
    }

    /// <summary>The rules.</summary>
    public IReadOnlyList<AlarmRule> Rules => _rules.Rules;

    /// <summary>The reactors seen so far.</summary>
    public IReadOnlyList<string> ReactorIds
    {
        get
        {
            lock (_gate)
            {
                return [.. _reactors.Keys.Order(StringComparer.Ordinal)];
            }
        }
    }

    /// <summary>Evaluates the rules of a frame's reactor on the frame, its inputs and further signals.</summary>
    public AlarmChanges Evaluate(EstimateFrame frame, Action<AlarmSnapshot>? addSignals)
    {
        var r = Get(frame.Reactor, frame.Time);
        lock (r)
        {
            r.Buffer.Clear();
            string? previous = r.Batch;
            bool newBatch = previous != frame.BatchId;
            int reset = newBatch && previous is not null ? r.Evaluator.BeginBatch(frame.Time, r.Buffer) : 0;
            r.Batch = frame.BatchId;
            r.Snapshot.Clear();
            r.Snapshot.AddFrame(frame);
            addSignals?.Invoke(r.Snapshot);
            r.Evaluator.Evaluate(r.Snapshot, r.Buffer);
            var changes = Pack(frame.Reactor, r, r.Buffer);
            return newBatch ? changes with { NewBatch = frame.BatchId, PreviousBatch = previous, Reset = reset } : changes;
        }
    }

    /// <summary>Applies an operator command to one reactor's alarms.</summary>
    public (AlarmCommandResult Result, AlarmChanges Changes) Apply(string reactor, AlarmCommand command)
    {
        Reactor? r;
        lock (_gate)
        {
            _reactors.TryGetValue(reactor, out r);
        }

        if (r is null)
        {
            var known = ReactorIds;
            return (AlarmCommandResult.Refused($"reactor '{reactor}' has no alarms yet (known: {(known.Count == 0 ? "none" : string.Join(", ", known))})"), new AlarmChanges(reactor, []));
        }

        lock (r)
        {
            var result = r.Evaluator.Apply(command);
            return (result, Pack(reactor, r, result.Transitions));
        }
    }

    /// <summary>The state documents of every alarm of every reactor.</summary>
    public IReadOnlyList<AlarmStateDocument> States()
    {
        var list = new List<AlarmStateDocument>();
        foreach (var id in ReactorIds)
        {
            Reactor r;
            lock (_gate)
            {
                r = _reactors[id];
            }

            lock (r)
            {
                list.AddRange(r.Evaluator.Statuses.Select(s => AlarmPayloads.State(id, r.Evaluator.RuleOf(s.RuleId)!, s)));
            }
        }

        return list;
    }

    private static AlarmChanges Pack(string reactor, Reactor r, IReadOnlyList<AlarmTransition> transitions) =>
        new(reactor, [.. transitions.Select(t => (t, r.Evaluator.RuleOf(t.RuleId)!, r.Evaluator.StatusOf(t.RuleId)!))]);

    private Reactor Get(string reactor, DateTimeOffset start)
    {
        lock (_gate)
        {
            if (!_reactors.TryGetValue(reactor, out var r))
            {
                var evaluator = new AlarmEvaluator(_rules.Rules, _rules.MaxShelve, start);
                evaluator.Restore(_restore(reactor));
                _reactors[reactor] = r = new Reactor(evaluator) { Batch = _restoreBatch(reactor) };
            }

            return r;
        }
    }

    private sealed class Reactor(AlarmEvaluator evaluator)
    {
        public AlarmEvaluator Evaluator { get; } = evaluator;

        public AlarmSnapshot Snapshot { get; } = new();

        public List<AlarmTransition> Buffer { get; } = [];

        /// <summary>The batch the states belong to (null until known).</summary>
        public string? Batch { get; set; }
    }
}
