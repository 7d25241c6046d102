using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Gas;

/// <summary>Data-quality findings of one gas balance (docs/methods.md §1.8). Results, never exceptions.</summary>
[Flags]
public enum GasBalanceFlags
{
    None = 0,
    /// <summary>A mole fraction outside [0, 1], O2 + CO2 (+ H2O) not below 1, or not a number. Bad.</summary>
    FractionOutOfRange = 1 << 0,
    /// <summary>A gas-line flow negative or not a number. Bad.</summary>
    FlowOutOfRange = 1 << 1,
    /// <summary>Total inlet flow below the configured minimum (or zero). Bad.</summary>
    AerationBelowMinimum = 1 << 2,
    /// <summary>OTR below zero: the analyser or the inlet composition is off. Uncertain.</summary>
    NegativeOtr = 1 << 3,
    /// <summary>Inlet inert fraction too small, or dry inert fraction changed implausibly. Bad.</summary>
    InertFractionImplausible = 1 << 4,
    /// <summary>RQ undefined: OTR is zero or negative. Uncertain.</summary>
    RqUndefined = 1 << 5,
    /// <summary>Liquid volume not positive or not a number. Bad.</summary>
    VolumeOutOfRange = 1 << 6,
    /// <summary>Reference or analyser-cell conditions not physical (e.g. T outside IAPWS-IF97 region 4). Bad.</summary>
    ConditionsOutOfRange = 1 << 7,
    /// <summary>The analyser is calibrating or on its reference stream. Bad.</summary>
    AnalyserCalibrating = 1 << 8,
    /// <summary>A required input is missing. Bad.</summary>
    InputMissing = 1 << 9,
    /// <summary>A required input is older than its maximum age. Bad.</summary>
    InputStale = 1 << 10,
    /// <summary>A required input arrived with quality uncertain. Uncertain.</summary>
    InputUncertain = 1 << 11,
    /// <summary>A required input arrived with quality bad. Bad.</summary>
    InputBad = 1 << 12,
}

/// <summary>Quality level and stable reason ids of <see cref="GasBalanceFlags"/>.</summary>
public static class GasBalanceFlagsExtensions
{
    private const GasBalanceFlags UncertainFlags = GasBalanceFlags.NegativeOtr | GasBalanceFlags.RqUndefined | GasBalanceFlags.InputUncertain;

    private static readonly (GasBalanceFlags Flag, string Id)[] Ids =
    [
        (GasBalanceFlags.FractionOutOfRange, "fraction-out-of-range"),
        (GasBalanceFlags.FlowOutOfRange, "flow-out-of-range"),
        (GasBalanceFlags.AerationBelowMinimum, "aeration-below-minimum"),
        (GasBalanceFlags.NegativeOtr, "negative-otr"),
        (GasBalanceFlags.InertFractionImplausible, "inert-fraction-implausible"),
        (GasBalanceFlags.RqUndefined, "rq-undefined"),
        (GasBalanceFlags.VolumeOutOfRange, "volume-out-of-range"),
        (GasBalanceFlags.ConditionsOutOfRange, "conditions-out-of-range"),
        (GasBalanceFlags.AnalyserCalibrating, "analyser-calibrating"),
        (GasBalanceFlags.InputMissing, "input-missing"),
        (GasBalanceFlags.InputStale, "input-stale"),
        (GasBalanceFlags.InputUncertain, "input-uncertain"),
        (GasBalanceFlags.InputBad, "input-bad"),
    ];

    /// <summary>The quality that the flags imply: bad, uncertain, or good when none is set.</summary>
    public static SampleQuality ToQuality(this GasBalanceFlags flags) =>
        (flags & ~UncertainFlags) != 0 ? SampleQuality.Bad
        : flags != GasBalanceFlags.None ? SampleQuality.Uncertain
        : SampleQuality.Good;

    /// <summary>Stable kebab-case ids of the set flags, in declaration order (for output and logs).</summary>
    public static IReadOnlyList<string> ReasonIds(this GasBalanceFlags flags)
    {
        var list = new List<string>();
        foreach (var (flag, id) in Ids)
        {
            if ((flags & flag) != 0)
            {
                list.Add(id);
            }
        }

        return list;
    }
}
