using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// The off-gas-only cycle: the inert-gas balance of SoftSensor.Core.Gas (METHODS.md section 1) on
/// the aligned inputs, giving OUR, CER, RQ and the outlet flow with their uncertainty, quality and
/// an OPC UA status code. Stateless. The full estimator's cycle replaces it when configured.
/// </summary>
internal sealed class OffGasCycle : IReactorCycle
{
    private readonly AlignedGasBalanceSettings _settings;
    private readonly double _fixedVolumeL;
    private readonly GasOptions _gas;
    private readonly bool[] _used;

    public OffGasCycle(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings)
    {
        _gas = reactor.Gas;
        var roles = bindings.Select(b => b.Role).ToHashSet();
        var lines = InstalledGasLines.None;
        lines |= roles.Contains(SignalRole.AirFlowNlPerMin) ? InstalledGasLines.Air : 0;
        lines |= roles.Contains(SignalRole.OxygenFlowNlPerMin) ? InstalledGasLines.Oxygen : 0;
        lines |= roles.Contains(SignalRole.NitrogenFlowNlPerMin) ? InstalledGasLines.Nitrogen : 0;
        lines |= roles.Contains(SignalRole.CarbonDioxideFlowNlPerMin) ? InstalledGasLines.CarbonDioxide : 0;
        var inlet = _gas.Inlet == "lines" ? InletSource.GasLines : InletSource.Measured;
        var balance = GasBalanceSettings.Default with
        {
            Reference = new ReferenceConditions(_gas.MfcReferenceTemperatureK, _gas.MfcReferencePressureKPa),
            Accuracy = new MeasurementAccuracy(_gas.O2AccuracyPercentAbs, _gas.Co2AccuracyPercentAbs, _gas.FlowAccuracyPercentOfReading),
            MinAerationNlPerMin = _gas.MinAerationNlPerMin,
        };
        // Staleness is judged per tag by the signal store (its own max age and dead time); the balance's
        // own age check is set wide enough not to repeat it.
        var maxAge = bindings.Count == 0 ? TimeSpan.FromDays(1) : bindings.Max(b => b.MaxAge + b.DeadTime) + TimeSpan.FromDays(1);
        _settings = new AlignedGasBalanceSettings(balance, lines, inlet, _gas.AirCo2Percent / 100.0, _gas.AnalyserBasis == "wet" ? AnalyserBasis.Saturated : AnalyserBasis.Dry, _gas.AnalyserPressureKPa, maxAge);
        _fixedVolumeL = roles.Contains(SignalRole.LiquidVolumeL) ? double.NaN : _gas.LiquidVolumeL;
        _used = new bool[SignalRoles.Count];
        foreach (var role in UsedRoles(lines, _gas))
        {
            _used[(int)role] = true;
        }
    }

    public CycleOutput Run(AlignedInputs inputs, ReadOnlySpan<InputHealth> health)
    {
        if (!double.IsNaN(_fixedVolumeL))
        {
            inputs.Set(SignalRole.LiquidVolumeL, _fixedVolumeL, SampleQuality.Good, inputs.Time);
        }

        if (_gas.Inlet == "fixed")
        {
            inputs.Set(SignalRole.InletO2Percent, _gas.InletO2Percent, SampleQuality.Good, inputs.Time);
            inputs.Set(SignalRole.InletCo2Percent, _gas.InletCo2Percent, SampleQuality.Good, inputs.Time);
        }

        var r = GasBalance.Compute(inputs, _settings);
        var rateFlags = r.Flags & ~GasBalanceFlags.RqUndefined;
        var rateQuality = rateFlags.ToQuality();
        uint rateCode = Code(rateFlags, rateQuality, health);
        var rqQuality = r.Flags.ToQuality();
        uint rqCode = Code(r.Flags, rqQuality, health);
        var values = new EstimateValue[]
        {
            new(EstimateNames.Our, r.OurMmolPerLh, "mmol/(L·h)", r.OurSigmaMmolPerLh, rateQuality, rateCode),
            new(EstimateNames.Cer, r.CerMmolPerLh, "mmol/(L·h)", r.CerSigmaMmolPerLh, rateQuality, rateCode),
            new(EstimateNames.Rq, r.Rq, "mol/mol", r.RqSigma, rqQuality, rqCode),
            new(EstimateNames.OutletFlow, r.OutletFlowNlPerMin, "NL/min", double.NaN, rateQuality, rateCode),
        };
        return new CycleOutput(values, NewestUsed(health));
    }

