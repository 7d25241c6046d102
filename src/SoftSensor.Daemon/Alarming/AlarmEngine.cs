using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Alarming;

/// <summary>One reactor's changes of one evaluation or command, ready to journal and publish.</summary>
internal sealed record AlarmChanges(string Reactor, IReadOnlyList<(AlarmTransition Transition, AlarmRule Rule, AlarmStatus Status)> Items);

/// <summary>
/// The alarm rules applied to every reactor: one <see cref="AlarmEvaluator"/> per reactor, created
/// on its first frame and restored from the journal. Serialises evaluations and commands per
/// reactor (a lock), so the frame task and an operator command never race. Thread-safe.
/// </summary>
internal sealed class AlarmEngine
{
    private readonly AlarmRuleSet _rules;
    private readonly Func<string, IReadOnlyList<AlarmStatus>> _restore;
    private readonly Dictionary<string, Reactor> _reactors = new(StringComparer.Ordinal);
    private readonly Lock _gate = new();

    /// <summary>Creates the engine; <paramref name="restore"/> gives a reactor's saved statuses.</summary>
    public AlarmEngine(AlarmRuleSet rules, Func<string, IReadOnlyList<AlarmStatus>> restore)
    {
        if (rules.Errors.Count > 0)
        {
            throw new ArgumentException(string.Join(Environment.NewLine, rules.Errors), nameof(rules));
        }

        _rules = rules;
        _restore = restore;
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
        var r = Get(frame.Reactor, frame.SourceTime);
        lock (r)
        {
            r.Snapshot.Clear();
            r.Snapshot.AddFrame(frame);
            addSignals?.Invoke(r.Snapshot);
            r.Buffer.Clear();
            r.Evaluator.Evaluate(r.Snapshot, r.Buffer);
            return Pack(frame.Reactor, r, r.Buffer);
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
                _reactors[reactor] = r = new Reactor(evaluator);
            }

            return r;
        }
    }

    private sealed class Reactor(AlarmEvaluator evaluator)
    {
        public AlarmEvaluator Evaluator { get; } = evaluator;

        public AlarmSnapshot Snapshot { get; } = new();

        public List<AlarmTransition> Buffer { get; } = [];
    }
}
