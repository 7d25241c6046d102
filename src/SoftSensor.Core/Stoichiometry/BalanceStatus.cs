namespace SoftSensor.Core.Stoichiometry;

/// <summary>How a solve ended. Consistency is reported apart from this (<see cref="BalanceOutcome.Consistent"/>).</summary>
public enum BalanceStatus
{
    /// <summary>Every rate is determined.</summary>
    Solved,

    /// <summary>Some unknown rates are not determined by the measurements (NaN); the others are valid.</summary>
    PartlyDetermined,

    /// <summary>A measured value or variance is NaN, infinite or (variance) negative; nothing was computed.</summary>
    InvalidMeasurement,

    /// <summary>The residual covariance R Psi R^T is singular (e.g. zero sigmas on every redundant measurement).</summary>
    CovarianceNotPositiveDefinite,
}
