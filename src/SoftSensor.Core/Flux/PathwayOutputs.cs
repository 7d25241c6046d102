namespace SoftSensor.Core.Flux;

/// <summary>What the pathway stage gives in one cycle (NaN where not computed). Rates in mmol/(L·h), C-mmol for organics.</summary>
public struct PathwayOutputs
{
    /// <summary>Which rates fixed the model this cycle.</summary>
    public PathwayBasis Basis;

    /// <summary>Growth rate from the pathway model, 1/h, and its standard uncertainty.</summary>
    public double MuPerH;

    /// <inheritdoc cref="MuPerH"/>
    public double MuSigmaPerH;

    /// <summary>Predicted OUR and CER, positive, and their standard uncertainties.</summary>
    public double PredictedOurMmolPerLh;

    /// <inheritdoc cref="PredictedOurMmolPerLh"/>
    public double PredictedOurSigmaMmolPerLh;

    /// <inheritdoc cref="PredictedOurMmolPerLh"/>
    public double PredictedCerMmolPerLh;

    /// <inheritdoc cref="PredictedOurMmolPerLh"/>
    public double PredictedCerSigmaMmolPerLh;

    /// <summary>Predicted rate of the overflow product, C-mmol/(L·h) (0 below the capacity; NaN without an overflow branch).</summary>
    public double OverflowProductCmmolPerLh;

    /// <summary>True when the substrate uptake exceeds the respiratory capacity.</summary>
    public bool Overflow;

    /// <summary>Largest substrate uptake without overflow, C-mmol/(L·h) (NaN without a capacity).</summary>
    public double CriticalUptakeCmmolPerLh;

    /// <summary>Consistency of the two estimators: normalised innovation squared of the gas rates not used as basis, its χ² critical value and degrees of freedom.</summary>
    public double Statistic;

    /// <inheritdoc cref="Statistic"/>
    public double Critical;

    /// <inheritdoc cref="Statistic"/>
    public int DegreesOfFreedom;

    /// <summary>Tracked energy parameters after this cycle and their standard deviations.</summary>
    public double PoRatio;

    /// <inheritdoc cref="PoRatio"/>
    public double PoSigma;

    /// <inheritdoc cref="PoRatio"/>
    public double MaintenanceAtpMmolPerGh;

    /// <inheritdoc cref="PoRatio"/>
    public double MaintenanceSigmaAtpMmolPerGh;

    /// <summary>A value of NaN everywhere.</summary>
    public static PathwayOutputs Empty => new()
    {
        MuPerH = double.NaN, MuSigmaPerH = double.NaN, PredictedOurMmolPerLh = double.NaN, PredictedOurSigmaMmolPerLh = double.NaN,
        PredictedCerMmolPerLh = double.NaN, PredictedCerSigmaMmolPerLh = double.NaN, OverflowProductCmmolPerLh = double.NaN,
        CriticalUptakeCmmolPerLh = double.NaN, Statistic = double.NaN, Critical = double.NaN, PoRatio = double.NaN, PoSigma = double.NaN,
        MaintenanceAtpMmolPerGh = double.NaN, MaintenanceSigmaAtpMmolPerGh = double.NaN,
    };
}
