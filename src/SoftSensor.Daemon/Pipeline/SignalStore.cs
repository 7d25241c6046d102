using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Contracts;
using StatusCodes = SoftSensor.OpcUa.Encoding.StatusCodes;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// The latest values of one reactor's tags with a short history each, so that a cycle at time t can
/// take each tag at t − its dead time (docs/methods.md §1.4: shift the analyser readings by the configured
/// dead time). Staleness is judged at alignment: an input whose usable value is older than its
/// maximum age is Bad (docs/methods.md §1.8). Not thread-safe: owned by one pipeline task.
/// </summary>
internal sealed class SignalStore
{
    private const int HistoryCapacity = 512;
    private readonly Dictionary<string, int> _index = new(StringComparer.Ordinal);
    private readonly TagBinding[] _bindings;
    private readonly TagHistory[] _histories;

    public SignalStore(IReadOnlyList<TagBinding> bindings)
    {
        _bindings = [.. bindings];
        _histories = new TagHistory[_bindings.Length];
        for (int i = 0; i < _bindings.Length; i++)
        {
            _index.Add(_bindings[i].Tag, i);
            _histories[i] = new TagHistory(HistoryCapacity, _bindings[i].Tag);
        }
    }

    /// <summary>The tag map, in the order of <see cref="Align"/>'s health array.</summary>
    public IReadOnlyList<TagBinding> Bindings => _bindings;

    /// <summary>Takes a sample of a mapped tag (already in the role's unit); false for an unknown tag or a non-finite value.</summary>
    public bool Accept(in Sample sample)
    {
        if (!_index.TryGetValue(sample.Tag, out int i) || !double.IsFinite(sample.Value))
        {
            return false;
        }

        _histories[i].Add(sample);
        return true;
    }

    /// <summary>
    /// Every sample still held (what later cycles can need: the last dead time of each tag, at least its
    /// newest sample), for the checkpoint: a restarted daemon then aligns the analyser readings as the
    /// stopped one would have.
    /// </summary>
    public List<Sample> Held()
    {
        var list = new List<Sample>();
        foreach (var h in _histories)
        {
            h.CopyTo(list);
        }

        return list;
    }

    /// <summary>
    /// Fills <paramref name="inputs"/> for the cycle at <paramref name="time"/> (each tag at time −
    /// dead time) and <paramref name="health"/> (one entry per binding), then drops history no
    /// later cycle can need.
    /// </summary>
    public void Align(DateTimeOffset time, AlignedInputs inputs, InputHealth[] health)
    {
        inputs.Clear();
        inputs.Time = time;
        for (int i = 0; i < _bindings.Length; i++)
        {
            var b = _bindings[i];
            var at = time - b.DeadTime;
            var h = _histories[i];
            var s = h.AtOrBefore(at);
            if (s is not { } sample)
            {
                health[i] = new InputHealth(b.Tag, b.Role, double.NaN, default, double.NaN, InputState.Waiting, SampleQuality.Bad, StatusCodes.BadWaitingForInitialData);
                continue;
            }

            var age = at - sample.SourceTime;
            bool stale = age > b.MaxAge;
            var quality = stale ? SampleQuality.Bad : sample.Quality;
            uint code = stale ? StatusCodes.BadNoCommunication : sample.StatusCode;
            health[i] = new InputHealth(b.Tag, b.Role, sample.Value, sample.SourceTime, age.TotalSeconds, stale ? InputState.Stale : InputState.Ok, quality, code);
            inputs.Set(b.Role, sample.Value, quality, sample.SourceTime);
            h.TrimBefore(at);
        }
    }
}
