using SoftSensor.Core.Estimation;
using SoftSensor.Core.Signals;
using SoftSensor.Core.Stoichiometry;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// The full estimator's cycle: the same <see cref="Cycle"/> the replay runs (gas balance, elemental
/// balance with its consistency test, growth rate, biomass, feed advisory; docs/methods.md) on the
/// aligned inputs, flattened by <see cref="EstimateFrames"/>. Its state (biomass, volume, history)
/// is checkpointed with <see cref="EstimatorStateCodec"/> so a restart resumes. Operator inputs (offline
/// samples, withdrawals) reach it through <see cref="Samples.IOfflineInputTarget"/> on the cycle task.
/// </summary>
internal sealed class EstimatorCycle : IReactorCycle, Samples.IOfflineInputTarget
{
    private static readonly SignalRole[] EstimatorRoles =
    [
        SignalRole.FeedRateLPerH, SignalRole.BaseRateLPerH, SignalRole.WeightKg, SignalRole.DissolvedOxygenPercent,
    ];

    private static readonly SignalRole[] HeatRoles =
    [
        SignalRole.CoolantFlowLPerH, SignalRole.CoolantInletTemperatureC, SignalRole.CoolantOutletTemperatureC, SignalRole.StirrerPowerW, SignalRole.StirrerSpeedRpm,
    ];

    private readonly Cycle _cycle;
    private readonly GasInputs _gas;
    private readonly CycleOutputs _outputs = new();
    private EstimatorState _state;

    public EstimatorCycle(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings, StoichiometricModel model, Core.Flux.PathwayStage? pathway = null)
    {
        _gas = new GasInputs(reactor, bindings, reactor.Heat is null ? EstimatorRoles : [.. EstimatorRoles, .. HeatRoles]);
        _cycle = new Cycle(model, EstimatorSetup.Settings(_gas.Settings, reactor.Estimator, reactor.Balance), pathway, reactor.Heat);
        _state = _cycle.NewState();
    }

    public CycleOutput Run(AlignedInputs inputs, ReadOnlySpan<InputHealth> health)
    {
        _gas.Prepare(inputs);
        _cycle.Run(inputs, _state, _outputs);
        var values = EstimateFrames.Values(_outputs);
        var flags = _gas.FlagsOf(health);
        for (int i = 0; i < values.Length; i++)
        {
            var v = values[i];
            bool ownCode = v.Quality == SampleQuality.Uncertain && v.StatusCode != EstimateFrames.CodeOf(v.Quality);
            if (v.Quality != SampleQuality.Good && !ownCode)
            {
                values[i] = v with { StatusCode = _gas.Code(flags, v.Quality, health) };
            }
        }

        return new CycleOutput(values, _gas.NewestUsed(health));
    }

    public DateTimeOffset? ReachedAt => _state.Initialised ? new DateTimeOffset(_state.TimeTicks, TimeSpan.Zero) : null;

    public OfflineCorrection ApplySample(in OfflineSample sample) => OfflineCorrections.ApplySample(_state, sample, _cycle.Settings.Estimator);

    public OfflineCorrection ApplyRemoval(DateTimeOffset at, double volumeL) =>
        OfflineCorrections.ApplyRemoval(_state, at, volumeL, _outputs.VolumeSource == VolumeSource.Integrated, _cycle.Settings.Estimator);

    public string? SaveState() => CheckpointCompression.Pack(EstimatorStateCodec.Encode(_state));

    public void RestoreState(string state)
    {
        if (!EstimatorStateCodec.TryDecode(CheckpointCompression.Unpack(state), out var restored, out var error))
        {
            throw new FormatException($"estimator checkpoint: {error}");
        }

        _state = restored!;
    }

    public void BeginBatch(in BatchInitialConditions initial) => _state = _cycle.NewState(initial);
}

/// <summary>
/// Makes each reactor's cycle: the <see cref="EstimatorCycle"/> when its <c>modelFile</c> is set,
/// else the <see cref="OffGasCycle"/>. A relative model path is looked up beside the configuration
/// file, then from the working folder and the program's folder upwards (as the demo finds its files).
/// </summary>
internal sealed class ReactorCycleFactory(ConfigLocation? location = null) : IReactorCycleFactory
{
    public IReactorCycle Create(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings)
    {
        if (string.IsNullOrWhiteSpace(reactor.ModelFile))
        {
            return new OffGasCycle(reactor, bindings);
        }

        string key = $"reactor '{reactor.Id}' modelFile";
        string? path = Resolve(reactor.ModelFile);
        if (path is null)
        {
            throw new InvalidOperationException($"{key} is '{reactor.ModelFile}'; expected an existing model file (looked beside the configuration file{(location is null ? string.Empty : $" {location.Folder}")} and upwards from the working folder)");
        }

        if (!EstimatorSetup.TryLoadModel(path, out var model, out var error))
        {
            throw new InvalidOperationException($"{key}: {error}");
        }

        try
        {
            return new EstimatorCycle(reactor, bindings, model!, Pathway(reactor, bindings));
        }
        catch (ArgumentException e)
        {
            throw new InvalidOperationException($"{key} '{path}': {e.Message}", e);
        }
    }

    /// <summary>The pathway stage of <c>pathwayModelFile</c> (null when empty); checks the heat section's roles.</summary>
    private Core.Flux.PathwayStage? Pathway(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings)
    {
        if (reactor.Heat is not null)
        {
            string hk = $"reactor '{reactor.Id}' heat";
            bool Has(SignalRole r) => bindings.Any(b => b.Role == r);
            var missing = new[] { SignalRole.CoolantFlowLPerH, SignalRole.CoolantInletTemperatureC, SignalRole.CoolantOutletTemperatureC }.Where(r => !Has(r)).ToList();
            if (missing.Count > 0)
            {
                throw new InvalidOperationException($"{hk} is set; expected tags with the roles {string.Join(", ", missing)}");
            }

            if (!Has(SignalRole.StirrerPowerW) && !(Has(SignalRole.StirrerSpeedRpm) && !double.IsNaN(reactor.Heat.PowerNumber)))
            {
                throw new InvalidOperationException($"{hk} is set; expected a tag with role StirrerPowerW, or StirrerSpeedRpm with heat:powerNumber and heat:impellerDiameterM");
            }
        }

        if (string.IsNullOrWhiteSpace(reactor.PathwayModelFile))
        {
            return null;
        }

        string key = $"reactor '{reactor.Id}' pathwayModelFile";
        string path = Resolve(reactor.PathwayModelFile)
            ?? throw new InvalidOperationException($"{key} is '{reactor.PathwayModelFile}'; expected an existing flux model file (looked beside the configuration file and upwards from the working folder)");
        try
        {
            return new Core.Flux.PathwayStage(Core.Flux.FluxModel.Load(File.ReadAllText(path)), reactor.Pathway);
        }
        catch (Exception e) when (e is Core.Flux.FluxModelException or ArgumentException)
        {
            throw new InvalidOperationException($"{key} '{path}': {e.Message}", e);
        }
    }

    private string? Resolve(string file)
    {
        if (Path.IsPathRooted(file))
        {
            return File.Exists(file) ? file : null;
        }

        if (location is not null && File.Exists(Path.Combine(location.Folder, file)))
        {
            return Path.GetFullPath(Path.Combine(location.Folder, file));
        }

        return Demo.DemoFiles.Find(file);
    }
}

/// <summary>The folder of the <c>--config</c> file (relative paths in it resolve against it).</summary>
internal sealed record ConfigLocation(string Folder);
