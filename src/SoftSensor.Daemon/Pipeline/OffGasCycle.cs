using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// The off-gas-only cycle: the inert-gas balance of SoftSensor.Core.Gas (docs/methods.md §1) on
/// the aligned inputs, giving OUR, CER, RQ and the outlet flow with their uncertainty, quality and
/// an OPC UA status code. Stateless. A reactor with a model file runs the <see cref="EstimatorCycle"/> instead.
/// </summary>
internal sealed class OffGasCycle : IReactorCycle
{
    private readonly GasInputs _gas;

    public OffGasCycle(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings)
    {
        _gas = new GasInputs(reactor, bindings);
    }

    public CycleOutput Run(AlignedInputs inputs, ReadOnlySpan<InputHealth> health)
    {
        _gas.Prepare(inputs);
        var r = GasBalance.Compute(inputs, _gas.Settings);
        var rateFlags = r.Flags & ~GasBalanceFlags.RqUndefined;
        var rateQuality = rateFlags.ToQuality();
        uint rateCode = _gas.Code(rateFlags, rateQuality, health);
        var rqQuality = r.Flags.ToQuality();
        uint rqCode = _gas.Code(r.Flags, rqQuality, health);
        var values = new EstimateValue[]
        {
            new(EstimateNames.Our, r.OurMmolPerLh, "mmol/(L·h)", r.OurSigmaMmolPerLh, rateQuality, rateCode),
            new(EstimateNames.Cer, r.CerMmolPerLh, "mmol/(L·h)", r.CerSigmaMmolPerLh, rateQuality, rateCode),
            new(EstimateNames.Rq, r.Rq, "mol/mol", r.RqSigma, rqQuality, rqCode),
            new(EstimateNames.OutletFlow, r.OutletFlowNlPerMin, "NL/min", double.NaN, rateQuality, rateCode),
        };
        return new CycleOutput(values, _gas.NewestUsed(health));
    }

    public string? SaveState() => null;

    public void RestoreState(string state)
    {
        // Stateless: nothing to restore.
    }

    public void BeginBatch(in Core.Estimation.BatchInitialConditions initial)
    {
        // Stateless: nothing to reset.
    }
}

/// <summary>Makes an <see cref="OffGasCycle"/> for every reactor.</summary>
internal sealed class OffGasCycleFactory : IReactorCycleFactory
{
    public IReactorCycle Create(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings) => new OffGasCycle(reactor, bindings);
}
