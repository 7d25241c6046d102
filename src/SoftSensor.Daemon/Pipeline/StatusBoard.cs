using System.Collections.Concurrent;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>The latest cycle of one reactor, as the status page shows it (immutable).</summary>
internal sealed record ReactorSnapshot(
    string Reactor,
    long Cycle,
    DateTimeOffset CycleTime,
    EstimateFrame? Frame,
    IReadOnlyList<InputHealth> Inputs);

/// <summary>
/// The latest snapshot of every reactor, for the status page and the JSON API. Pipelines replace
/// their own entry after each cycle; readers get a consistent immutable snapshot. Thread-safe.
/// </summary>
internal sealed class StatusBoard
{
    private readonly ConcurrentDictionary<string, ReactorSnapshot> _reactors = new(StringComparer.Ordinal);

    /// <summary>Raised after a snapshot was replaced (the demo prints one line per cycle from it).</summary>
    public event Action<ReactorSnapshot>? Updated;

    /// <summary>Every reactor's snapshot, ordered by id.</summary>
    public IReadOnlyList<ReactorSnapshot> All => [.. _reactors.Values.OrderBy(r => r.Reactor, StringComparer.Ordinal)];

    /// <summary>One reactor's snapshot, or null.</summary>
    public ReactorSnapshot? Get(string reactor) => _reactors.TryGetValue(reactor, out var s) ? s : null;

    /// <summary>Replaces a reactor's snapshot.</summary>
    public void Publish(ReactorSnapshot snapshot)
    {
        _reactors[snapshot.Reactor] = snapshot;
        Updated?.Invoke(snapshot);
    }
}
