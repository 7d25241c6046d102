using SoftSensor.Core.Flux;
using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// The one cycle shared by the daemon and the replay (DEVELOPERS.md): aligned inputs plus the
/// estimator state give the estimates. Steps: volume and removals → gas balance (OUR, CER, RQ and
/// their covariance; inputs already aligned for the analyser dead time, see
/// <see cref="AnalyserAlignment"/>) → elemental balance reconciliation of OUR, CER and the
/// feed- and base-derived rates → consistency test h, diagnosis only when it fails → growth rate
/// → biomass observers → feed advisory. Pure and allocation-free per cycle; not thread-safe (one
/// instance per reactor; it lends itself the volume slot of the inputs during a call and restores it). CER is the CO2 transfer rate unless the dissolved-CO2 correction is configured (<see cref="CerCorrectionStep"/>; its uncertainty is not added to CER's sigma).
/// </summary>
public sealed class Cycle
{
    private readonly CycleSettings _settings;
    private readonly BalanceStage _withSubstrate;
    private readonly BalanceStage _gasOnly;
    private readonly bool _ammonia;
    private readonly double _substrateGPerCmol;
    private readonly PathwayStage? _pathway;
    private readonly HeatBalanceStage? _heat;
    private BalanceStage? _solved;

    /// <summary>Factors the balances of <paramref name="model"/> for the measured sets the settings imply.</summary>
    public Cycle(StoichiometricModel model, CycleSettings settings)
        : this(model, settings, null)
    {
    }

    /// <summary>As <see cref="Cycle(StoichiometricModel, CycleSettings)"/>, and solves the pathway model <paramref name="pathway"/> every cycle (docs/pathway.md).</summary>
    public Cycle(StoichiometricModel model, CycleSettings settings, PathwayStage? pathway, HeatBalanceSettings? heat = null)
    {
        _pathway = pathway;
        var errors = settings.Validate();
        if (errors.Count > 0)
        {
            throw new ArgumentException("cycle settings: " + string.Join("; ", errors), nameof(settings));
        }

        OxygenId = IdOf(model, CompoundRole.Oxygen);
        CarbonDioxideId = IdOf(model, CompoundRole.CarbonDioxide);
        BiomassId = IdOf(model, CompoundRole.Biomass);
        SubstrateId = IdOf(model, CompoundRole.Substrate);
        // Biomass and substrate masses per C-mol come from the model (ash included for biomass).
        var biomass = model[BiomassId];
        _settings = settings with
        {
            Estimator = settings.Estimator with
            {
                BiomassGPerCMol = biomass.MassGPerRateUnit,
                AshFraction = biomass.AshFraction,
                SubstrateGPerCMol = model[SubstrateId].MassGPerRateUnit,
            },
        };
        settings = _settings;
        _ammonia = !double.IsNaN(settings.BaseAmmoniaMolPerL);
        var gasSet = new List<string> { OxygenId, CarbonDioxideId };
        if (_ammonia)
        {
            gasSet.Add(IdOf(model, CompoundRole.NitrogenSource));
        }

        _gasOnly = new BalanceStage(model, gasSet, settings.Alpha);
        _withSubstrate = settings.SubstrateFromFeed ? new BalanceStage(model, [.. gasSet, SubstrateId], settings.Alpha) : _gasOnly;
        _substrateGPerCmol = model[SubstrateId].MassGPerRateUnit;
        _heat = heat is null ? null : new HeatBalanceStage(model, gasSet, settings.SubstrateFromFeed ? [.. gasSet, SubstrateId] : gasSet, heat, settings.Alpha);
        BiomassIndex = _gasOnly.IndexOf(BiomassId);
        SubstrateIndex = _gasOnly.IndexOf(SubstrateId);
    }

    /// <summary>The settings.</summary>
    public CycleSettings Settings => _settings;

    /// <summary>Compound ids the cycle reads from the model.</summary>
    public string OxygenId { get; }

    /// <inheritdoc cref="OxygenId"/>
    public string CarbonDioxideId { get; }

    /// <inheritdoc cref="OxygenId"/>
    public string BiomassId { get; }

    /// <inheritdoc cref="OxygenId"/>
    public string SubstrateId { get; }

    private int BiomassIndex { get; }

    private int SubstrateIndex { get; }

    /// <summary>A fresh state for a new batch that starts from the configured initial culture.</summary>
    public EstimatorState NewState() => new(_settings.Estimator.HistoryCapacity);

