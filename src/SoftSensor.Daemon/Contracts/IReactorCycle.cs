using SoftSensor.Core.Estimation;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Contracts;

/// <summary>
/// The computation of one reactor's cycle: aligned inputs (and the estimator's own state) in,
/// estimates out. Implementations call the pure functions of SoftSensor.Core; they do no I/O.
/// Threading contract: called from its pipeline's cycle task only, one call at a time.
/// </summary>
internal interface IReactorCycle
{
    /// <summary>Runs one cycle. <paramref name="health"/> has one entry per tag of the map.</summary>
    CycleOutput Run(AlignedInputs inputs, ReadOnlySpan<InputHealth> health);

    /// <summary>The estimator state to checkpoint (JSON), or null for a stateless cycle.</summary>
    string? SaveState();

    /// <summary>Restores a checkpoint written by <see cref="SaveState"/>.</summary>
    void RestoreState(string state);

    /// <summary>
    /// A new batch: drops the estimator state (biomass and substrate integrals, volume tracking,
    /// filters, history) and starts a fresh one from <paramref name="initial"/> at the next cycle.
    /// Throws <see cref="ArgumentException"/> naming the field when the conditions are invalid.
    /// </summary>
    void BeginBatch(in BatchInitialConditions initial);
}

/// <summary>What one cycle produced: the values and the newest input source time it used (default when none).</summary>
internal sealed record CycleOutput(IReadOnlyList<EstimateValue> Values, DateTimeOffset SourceTime);

/// <summary>Makes the cycle of a configured reactor (registered in DI; the full estimator replaces the off-gas one).</summary>
internal interface IReactorCycleFactory
{
    /// <summary>The cycle for <paramref name="reactor"/>, with its compiled tag map.</summary>
    IReactorCycle Create(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings);
}
