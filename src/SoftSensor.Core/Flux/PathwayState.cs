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

    /// <summary>Largest window of the consistency statistic, cycles.</summary>
    public const int WindowCapacity = 64;

    /// <summary>The last normalised innovations squared and their degrees of freedom (ring buffer of the windowed statistic).</summary>
    public double[] Innovations { get; } = new double[WindowCapacity];

    /// <inheritdoc cref="Innovations"/>
    public int[] InnovationDof { get; } = new int[WindowCapacity];

    /// <summary>Cycles in a row whose innovation exceeded the gate.</summary>
    public int GatedCycles { get; set; }

    /// <summary>Next slot of the ring buffer and how many are filled.</summary>
    public int Next { get; set; }

    /// <inheritdoc cref="Next"/>
    public int Filled { get; set; }
}
