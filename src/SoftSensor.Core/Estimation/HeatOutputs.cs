namespace SoftSensor.Core.Estimation;

/// <summary>The heat balance of one cycle (NaN where not computed).</summary>
public struct HeatOutputs
{
    /// <summary>True when the reactor has a heat balance.</summary>
    public bool Configured;

    /// <summary>Metabolic heat, W, and its standard uncertainty.</summary>
    public double MetabolicW;

    /// <inheritdoc cref="MetabolicW"/>
    public double MetabolicSigmaW;

    /// <summary>Heat-based OUR, mmol/(L·h), and its standard uncertainty.</summary>
    public double OurMmolPerLh;

    /// <inheritdoc cref="OurMmolPerLh"/>
    public double OurSigmaMmolPerLh;

    /// <summary>The consistency test with the heat row: statistic, critical value, redundancy, the isolated suspect (null when none).</summary>
    public double H;

    /// <inheritdoc cref="H"/>
    public double Critical;

    /// <inheritdoc cref="H"/>
    public int Redundancy;

    /// <inheritdoc cref="H"/>
    public string? Isolated;

    /// <summary>A value of NaN everywhere, not configured.</summary>
    public static HeatOutputs Empty => new()
    {
        MetabolicW = double.NaN, MetabolicSigmaW = double.NaN, OurMmolPerLh = double.NaN, OurSigmaMmolPerLh = double.NaN,
        H = double.NaN, Critical = double.NaN,
    };
}