    public string? SaveState() => null;

    public void RestoreState(string state)
    {
        // Stateless: nothing to restore.
    }

    private DateTimeOffset NewestUsed(ReadOnlySpan<InputHealth> health)
    {
        var newest = default(DateTimeOffset);
        foreach (var h in health)
        {
            if (_used[(int)h.Role] && h.SourceTime > newest)
            {
                newest = h.SourceTime;
            }
        }

        return newest;
    }

    /// <summary>The OPC UA status code of a value (INTEGRATION.md "Estimate quality as OPC UA status codes").</summary>
    private uint Code(GasBalanceFlags flags, SampleQuality quality, ReadOnlySpan<InputHealth> health)
    {
        if (quality == SampleQuality.Good)
        {
            return StatusCodes.Good;
        }

        bool waiting = false, stale = false;
        uint worstInput = quality == SampleQuality.Bad ? StatusCodes.Bad : StatusCodes.Uncertain;
        foreach (var h in health)
        {
            if (!_used[(int)h.Role])
            {
                continue;
            }

            waiting |= h.State == InputState.Waiting;
            stale |= h.State == InputState.Stale;
            if (h.State == InputState.Ok && h.Quality == quality)
            {
                worstInput = h.StatusCode;
            }
        }

        if (quality == SampleQuality.Bad)
        {
            return waiting ? StatusCodes.BadWaitingForInitialData
                : stale ? StatusCodes.BadNoCommunication
                : (flags & GasBalanceFlags.AnalyserCalibrating) != 0 ? StatusCodes.BadOutOfService
                : (flags & GasBalanceFlags.ConditionsOutOfRange) != 0 ? StatusCodes.BadConfigurationError
                : (flags & GasBalanceFlags.InputBad) != 0 ? worstInput
                : StatusCodes.Bad;
        }

        return (flags & GasBalanceFlags.InputUncertain) != 0 ? worstInput : StatusCodes.UncertainEngineeringUnitsExceeded;
    }

    private static IEnumerable<SignalRole> UsedRoles(InstalledGasLines lines, GasOptions gas)
    {
        if ((lines & InstalledGasLines.Air) != 0) { yield return SignalRole.AirFlowNlPerMin; }
        if ((lines & InstalledGasLines.Oxygen) != 0) { yield return SignalRole.OxygenFlowNlPerMin; }
        if ((lines & InstalledGasLines.Nitrogen) != 0) { yield return SignalRole.NitrogenFlowNlPerMin; }
        if ((lines & InstalledGasLines.CarbonDioxide) != 0) { yield return SignalRole.CarbonDioxideFlowNlPerMin; }
        yield return SignalRole.OutletO2Percent;
        yield return SignalRole.OutletCo2Percent;
        yield return SignalRole.LiquidVolumeL;
        yield return SignalRole.AnalyserCalibrating;
        if (gas.Inlet == "measured")
        {
            yield return SignalRole.InletO2Percent;
            yield return SignalRole.InletCo2Percent;
        }

        if (gas.AnalyserBasis == "wet")
        {
            yield return SignalRole.AnalyserTemperatureC;
            yield return SignalRole.PressureKPa;
        }
    }
}

/// <summary>Makes an <see cref="OffGasCycle"/> for every reactor.</summary>
internal sealed class OffGasCycleFactory : IReactorCycleFactory
{
    public IReactorCycle Create(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings) => new OffGasCycle(reactor, bindings);
}