    /// <summary>
    /// A fresh state for a new batch that starts from <paramref name="initial"/> at its first cycle:
    /// biomass, its variance (P0 = sigma² of the integrator and the filter's X·V element), volume and
    /// substrate; every integral (substrate fed, removals, mu filter, history) starts empty.
    /// </summary>
    public EstimatorState NewState(in BatchInitialConditions initial)
    {
        var errors = initial.Validate();
        if (errors.Count > 0)
        {
            throw new ArgumentException("batch initial conditions: " + string.Join("; ", errors), nameof(initial));
        }

        return new EstimatorState(_settings.Estimator.HistoryCapacity) { Initial = initial };
    }

    /// <summary>Runs one cycle at <paramref name="inputs"/>.Time, updating <paramref name="state"/> and overwriting <paramref name="outputs"/>.</summary>
    public void Run(AlignedInputs inputs, EstimatorState state, CycleOutputs outputs)
    {
        var est = _settings.Estimator;
        var volume = VolumeStep.Begin(inputs, state, est);
        double v = volume.VolumeL;

        // The gas balance divides by the volume the cycle tracks: lend it the slot, then put the caller's value back.
        bool hadVolume = inputs.Has(SignalRole.LiquidVolumeL);
        double volumeValue = inputs[SignalRole.LiquidVolumeL];
        var volumeQuality = inputs.QualityOf(SignalRole.LiquidVolumeL);
        var volumeTime = inputs.SourceTimeOf(SignalRole.LiquidVolumeL);
        inputs.Set(SignalRole.LiquidVolumeL, v, SampleQuality.Good, inputs.Time);
        var gas = GasBalance.Compute(inputs, _settings.Gas);
        if (hadVolume)
        {
            inputs.Set(SignalRole.LiquidVolumeL, volumeValue, volumeQuality, volumeTime);
        }
        else
        {
            inputs.Remove(SignalRole.LiquidVolumeL);
        }

        // CER = CTR, or corrected for the inorganic carbon the broth accumulates (docs/methods.md §1.5) when configured.
        double ctr = gas.CerMmolPerLh, cer = ctr, rq = gas.Rq, rqSigma = gas.RqSigma, cerSigma = gas.CerSigmaMmolPerLh, correctionSigma = 0;
        var correction = CerCorrection.None;
        if (_settings.CerCorrection != CerCorrection.None
            && CerCorrectionStep.TryCorrect(inputs, ctr, gas.OutletCo2DryFraction, v, volume.RemovedL, volume.DtH, state, _settings, out double corrected, out correctionSigma))
        {
            correction = CerCorrection.DissolvedInorganicCarbon;
            cer = corrected;
            rq = gas.OurMmolPerLh > 0 ? cer / gas.OurMmolPerLh : double.NaN;
            cerSigma = Math.Sqrt((cerSigma * cerSigma) + (correctionSigma * correctionSigma));
            rqSigma = gas.RqSigma * Math.Abs(rq / gas.Rq) * (cerSigma / gas.CerSigmaMmolPerLh);
        }

        var rates = new BalanceRates
        {
            OurMmolPerLh = gas.OurMmolPerLh,
            OurSigmaMmolPerLh = gas.OurSigmaMmolPerLh,
            CerMmolPerLh = cer,
            CerSigmaMmolPerLh = cerSigma,
            CtrMmolPerLh = ctr,
            CerCorrection = correction,
            Rq = rq,
            RqSigma = rqSigma,
            OutletFlowNlPerMin = gas.OutletFlowNlPerMin,
            GasQuality = gas.Quality,
            GrowthCmmolPerLh = double.NaN,
            GrowthSigmaCmmolPerLh = double.NaN,
            SubstrateCmmolPerLh = double.NaN,
            H = double.NaN,
            HCritical = double.NaN,
            GrowthSource = GrowthSource.None,
            GrowthQuality = SampleQuality.Bad,
        };

        _solved = null;
        if (gas.Quality != SampleQuality.Bad && double.IsFinite(gas.OurMmolPerLh) && double.IsFinite(cer))
        {
            Reconcile(inputs, gas, cer, correctionSigma, v, ref rates);
        }

        EstimationStep.Run(inputs, volume, rates, state, est, outputs);
        if (_pathway is not null)
        {
            PathwayStep.Run(_pathway, inputs, volume, gas.Covariance.OurCer, _settings, state, outputs);
        }

        if (_heat is not null)
        {
            var heat = outputs.Heat;
            _heat.Run(inputs, v, gas.OutletFlowNlPerMin, _solved == _withSubstrate && _solved != _gasOnly, _solved is null ? default : _solved.Measured, _solved is null ? default : _solved.Covariance, ref heat);
            outputs.Heat = heat;
        }
    }

