using SoftSensor.Core.Estimation;
using SoftSensor.Core.Flux;
using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;
using SoftSensor.Core.Stoichiometry;
using SoftSensor.Core.Tests.Flux;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Core.Tests.Pathway;

/// <summary>
/// The virtual reactor (config/scenarios, invented demo data) with a culture of its own energetics
/// driving the Core <see cref="Cycle"/> with the pathway stage and, optionally, the heat balance:
/// the tags mapped to their roles, one cycle per period. The culture is never the estimator's model:
/// its biomass composition, ATP demand, maintenance, substrate-level ATP and anabolic CO2 are its own.
/// </summary>
internal sealed class PathwayRig
{
    private readonly VirtualReactor _sim;
    private readonly Cycle _cycle;
    private readonly EstimatorState _state;
    private readonly double[] _tags;

    public PathwayRig(Scenario scenario, string estimatorModel, string pathwayModel, PathwaySettings pathway, HeatBalanceSettings? heat, int seed, bool ammoniaMeasured = true)
    {
        _sim = VirtualReactor.Create(scenario, seed);
        var model = ModelReader.Parse(File.ReadAllText(ConfigPath(estimatorModel)));
        var gas = new AlignedGasBalanceSettings(
            GasBalanceSettings.Default.WithAccuracy(new MeasurementAccuracy(0.01, 0.01, 0.5)), InstalledGasLines.Air,
            InletComposition.Measured(double.NaN, double.NaN), AnalyserBasis.Dry, double.NaN, TimeSpan.FromMinutes(5));
        var settings = new CycleSettings
        {
            Gas = gas,
            SubstrateRelativeSigma = 0.01,
            BaseAmmoniaMolPerL = ammoniaMeasured ? scenario.Base.ConcentrationMolPerL : double.NaN,
            Estimator = new EstimatorSettings
            {
                InitialBiomassGPerL = scenario.Initial.BiomassGPerL,
                InitialBiomassSigmaGPerL = 0.05,
                InitialVolumeL = scenario.Vessel.InitialVolumeL,
                BrothDensityKgPerL = scenario.Vessel.BrothDensityKgPerL,
                InitialSubstrateGPerL = scenario.Initial.SubstrateGPerL,
                FeedSubstrateGPerL = scenario.Feed.SubstrateGPerL,
                HistoryCapacity = 64,
            },
        };
        var stage = new PathwayStage(FluxModel.Load(ShippedModels.Json(pathwayModel)), pathway);
        _cycle = new Cycle(model, settings, stage, heat);
        _state = _cycle.NewState();
        _tags = new double[_sim.Tags.Count];
        Outputs = new CycleOutputs();
    }

    public CycleOutputs Outputs { get; }

    public EstimatorState State => _state;

    public VirtualReactor Sim => _sim;

    /// <summary>Steps <paramref name="period"/>, reads the tags, runs one cycle; the truth at the cycle time.</summary>
    public ReactorTruth Step(TimeSpan period)
    {
        _sim.Step(period);
        _sim.ReadTags(_tags);
        var t = _sim.Time;
        var inputs = new AlignedInputs { Time = t };
        for (int i = 0; i < _tags.Length; i++)
        {
            if (_sim.Tags[i].Role is { } role)
            {
                inputs.Set(role, _tags[i], SampleQuality.Good, t);
            }
        }

        _cycle.Run(inputs, _state, Outputs);
        return _sim.Truth();
    }

    public static string ConfigPath(string relative)
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "SoftSensor.sln")))
        {
            dir = dir.Parent;
        }

        return Path.Combine(dir?.FullName ?? throw new DirectoryNotFoundException("repository root (SoftSensor.sln) not found"), "config", relative);
    }

    /// <summary>The glycerol scenario with the culture's own energy budget and an optional P/O step.</summary>
    public static Scenario Glycerol(double? poStepAtH, double poAfter, JacketSpec? jacket = null, IReadOnlyList<FaultSpec>? faults = null)
    {
        var s = ScenarioLoader.Load(ConfigPath("scenarios/glycerol.json"));
        var energetics = new EnergeticsSpec
        {
            // The culture's own numbers: P/O at the model's 2.0 until the step; ATP per biomass 3.0
            // (the model's 2.5 plus the 0.4 its glycerol kinase costs per C-mol biomass: 2.9),
            // maintenance 2.2 mmol ATP/(g·h) (model 2.0), substrate-level ATP 0.64 per C-mol (the
            // model's pathways give 0.67), anabolic CO2 0.21 per C-mol biomass (model 0.2), and its
            // own biomass composition (CH1.77O0.49N0.24, model CH1.8O0.5N0.2).
            PoRatio = 2.0,
            AtpPerBiomassCmol = 3.0,
            MaintenanceAtpMmolPerGH = 2.2,
            SubstrateLevelAtpPerCmol = 0.64,
            AnabolicCo2PerBiomassCmol = 0.21,
            PoSteps = poStepAtH is { } at ? [new PoStep { AtH = at, PoRatio = poAfter }] : [],
        };
        return s with
        {
            Culture = s.Culture with { Energetics = energetics },
            Jacket = jacket,
            Faults = faults ?? s.Faults,
        };
    }
}
