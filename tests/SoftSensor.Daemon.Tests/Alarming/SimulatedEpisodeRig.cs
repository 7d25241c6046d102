using SoftSensor.Core.Alarms;
using SoftSensor.Core.Estimation;
using SoftSensor.Core.Signals;
using SoftSensor.Core.Stoichiometry;
using SoftSensor.Daemon.Alarming;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Tests.Alarming;

/// <summary>
/// The virtual yeast reactor (config/scenarios/yeast.json) read every 10 s, its tags aligned for
/// the analyser dead time and run through Core's cycle (the one the daemon and the replay run),
/// each cycle's estimates and inputs evaluated by the shipped alarm rules.
/// </summary>
internal sealed class SimulatedEpisodeRig
{
    private readonly VirtualReactor _reactor;
    private readonly Cycle _cycle;
    private readonly EstimatorState _state;
    private readonly AnalyserAlignment _alignment;
    private readonly AlarmEngine _engine;
    private readonly AlignedInputs _row = new();
    private readonly AlignedInputs _aligned = new();
    private readonly CycleOutputs _out = new();
    private readonly double[] _tags = new double[ReactorTags.Count];

    public SimulatedEpisodeRig(Func<Scenario, Scenario> scenarioEdit, EstimatorSettings estimator)
    {
        string root = Path.GetDirectoryName(Path.GetDirectoryName(AlarmRuleFileTests.ConfigDir))!;
        var scenario = scenarioEdit(ScenarioLoader.Load(Path.Combine(root, "config", "scenarios", "yeast.json")));
        _reactor = VirtualReactor.Create(scenario, 7);
        var model = ModelReader.Parse(File.ReadAllText(Path.Combine(root, "config", "models", "balance-yeast-sucrose.json")));
        _cycle = new Cycle(model, new CycleSettings { Estimator = estimator, BaseAmmoniaMolPerL = 13.4 });
        _state = _cycle.NewState();
        _alignment = new AnalyserAlignment(estimator.AnalyserDeadTimeS, 4096);
        var rules = AlarmRuleFile.Load(Directory.GetFiles(AlarmRuleFileTests.ConfigDir, "*.json").Order(StringComparer.Ordinal));
        _engine = new AlarmEngine(rules, _ => []);
    }

    public ReactorTruth Truth => _reactor.Truth();

    public CycleOutputs Outputs => _out;

    public AlarmEngine Engine => _engine;

    /// <summary>Advances 10 s, runs a cycle when the alignment has one, and returns the alarm transitions.</summary>
    public IReadOnlyList<AlarmTransition> Step()
    {
        _reactor.Step(TimeSpan.FromSeconds(10));
        _reactor.ReadTags(_tags);
        var now = _reactor.Time;
        _row.Clear();
        _row.Time = now;
        for (int i = 0; i < _reactor.Tags.Count; i++)
        {
            if (_reactor.Tags[i].Role is { } role)
            {
                _row.Set(role, _tags[i], SampleQuality.Good, now);
            }
        }

        if (!_alignment.Push(_row, _aligned))
        {
            return [];
        }

        _cycle.Run(_aligned, _state, _out);
        var q = _out.Quality;
        var f = _out.Feed;
        var frame = new EstimateFrame("r1", "yeast-demo", _aligned.Time, q,
        [
            new EstimateValue(EstimateNames.Our, _out.Rates.OurMmolPerLh, "mmol/(L·h)", _out.Rates.OurSigmaMmolPerLh, _out.Rates.GasQuality, 0),
            new EstimateValue(EstimateNames.Rq, _out.Rates.Rq, "1", _out.Rates.RqSigma, _out.Rates.GasQuality, 0),
            new EstimateValue(EstimateNames.MuPerH, _out.MuPerH, "1/h", double.NaN, q, 0),
            new EstimateValue(EstimateNames.BiomassGPerL, _out.BiomassGPerL, "g/L", _out.BiomassSigmaGPerL, _out.BiomassQuality, 0),
            new EstimateValue(EstimateNames.FeedAdvisoryLPerH, f.AdvisedLPerH, "L/h", double.NaN, _out.BiomassQuality, 0),
            new EstimateValue(EstimateNames.FeedCapLPerH, f.OxygenCapLPerH, "L/h", double.NaN, _out.BiomassQuality, 0),
            new EstimateValue(EstimateNames.FeedOverflowCapLPerH, f.OverflowCapLPerH, "L/h", double.NaN, _out.BiomassQuality, 0),
        ]);
        return [.. _engine.Evaluate(frame, s => s.AddInputs(_aligned)).Items.Select(i => i.Transition)];
    }
}
