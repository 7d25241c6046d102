using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Pipeline;

namespace SoftSensor.Daemon.Alarming;

/// <summary>
/// Gives the alarm rules the cycle's inputs: the status board's snapshot of the cycle that made a
/// frame (matched by reference; the newest one when the board has moved on) supplies every input
/// by role (<c>input:OutletO2Percent</c>) and by tag (<c>tag:R1.OFFGAS.O2</c>), with the quality the
/// cycle saw (stale inputs are bad). Thread-safe: the board raises its event on pipeline tasks.
/// </summary>
internal sealed class AlarmInputSignals : IAlarmSignalSource, IDisposable
{
    private const int Keep = 16;
    private readonly StatusBoard _board;
    private readonly Dictionary<string, Queue<ReactorSnapshot>> _recent = new(StringComparer.Ordinal);
    private readonly Lock _gate = new();

    public AlarmInputSignals(StatusBoard board)
    {
        _board = board;
        _board.Updated += OnUpdated;
    }

    public void AddSignals(EstimateFrame frame, AlarmSnapshot snapshot)
    {
        ReactorSnapshot? match = null;
        lock (_gate)
        {
            if (_recent.TryGetValue(frame.Reactor, out var q))
            {
                match = q.FirstOrDefault(s => ReferenceEquals(s.Frame, frame)) ?? q.LastOrDefault();
            }
        }

        match ??= _board.Get(frame.Reactor);
        if (match is null)
        {
            return;
        }

        foreach (var input in match.Inputs)
        {
            snapshot.Set(SignalRef.Input(input.Role), input.Value, input.Quality);
            snapshot.Set(SignalRef.Tag(input.Tag), input.Value, input.Quality);
        }
    }

    public void Dispose() => _board.Updated -= OnUpdated;

    private void OnUpdated(ReactorSnapshot s)
    {
        lock (_gate)
        {
            if (!_recent.TryGetValue(s.Reactor, out var q))
            {
                _recent[s.Reactor] = q = new Queue<ReactorSnapshot>(Keep + 1);
            }

            q.Enqueue(s);
            while (q.Count > Keep)
            {
                q.Dequeue();
            }
        }
    }
}
