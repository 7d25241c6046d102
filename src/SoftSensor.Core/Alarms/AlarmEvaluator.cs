namespace SoftSensor.Core.Alarms;

/// <summary>
/// Runs a set of alarm rules: per rule the test (<see cref="ConditionDetector"/>), the delays
/// (<see cref="DelayFilter"/>) and the ISA-18.2 states (<see cref="AlarmStateMachine"/>); takes
/// operator commands. Pure and single-threaded: the caller serialises evaluations and commands.
/// </summary>
public sealed class AlarmEvaluator
{
    private readonly Dictionary<string, Point> _points = new(StringComparer.Ordinal);
    private readonly List<Point> _ordered = [];

    /// <summary>Creates the evaluator; throws <see cref="ArgumentException"/> listing every problem of the rules.</summary>
    /// <param name="rules">The rules.</param>
    /// <param name="maxShelve">The longest shelve allowed (ANSI/ISA-18.2 asks for time-limited shelving).</param>
    /// <param name="start">The time the alarms start in state A.</param>
    public AlarmEvaluator(IReadOnlyList<AlarmRule> rules, TimeSpan maxShelve, DateTimeOffset start)
    {
        var errors = AlarmRuleValidation.Validate(rules).ToList();
        if (maxShelve <= TimeSpan.Zero)
        {
            errors.Add($"maxShelve is {maxShelve}, expected a duration above zero");
        }

        if (errors.Count > 0)
        {
            throw new ArgumentException(string.Join(Environment.NewLine, errors), nameof(rules));
        }

        MaxShelve = maxShelve;
        Rules = rules;
        foreach (var rule in rules)
        {
            var point = new Point(rule, start);
            _points.Add(rule.Id, point);
            _ordered.Add(point);
        }
    }

    /// <summary>The rules, in configuration order.</summary>
    public IReadOnlyList<AlarmRule> Rules { get; }

    /// <summary>The longest shelve allowed.</summary>
    public TimeSpan MaxShelve { get; }

    /// <summary>The rule with this id, when configured.</summary>
    public AlarmRule? RuleOf(string id) => _points.TryGetValue(id, out var p) ? p.Rule : null;

    /// <summary>Every alarm's status, in configuration order.</summary>
    public IEnumerable<AlarmStatus> Statuses => _ordered.Select(p => p.Machine.Status);

    /// <summary>One alarm's status.</summary>
    public AlarmStatus? StatusOf(string id) => _points.TryGetValue(id, out var p) ? p.Machine.Status : null;

    /// <summary>Evaluates every rule on a snapshot and appends the transitions to <paramref name="transitions"/>; returns how many.</summary>
    public int Evaluate(AlarmSnapshot snapshot, List<AlarmTransition> transitions)
    {
        int before = transitions.Count;
        foreach (var p in _ordered)
        {
            var reading = p.Detector.Evaluate(snapshot);
            bool suppressed = p.Rule.SuppressesWhenBad && reading.SignalBad;
            bool condition;
            if (suppressed)
            {
                p.Delay.Reset(false);
                condition = false;
            }
            else
            {
                condition = reading.Outcome == ConditionOutcome.Unknown
                    ? p.Delay.Hold()
                    : p.Delay.Update(reading.Outcome == ConditionOutcome.Present, snapshot.Time);
            }

            if (p.Machine.Step(snapshot.Time, condition, suppressed, reading.Value) is { } t)
            {
                transitions.Add(t);
            }
        }

        return transitions.Count - before;
    }

    /// <summary>Applies an operator command; an unknown rule or an inapplicable state is a refusal, not an exception.</summary>
    public AlarmCommandResult Apply(AlarmCommand command)
    {
        if (command.RuleId == AlarmCommand.AllRules && command.Kind == AlarmCommandKind.Acknowledge)
        {
            var all = new List<AlarmTransition>();
            foreach (var p in _ordered)
            {
                if (p.Machine.State is AlarmState.Unacknowledged or AlarmState.ReturnedUnacknowledged
                    && p.Machine.Acknowledge(command.Time, command.Operator, out _) is { } t)
                {
                    all.Add(t);
                }
            }

            return new AlarmCommandResult(true, all, $"acknowledged {all.Count} alarm(s)");
        }

        if (!_points.TryGetValue(command.RuleId, out var point))
        {
            return AlarmCommandResult.Refused($"no alarm rule '{command.RuleId}'");
        }

        var m = point.Machine;
        string refusal;
        AlarmTransition? transition;
        switch (command.Kind)
        {
            case AlarmCommandKind.Acknowledge:
                transition = m.Acknowledge(command.Time, command.Operator, out refusal);
                break;
            case AlarmCommandKind.Shelve:
                if (command.ShelveFor is not { } span || span <= TimeSpan.Zero || span > MaxShelve)
                {
                    return AlarmCommandResult.Refused($"alarm '{command.RuleId}': shelve duration {command.ShelveFor?.ToString() ?? "(none)"} must be above zero and at most {MaxShelve}");
                }

                transition = m.Shelve(command.Time, command.Time + span, command.Operator, out refusal);
                break;
            case AlarmCommandKind.Unshelve:
                transition = m.Unshelve(command.Time, command.Operator, out refusal);
                break;
            case AlarmCommandKind.RemoveFromService:
                transition = m.RemoveFromService(command.Time, command.Operator, out refusal);
                break;
            case AlarmCommandKind.ReturnToService:
                transition = m.ReturnToService(command.Time, command.Operator, out refusal);
                break;
            default:
                return AlarmCommandResult.Refused($"unknown command {(int)command.Kind}");
        }

        return transition is null
            ? AlarmCommandResult.Refused(refusal)
            : new AlarmCommandResult(true, [transition], $"alarm '{command.RuleId}' {AlarmStates.Id(transition.From)} -> {AlarmStates.Id(transition.To)}");
    }

    /// <summary>
    /// A new batch began at <paramref name="time"/>: every alarm's process state returns to normal and its
    /// delays and detection windows restart (<see cref="AlarmStateMachine.BeginBatch"/>); appends the transitions, returns how many.
    /// </summary>
    public int BeginBatch(DateTimeOffset time, List<AlarmTransition> transitions)
    {
        int before = transitions.Count;
        foreach (var p in _ordered)
        {
            p.Delay.Reset(false);
            p.Detector = new ConditionDetector(p.Rule); // rate and flat-line windows start over
            if (p.Machine.BeginBatch(time) is { } t)
            {
                transitions.Add(t);
            }
        }

        return transitions.Count - before;
    }

    /// <summary>Restores saved states (after a restart); statuses of rules no longer configured are ignored.</summary>
    public void Restore(IEnumerable<AlarmStatus> statuses)
    {
        foreach (var s in statuses)
        {
            if (_points.TryGetValue(s.RuleId, out var p))
            {
                p.Machine.Restore(s);
                p.Delay.Reset(s.ConditionPresent);
            }
        }
    }

    private sealed class Point(AlarmRule rule, DateTimeOffset start)
    {
        public AlarmRule Rule { get; } = rule;

        public ConditionDetector Detector { get; set; } = new(rule);

        public DelayFilter Delay { get; } = new(rule.OnDelay, rule.OffDelay);

        public AlarmStateMachine Machine { get; } = new(rule.Id, rule.Priority, start);
    }
}