    /// <summary>The pathway stage, or null when the reactor names no pathway model.</summary>
    public PathwayStage? Pathway => _pathway;

    /// <summary>Applies an offline sample at its sampling time (see <see cref="OfflineSampleUpdate"/>).</summary>
    public OfflineSampleOutcome ApplyOfflineSample(EstimatorState state, in OfflineSample sample) =>
        OfflineSampleUpdate.Apply(state, sample, _settings.Estimator);

    private void Reconcile(AlignedInputs inputs, in GasBalanceResult gas, double cer, double correctionSigma, double v, ref BalanceRates rates)
    {
        double feed = inputs[SignalRole.FeedRateLPerH];
        bool feedOn = _settings.SubstrateFromFeed && inputs.QualityOf(SignalRole.FeedRateLPerH) != SampleQuality.Bad
                      && feed > _settings.MinimumFeedLPerH;
        var stage = feedOn ? _withSubstrate : _gasOnly;
        var q = stage.Measured;
        var psi = stage.Covariance;
        int m = q.Length;
        Array.Clear(psi);

        // Signs: consumption < 0 (docs/methods.md conventions): r_O2 = -OUR, r_CO2 = +CER.
        double floor = _settings.MinimumGasRelativeSigma;
        double so = Math.Max(gas.OurSigmaMmolPerLh, floor * Math.Abs(gas.OurMmolPerLh));
        double sc = Math.Max(gas.CerSigmaMmolPerLh, floor * Math.Abs(cer));
        sc = correctionSigma > 0 ? Math.Sqrt((sc * sc) + (correctionSigma * correctionSigma)) : sc;
        q[0] = -gas.OurMmolPerLh;
        q[1] = cer;
        psi[0] = so * so;
        psi[m + 1] = sc * sc;
        double cov = gas.Covariance.OurCer;
        if (double.IsFinite(cov))
        {
            // cov(-OUR, CER) = -cov(OUR, CER); bounded so that Psi stays positive definite after the floors.
            double c = Math.Clamp(-cov, -0.99 * so * sc, 0.99 * so * sc);
            psi[1] = c;
            psi[m] = c;
        }

        int next = 2;
        if (_ammonia)
        {
            double baseRate = VolumeTracker.PositiveOrZero(inputs, SignalRole.BaseRateLPerH);
            double rN = -baseRate * _settings.BaseAmmoniaMolPerL * 1000.0 / v;
            double sN = Math.Max(_settings.AmmoniaRelativeSigma * Math.Abs(rN), 1e-3);
            q[next] = rN;
            psi[(next * m) + next] = sN * sN;
            next++;
        }

        if (feedOn)
        {
            double rS = -feed * _settings.Estimator.FeedSubstrateGPerL * 1000.0 / (_substrateGPerCmol * v);
            double sS = Math.Max(_settings.SubstrateRelativeSigma * Math.Abs(rS), 1e-3);
            q[next] = rS;
            psi[(next * m) + next] = sS * sS;
        }

        var outcome = stage.Solve();
        _solved = stage;
        if (!outcome.HasRates)
        {
            return;
        }

        rates.GrowthCmmolPerLh = stage.Rates[BiomassIndex];
        rates.GrowthSigmaCmmolPerLh = stage.Sigmas[BiomassIndex];
        rates.SubstrateCmmolPerLh = stage.Rates[SubstrateIndex];
        rates.GrowthSource = double.IsFinite(rates.GrowthCmmolPerLh) ? GrowthSource.ElementalBalance : GrowthSource.None;
        rates.GrowthQuality = gas.Quality;
        if (outcome.HasTest)
        {
            rates.H = outcome.H;
            rates.HCritical = outcome.Critical;
            if (!outcome.Consistent)
            {
                rates.Inconsistent = true;
                rates.GrowthQuality = SampleQualities.Worst(gas.Quality, SampleQuality.Uncertain);
                rates.Suspect = stage.Diagnose(out _);
            }
        }
    }

    private static string IdOf(StoichiometricModel model, CompoundRole role)
    {
        foreach (var c in model.Compounds)
        {
            if (c.Role == role)
            {
                return c.Id;
            }
        }

        throw new ArgumentException($"model '{model.Name}' has no compound with role {role}; the cycle needs one", nameof(model));
    }
}
