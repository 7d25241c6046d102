using SoftSensor.Simulation.Faults;
using SoftSensor.Simulation.Instruments;
using SoftSensor.Simulation.Kinetics;
using SoftSensor.Simulation.Scenarios;
using SoftSensor.Simulation.Vessel;
using S = SoftSensor.Simulation.Vessel.StateIndex;

namespace SoftSensor.Simulation;

/// <summary>
/// A virtual fed-batch reactor stepped in fixed RK4 steps (classical fourth-order Runge–Kutta).
/// Deterministic for a scenario, a seed and a sequence of calls. Not thread-safe: one owner steps
/// it and reads its tags.
/// </summary>
public sealed class VirtualReactor
{
    private readonly ReactorModel _model;
    private readonly FaultSchedule _faults;
    private readonly InstrumentErrors _errors;
    private readonly GaussianSource _tagNoise;
    private readonly GaussianSource _assayNoise;
    private readonly AnalyserDelay _delay;
    private readonly JacketModel? _jacket;
    private readonly GaussianSource _jacketNoise;
    private readonly double _jacketFlowGain;
    private readonly Integrator _rk4 = new(S.Count);
    private readonly double[] _y = new double[S.Count];
    private readonly double[] _scratch = new double[S.Count];
    private readonly List<OfflineSample> _samples = [];
    private readonly double _stepH;
    private readonly double _doCalibrationMmolPerL;
    private readonly double _initialCarbonCmmol;
    private readonly double _initialInertMmol;
    private long _steps;
    private double _pendingS;
    private int _nextSample;
    private double _sampledCarbonCmmol;
    private double _sampleGasCo2Mmol;
    private double _sampleGasInertMmol;
    private double _sampledL;
    private double _lastFeedReading;

    private VirtualReactor(Scenario scenario, int seed)
    {
        Scenario = scenario;
        var culture = new CultureModel(scenario.Culture);
        _faults = new FaultSchedule(scenario.Faults);
        _model = new ReactorModel(scenario, culture, new Schedule(scenario.Feed, scenario.Gas), _faults);
        var seeds = new Random(seed);
        _errors = InstrumentErrors.Draw(scenario.Instruments, new GaussianSource(seeds.Next()));
        _tagNoise = new GaussianSource(seeds.Next());
        _assayNoise = new GaussianSource(seeds.Next());
        _stepH = scenario.IntegrationStepS / 3600.0;
        Tags = ReactorTags.For(scenario.TagPrefix, scenario.Jacket is not null);
        _jacket = scenario.Jacket is { } j ? new JacketModel(j, culture, scenario.Vessel.TemperatureC) : null;
        _jacketNoise = new GaussianSource(seeds.Next());
        _jacketFlowGain = 1 + (scenario.Jacket is { } jj ? _jacketNoise.Next(jj.FlowGainSd) : 0);

        var (_, yO2In, yCo2In, _) = _model.Inlet(0);
        double v = scenario.Vessel.InitialVolumeL;
        var init = scenario.Initial;
        _doCalibrationMmolPerL = _model.OxygenSaturation(scenario.Gas.AirO2Fraction);
        _y[S.VolumeL] = v;
        _y[S.BiomassG] = init.BiomassGPerL * v;
        _y[S.SubstrateG] = init.SubstrateGPerL * v;
        _y[S.OverflowG] = scenario.Culture.Overflow is null ? 0 : init.ProductGPerL * v;
        _y[S.OxygenMmolPerL] = init.DissolvedOxygenPercent / 100.0 * _model.OxygenSaturation(yO2In);
        _y[S.TicMmolPerL] = _model.Co2Equilibrium(yCo2In) * _model.TicPerDissolvedCo2;
        _y[S.HeadspaceO2] = yO2In;
        _y[S.HeadspaceCo2] = yCo2In;
        _delay = new AnalyserDelay((int)Math.Round(scenario.Instruments.AnalyserDeadTimeS / scenario.IntegrationStepS), yO2In, yCo2In);
        _initialCarbonCmmol = CarbonInVesselCmmol();
        _initialInertMmol = HeadspaceMol() * (1 - yO2In - yCo2In) * 1000.0;
        _lastFeedReading = 0;
    }

    /// <summary>The scenario this reactor runs.</summary>
    public Scenario Scenario { get; }

