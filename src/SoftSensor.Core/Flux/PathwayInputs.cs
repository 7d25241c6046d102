namespace SoftSensor.Core.Flux;

/// <summary>What the cycle hands the pathway stage: the measured rates (positive OUR and CER, substrate exchange negative) with their uncertainties, and the biomass.</summary>
public readonly record struct PathwayInputs
{
    /// <summary>Hours since the last cycle.</summary>
    public double DtH { get; init; }

    /// <summary>Measured substrate exchange rate (negative: uptake), C-mmol/(L·h); NaN when not measured. Its standard uncertainty.</summary>
    public double SubstrateCmmolPerLh { get; init; }

    /// <inheritdoc cref="SubstrateCmmolPerLh"/>
    public double SubstrateSigmaCmmolPerLh { get; init; }

    /// <summary>Measured OUR and CER, mmol/(L·h), positive; NaN when not usable. Their standard uncertainties and covariance.</summary>
    public double OurMmolPerLh { get; init; }

    /// <inheritdoc cref="OurMmolPerLh"/>
    public double OurSigmaMmolPerLh { get; init; }

    /// <inheritdoc cref="OurMmolPerLh"/>
    public double CerMmolPerLh { get; init; }

    /// <inheritdoc cref="OurMmolPerLh"/>
    public double CerSigmaMmolPerLh { get; init; }

    /// <inheritdoc cref="OurMmolPerLh"/>
    public double OurCerCovariance { get; init; }

    /// <summary>Biomass, g dry weight/L, and its standard uncertainty.</summary>
    public double BiomassGPerL { get; init; }

    /// <inheritdoc cref="BiomassGPerL"/>
    public double BiomassSigmaGPerL { get; init; }
}
