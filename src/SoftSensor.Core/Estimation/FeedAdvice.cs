namespace SoftSensor.Core.Estimation;

/// <summary>Which limit sets the advised feed.</summary>
public enum FeedLimit
{
    /// <summary>The growth-rate setpoint.</summary>
    Setpoint = 0,

    /// <summary>The vessel's oxygen transfer capacity.</summary>
    OxygenTransfer,

    /// <summary>The onset of overflow metabolism.</summary>
    Overflow,

    /// <summary>No advice (biomass unknown).</summary>
    None,
}

/// <summary>The feed advisory of one cycle; flows in L/h.</summary>
/// <param name="SetpointLPerH">Feed that holds mu at its setpoint.</param>
/// <param name="OxygenCapLPerH">Largest feed whose oxygen demand the vessel can transfer.</param>
/// <param name="OverflowCapLPerH">Largest feed below the critical substrate uptake.</param>
/// <param name="AdvisedLPerH">The smallest of the three.</param>
/// <param name="OxygenTransferCapacityMmolPerLh">OTR_max used for the cap.</param>
/// <param name="KlaPerH">kLa used (estimated from DO when possible, else configured).</param>
/// <param name="Limit">Which of the three sets the advice.</param>
public readonly record struct FeedAdvice(
    double SetpointLPerH,
    double OxygenCapLPerH,
    double OverflowCapLPerH,
    double AdvisedLPerH,
    double OxygenTransferCapacityMmolPerLh,
    double KlaPerH,
    FeedLimit Limit);
