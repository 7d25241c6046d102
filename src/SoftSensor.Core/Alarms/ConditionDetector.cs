using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Alarms;

/// <summary>
/// The test of one rule with its deadband (hysteresis: once present, a condition clears only
/// when the value is back past the threshold by the deadband, ANSI/ISA-18.2 "alarm deadband").
/// Holds the little history that rates and flat lines need. Pure: time comes from the snapshot.
/// </summary>
public sealed class ConditionDetector
{
    private const int MaxHistory = 4096;
    private readonly AlarmRule _rule;
    private readonly Queue<(DateTimeOffset Time, double Value)> _history = new();
    private bool _present;
    private DateTimeOffset? _flatSince;
    private double _flatAnchor = double.NaN;
    private DateTimeOffset? _lastTime;

    /// <summary>Creates the detector of a validated rule.</summary>
    public ConditionDetector(AlarmRule rule) => _rule = rule;

    /// <summary>Tests the rule on a snapshot.</summary>
    public ConditionReading Evaluate(AlarmSnapshot snapshot)
    {
        var time = snapshot.Time;
        if (_lastTime is { } last && time < last)
        {
            ForgetHistory();
        }

        _lastTime = time;
        bool found = snapshot.TryGet(_rule.Source, out var source);
        if (_rule.Kind == AlarmConditionKind.BadQuality)
        {
            bool bad = !found || source.Quality == SampleQuality.Bad || !double.IsFinite(source.Value)
                       || (_rule.IncludeUncertain && source.Quality == SampleQuality.Uncertain);
            _present = bad;
            return new ConditionReading(bad ? ConditionOutcome.Present : ConditionOutcome.Clear, found ? source.Value : double.NaN, false);
        }

        if (!Usable(found, source))
        {
            ForgetHistory();
            return new ConditionReading(ConditionOutcome.Unknown, found ? source.Value : double.NaN, true);
        }

        double v = source.Value;
        if (_rule.Gate is { } gate)
        {
            if (!snapshot.TryGet(gate, out var g) || !Usable(true, g))
            {
                return new ConditionReading(ConditionOutcome.Unknown, v, true);
            }

            if (!(g.Value > _rule.GateAbove))
            {
                _present = false;
                Remember(time, v);
                return new ConditionReading(ConditionOutcome.Clear, v, false);
            }
        }

        double reference = double.NaN;
        var refSignal = _rule.Reference ?? (_rule.Kind == AlarmConditionKind.Inconsistent ? SignalRef.Estimate(EstimateNames.ConsistencyCritical) : (SignalRef?)null);
        if (refSignal is { } r)
        {
            if (!snapshot.TryGet(r, out var rr) || !Usable(true, rr))
            {
                return new ConditionReading(ConditionOutcome.Unknown, v, true);
            }

            reference = rr.Value;
        }

        bool? present = Test(v, reference, time);
        if (present is not { } p)
        {
            return new ConditionReading(ConditionOutcome.Unknown, v, false);
        }

        _present = p;
        return new ConditionReading(p ? ConditionOutcome.Present : ConditionOutcome.Clear, v, false);
    }

    private static bool Usable(bool found, SignalReading r) => found && r.Quality != SampleQuality.Bad && double.IsFinite(r.Value);

    private bool? Test(double v, double reference, DateTimeOffset time)
    {
        double db = _rule.Deadband;
        switch (_rule.Kind)
        {
            case AlarmConditionKind.High or AlarmConditionKind.HighHigh:
                return Above(v, _rule.Limit, db);
            case AlarmConditionKind.Low or AlarmConditionKind.LowLow:
                return _present ? v <= _rule.Limit + db : v < _rule.Limit;
            case AlarmConditionKind.Window:
                return _present ? v <= _rule.Low + db || v >= _rule.High - db : v < _rule.Low || v > _rule.High;
            case AlarmConditionKind.Deviation:
                double sp = _rule.Reference is null ? _rule.Setpoint : reference;
                return Above(Math.Abs(v - sp), _rule.Limit, db);
            case AlarmConditionKind.AboveReference:
                return Above(v, (reference * (1 + _rule.MarginFraction)) + _rule.MarginAbsolute, db);
            case AlarmConditionKind.Inconsistent:
                return Above(v, reference, db);
            case AlarmConditionKind.RateOfChange:
                return TestRate(v, time, db);
            case AlarmConditionKind.FlatLine:
                return TestFlatLine(v, time);
            default:
                throw new InvalidOperationException($"alarm rule '{_rule.Id}': kind {_rule.Kind} has no test");
        }
    }

    private bool Above(double v, double threshold, double db) => _present ? v >= threshold - db : v > threshold;

    private bool? TestRate(double v, DateTimeOffset time, double db)
    {
        Remember(time, v);
        var start = time - _rule.RateWindow;
        while (_history.Count > 1 && _history.Peek().Time < start)
        {
            _history.Dequeue();
        }

        var (t0, v0) = _history.Peek();
        double hours = (time - t0).TotalHours;
        if (!(hours > 0))
        {
            return null;
        }

        double rate = (v - v0) / hours;
        double seen = _rule.Direction switch
        {
            RateDirection.Rising => rate,
            RateDirection.Falling => -rate,
            _ => Math.Abs(rate),
        };
        return Above(seen, _rule.Limit, db);
    }

    private bool TestFlatLine(double v, DateTimeOffset time)
    {
        if (_flatSince is null || !(Math.Abs(v - _flatAnchor) < _rule.Limit))
        {
            _flatSince = time;
            _flatAnchor = v;
        }

        return time - _flatSince.Value >= _rule.RateWindow;
    }

    private void Remember(DateTimeOffset time, double v)
    {
        if (_rule.Kind != AlarmConditionKind.RateOfChange)
        {
            return;
        }

        if (_history.Count >= MaxHistory)
        {
            _history.Dequeue();
        }

        _history.Enqueue((time, v));
    }

    private void ForgetHistory()
    {
        _history.Clear();
        _flatSince = null;
        _flatAnchor = double.NaN;
    }
}
