namespace SoftSensor.Core.Flux;

/// <summary>The energy parameters the pathway stage carries from cycle to cycle (random-walk Kalman filter state).</summary>
public sealed class PathwayState
{
    /// <summary>False until the first cycle set the priors.</summary>
    public bool Initialised { get; set; }

    /// <summary>P/O ratio (ATP per O atom) and its variance.</summary>
    public double PoRatio { get; set; } = double.NaN;

    /// <inheritdoc cref="PoRatio"/>
    public double PoVariance { get; set; } = double.NaN;

    /// <summary>m_ATP, mmol ATP/(C-mmol biomass·h), and its variance.</summary>
    public double MaintenanceAtp { get; set; } = double.NaN;

    /// <inheritdoc cref="MaintenanceAtp"/>
    public double MaintenanceVariance { get; set; } = double.NaN;
}
