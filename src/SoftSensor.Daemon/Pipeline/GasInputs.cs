using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;
using StatusCodes = SoftSensor.OpcUa.Encoding.StatusCodes;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// What every reactor cycle shares: the gas balance settings of a reactor's gas section and tag
/// map, the fixed inputs it fills in (volume, inlet), the roles it uses, and the OPC UA status
/// code of a value from its quality and its inputs' health (OPC UA Part 8 §7.3.2,
/// OPC UA status codes").
/// </summary>
internal sealed class GasInputs
{
    private readonly double _fixedVolumeL;
    private readonly GasOptions _gas;
    private readonly bool[] _used;

    /// <param name="extraRoles">Roles the cycle reads besides the gas balance's (e.g. the feed for the estimator).</param>
    public GasInputs(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings, IEnumerable<SignalRole>? extraRoles = null)
    {
        _gas = reactor.Gas;
        var roles = bindings.Select(b => b.Role).ToHashSet();
        var lines = InstalledGasLines.None;
        lines |= roles.Contains(SignalRole.AirFlowNlPerMin) ? InstalledGasLines.Air : 0;
        lines |= roles.Contains(SignalRole.OxygenFlowNlPerMin) ? InstalledGasLines.Oxygen : 0;
        lines |= roles.Contains(SignalRole.NitrogenFlowNlPerMin) ? InstalledGasLines.Nitrogen : 0;
        lines |= roles.Contains(SignalRole.CarbonDioxideFlowNlPerMin) ? InstalledGasLines.CarbonDioxide : 0;
        var inlet = _gas.Inlet == InletSetting.Lines ? InletSource.GasLines : InletSource.Measured;
        var balance = GasBalanceSettings.Default with
        {
            Reference = new ReferenceConditions(_gas.MfcReferenceTemperatureK, _gas.MfcReferencePressureKPa),
            Accuracy = new MeasurementAccuracy(_gas.O2AccuracyPercentAbs, _gas.Co2AccuracyPercentAbs, _gas.FlowAccuracyPercentOfReading),
            MinAerationNlPerMin = _gas.MinAerationNlPerMin,
        };
        // Staleness is judged per tag by the signal store (its own max age and dead time); the balance's
        // own age check is set wide enough not to repeat it.
        var maxAge = bindings.Count == 0 ? TimeSpan.FromDays(1) : bindings.Max(b => b.MaxAge + b.DeadTime) + TimeSpan.FromDays(1);
        Settings = new AlignedGasBalanceSettings(balance, lines, inlet, _gas.AirCo2Percent / 100.0, _gas.AnalyserBasis == AnalyserBasisKind.Wet ? AnalyserBasis.Saturated : AnalyserBasis.Dry, _gas.AnalyserPressureKPa, maxAge);
        _fixedVolumeL = roles.Contains(SignalRole.LiquidVolumeL) ? double.NaN : _gas.LiquidVolumeL;
        _used = new bool[SignalRoles.Count];
        foreach (var role in UsedRoles(lines, _gas).Concat(extraRoles ?? []))
        {
            _used[(int)role] = true;
        }
    }

    /// <summary>The gas balance settings.</summary>
    public AlignedGasBalanceSettings Settings { get; }

    /// <summary>Fills in the configured fixed inputs (volume without a volume tag, fixed inlet).</summary>
    public void Prepare(AlignedInputs inputs)
    {
        if (!double.IsNaN(_fixedVolumeL))
        {
            inputs.Set(SignalRole.LiquidVolumeL, _fixedVolumeL, SampleQuality.Good, inputs.Time);
        }

        if (_gas.Inlet == InletSetting.Fixed)
        {
            inputs.Set(SignalRole.InletO2Percent, _gas.InletO2Percent, SampleQuality.Good, inputs.Time);
            inputs.Set(SignalRole.InletCo2Percent, _gas.InletCo2Percent, SampleQuality.Good, inputs.Time);
        }
    }

    /// <summary>The newest source time of the used inputs (default when none).</summary>
    public DateTimeOffset NewestUsed(ReadOnlySpan<InputHealth> health)
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

    /// <summary>The balance flags the used inputs' health implies (for a cycle that does not see the gas balance's own flags).</summary>
    public GasBalanceFlags FlagsOf(ReadOnlySpan<InputHealth> health)
    {
        var flags = GasBalanceFlags.None;
        foreach (var h in health)
        {
            if (!_used[(int)h.Role] || h.State != InputState.Ok)
            {
                continue;
            }

            flags |= h.Quality == SampleQuality.Bad ? GasBalanceFlags.InputBad : h.Quality == SampleQuality.Uncertain ? GasBalanceFlags.InputUncertain : 0;
            flags |= h.Role == SignalRole.AnalyserCalibrating && h.Value > 0.5 ? GasBalanceFlags.AnalyserCalibrating : 0;
        }

        return flags;
    }

    /// <summary>The OPC UA status code of a value (OPC UA Part 8 §7.3.2).</summary>
    public uint Code(GasBalanceFlags flags, SampleQuality quality, ReadOnlySpan<InputHealth> health)
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
        if (gas.Inlet == InletSetting.Measured)
        {
            yield return SignalRole.InletO2Percent;
            yield return SignalRole.InletCo2Percent;
        }

        if (gas.AnalyserBasis == AnalyserBasisKind.Wet)
        {
            yield return SignalRole.AnalyserTemperatureC;
            yield return SignalRole.PressureKPa;
        }
    }
}
