using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// What the gas balance and the elemental balance gave one cycle, as the observers need it.
/// Rates in mmol/(L·h) (C-mmol for organic compounds), production &gt; 0, consumption &lt; 0; OUR and
/// CER positive. NaN marks a value that could not be computed.
/// </summary>
public struct BalanceRates
{
    /// <summary>Oxygen uptake rate and its standard uncertainty.</summary>
    public double OurMmolPerLh { get; set; }

    /// <inheritdoc cref="OurMmolPerLh"/>
    public double OurSigmaMmolPerLh { get; set; }

    /// <summary>CO2 evolution rate and its standard uncertainty.</summary>
    public double CerMmolPerLh { get; set; }

    /// <inheritdoc cref="CerMmolPerLh"/>
    public double CerSigmaMmolPerLh { get; set; }

    /// <summary>CO2 transfer rate to the gas, mmol/(L·h): equal to CER unless <see cref="CerCorrection"/> says otherwise.</summary>
    public double CtrMmolPerLh { get; set; }

    /// <summary>Which CER this cycle reports (docs/methods.md §1.5: the output says which one was used).</summary>
    public CerCorrection CerCorrection { get; set; }

    /// <summary>Respiratory quotient (CER/OUR) and its standard uncertainty.</summary>
    public double Rq { get; set; }

    /// <inheritdoc cref="Rq"/>
    public double RqSigma { get; set; }

    /// <summary>Dry outlet flow from the inert balance, NL/min.</summary>
    public double OutletFlowNlPerMin { get; set; }

    /// <summary>Quality of the gas balance.</summary>
    public SampleQuality GasQuality { get; set; }

    /// <summary>Reconciled biomass production rate r_X, C-mmol/(L·h), and its standard uncertainty.</summary>
    public double GrowthCmmolPerLh { get; set; }

    /// <inheritdoc cref="GrowthCmmolPerLh"/>
    public double GrowthSigmaCmmolPerLh { get; set; }

    /// <summary>Reconciled substrate rate r_S (negative when consumed), C-mmol/(L·h).</summary>
    public double SubstrateCmmolPerLh { get; set; }

    /// <summary>Consistency statistic h and its critical value (NaN without redundancy).</summary>
    public double H { get; set; }

    /// <inheritdoc cref="H"/>
    public double HCritical { get; set; }

    /// <summary>True when the consistency test failed.</summary>
    public bool Inconsistent { get; set; }

    /// <summary>The diagnosis when the test failed: the hypothesis that restores consistency best (null when none, or the test passed).</summary>
    public string? Suspect { get; set; }

    /// <summary>Where the growth rate came from.</summary>
    public GrowthSource GrowthSource { get; set; }

    /// <summary>Quality of the growth rate (the worst of its inputs; uncertain when the test failed).</summary>
    public SampleQuality GrowthQuality { get; set; }
}

/// <summary>Where a cycle's growth rate came from.</summary>
public enum GrowthSource
{
    /// <summary>No rate (inputs bad): the observers coast on the smoothed mu.</summary>
    None = 0,

    /// <summary>The elemental balance with its specification.</summary>
    ElementalBalance,

    /// <summary>The pathway flux model from measured OUR/CER.</summary>
    FluxModel,
}