    /// <summary>The tags <see cref="ReadTags(Span{double})"/> fills, in order.</summary>
    public IReadOnlyList<TagInfo> Tags { get; }

    /// <summary>Hours since the start of the run.</summary>
    public double ElapsedH => _steps * _stepH;

    /// <summary>The reactor's clock (UTC): scenario start plus the integrated time.</summary>
    public DateTimeOffset Time => Scenario.StartTime + TimeSpan.FromSeconds(_steps * (double)Scenario.IntegrationStepS);

    /// <summary>The offline samples taken so far.</summary>
    public IReadOnlyList<OfflineSample> OfflineSamples => _samples;

    /// <summary>Creates a reactor at the scenario's start; <paramref name="seed"/> fixes instrument errors and noise.</summary>
    public static VirtualReactor Create(Scenario scenario, int seed) => new(scenario, seed);

    /// <summary>
    /// Advances by <paramref name="duration"/> in fixed steps; a remainder shorter than a step carries over to the next call.
    /// Refuses (<see cref="InvalidOperationException"/>, nothing stepped) a horizon past the scenario's
    /// <c>duration_h</c>: beyond it the feed goes on filling the vessel until the headspace vanishes and the
    /// model has no meaning (it used to return NaN there). A longer run starts a new batch (<see cref="Create"/>).
    /// </summary>
    public void Step(TimeSpan duration)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(duration, TimeSpan.Zero);
        double toH = ElapsedH + ((_pendingS + duration.TotalSeconds) / 3600.0);
        if (toH > Scenario.DurationH + _stepH)
        {
            throw new InvalidOperationException(string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"scenario '{Scenario.Name}' covers {Scenario.DurationH} h (duration_h); stepping to {toH:F3} h is past it (the virtual culture is not defined there): start a new batch with VirtualReactor.Create"));
        }

        _pendingS += duration.TotalSeconds;
        int step = Scenario.IntegrationStepS;
        while (_pendingS >= step - 1e-9)
        {
            StepOnce();
            _pendingS -= step;
        }
    }

    /// <summary>Current tag readings into <paramref name="values"/> (length ≥ Tags.Count), in <see cref="Tags"/> order; draws noise.</summary>
    public void ReadTags(Span<double> values)
    {
        TagReader.Read(values, this, _model, _errors, _tagNoise, _faults, _delay, ref _lastFeedReading);
        if (_jacket is { } jacket)
        {
            var snap = _model.Evaluate(ElapsedH, _y, _scratch);
            double met = jacket.MetabolicW(snap.Culture, _y[S.VolumeL]);
            double cool = jacket.CoolantW(met, snap.EvaporationLPerH, snap.FeedLPerH);
            var j = jacket.Spec;
            int at = ReactorTags.Count;
            values[at] = Math.Max(0, (j.CoolantFlowLPerH * _jacketFlowGain) + _jacketNoise.Next(j.FlowNoiseLPerH));
            values[at + 1] = j.CoolantInletC + _jacketNoise.Next(j.TemperatureNoiseC);
            values[at + 2] = jacket.OutletC(cool) + _jacketNoise.Next(j.TemperatureNoiseC);
            values[at + 3] = Math.Max(0, j.StirrerPowerW + _jacketNoise.Next(j.PowerNoiseW));
        }
    }

    /// <summary>Current tag readings by name; draws noise.</summary>
    public IReadOnlyDictionary<string, double> ReadTags()
    {
        Span<double> v = stackalloc double[Tags.Count];
        ReadTags(v);
        var d = new Dictionary<string, double>(ReactorTags.Count, StringComparer.Ordinal);
        for (int i = 0; i < Tags.Count; i++)
        {
            d[Tags[i].Name] = v[i];
        }

        return d;
    }

    internal ReadOnlySpan<double> State => _y;

    internal double DoCalibrationMmolPerL => _doCalibrationMmolPerL;

    /// <summary>The base pump's true flow now, L/h (without building a whole truth record).</summary>
    internal double TrueBaseLPerH() => _model.Evaluate(ElapsedH, _y, _scratch).BaseLPerH;

    /// <summary>The truth at this instant.</summary>
    public ReactorTruth Truth()
    {
        var snap = _model.Evaluate(ElapsedH, _y, _scratch);
        var truth = TruthBuilder.Build(this, snap, _y, CarbonRecovery(), InertImbalance(), _sampledL, _faults.AnyActive(ElapsedH));
        return truth with
        {
            MetabolicHeatW = _jacket?.MetabolicW(snap.Culture, _y[S.VolumeL]) ?? double.NaN,
            PoRatio = _model.Culture.PoRatio,
            OverflowCmmolPerLh = snap.Culture.OverflowCmmolPerLh,
        };
    }

    private void StepOnce()
    {
        double c0 = _y[S.OxygenMmolPerL];
        _rk4.Step(_model, ElapsedH, _stepH, _y);
        _steps++;
        _y[S.OxygenMmolPerL] = _model.SolveOxygen(ElapsedH, _stepH, _y, c0, _scratch);
        _y[S.SubstrateG] = Math.Max(0, _y[S.SubstrateG]);
        _delay.Push(_y[S.HeadspaceO2], _y[S.HeadspaceCo2]);
        var plan = Scenario.Samples.Plan;
        while (_nextSample < plan.Count && ElapsedH >= plan[_nextSample].AtH - (_stepH / 2))
        {
            TakeSample(plan[_nextSample].VolumeMl);
            _nextSample++;
        }
    }

    private void TakeSample(double volumeMl)
    {
        double v = _y[S.VolumeL];
        double removedL = volumeMl / 1000.0;
        double f = removedL / v;
        double x = _y[S.BiomassG] / v;
        double sd = Math.Sqrt(Math.Pow(Scenario.Samples.DcwRelativeSd * x, 2) + Math.Pow(Scenario.Samples.DcwAbsoluteSdGPerL, 2));
        _samples.Add(new OfflineSample(Time, Math.Max(0, x + _assayNoise.Next(sd)), sd, x, volumeMl));

        double before = CarbonInLiquidCmmol();
        double hsBefore = HeadspaceMol();
        _y[S.VolumeL] = v - removedL;
        _y[S.BiomassG] *= 1 - f;
        _y[S.SubstrateG] *= 1 - f;
        _y[S.ByproductG] *= 1 - f;
        _y[S.OverflowG] *= 1 - f;
        _sampledCarbonCmmol += before - CarbonInLiquidCmmol();
        _sampledL += removedL;

        // The headspace grows by the volume withdrawn and fills with gas of its own composition.
        double drawnMmol = (HeadspaceMol() - hsBefore) * 1000.0;
        _sampleGasCo2Mmol += drawnMmol * _y[S.HeadspaceCo2];
        _sampleGasInertMmol += drawnMmol * (1 - _y[S.HeadspaceO2] - _y[S.HeadspaceCo2]);
    }

    private double HeadspaceMol() => _model.MolPerLitreGas * (Scenario.Vessel.TotalVolumeL - _y[S.VolumeL]);

    private double CarbonInLiquidCmmol()
    {
        var c = _model.Culture;
        double organic = (_y[S.BiomassG] / c.BiomassGPerCmol) + (_y[S.SubstrateG] / c.SubstrateGPerCmol)
            + (double.IsNaN(c.ByproductGPerCmol) ? 0 : _y[S.ByproductG] / c.ByproductGPerCmol)
            + (double.IsNaN(c.OverflowGPerCmol) ? 0 : _y[S.OverflowG] / c.OverflowGPerCmol);
        return (organic * 1000.0) + (_y[S.TicMmolPerL] * _y[S.VolumeL]);
    }

    private double CarbonInVesselCmmol() => CarbonInLiquidCmmol() + (HeadspaceMol() * _y[S.HeadspaceCo2] * 1000.0);

    private double CarbonRecovery() =>
        (CarbonInVesselCmmol() + _y[S.Co2NetOutMmol] + _sampledCarbonCmmol)
        / (_initialCarbonCmmol + _y[S.CarbonFedCmmol] + _sampleGasCo2Mmol);

    private (double Imbalance, double In) InertImbalance()
    {
        double now = HeadspaceMol() * (1 - _y[S.HeadspaceO2] - _y[S.HeadspaceCo2]) * 1000.0;
        return (_y[S.InertInMinusOutMmol] + _sampleGasInertMmol - (now - _initialInertMmol), _y[S.InertInMmol]);
    }
}
