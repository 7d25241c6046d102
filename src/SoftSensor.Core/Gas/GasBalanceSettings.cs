namespace SoftSensor.Core.Gas;

/// <summary>Configuration of the gas balance (docs/methods.md §1.1, 1.3, 1.8).</summary>
/// <param name="Reference">MFC reference conditions of the gas-line flows and of the reported outlet flow.</param>
/// <param name="Accuracy">Standard uncertainties of the raw measurements.</param>
/// <param name="MinAerationNlPerMin">Below this total inlet flow the balance is meaningless (flagged bad).</param>
/// <param name="MinInertFraction">Inlet inert (non-O2, non-CO2) fraction below which the inert balance is ill-conditioned.</param>
/// <param name="MaxInertFractionChange">Largest plausible relative change of the dry inert fraction between inlet and outlet.</param>
public readonly record struct GasBalanceSettings(
    ReferenceConditions Reference,
    MeasurementAccuracy Accuracy,
    double MinAerationNlPerMin,
    double MinInertFraction,
    double MaxInertFractionChange)
{
    /// <summary>
    /// 0 °C/101.325 kPa, no stated accuracy, no minimum aeration, inlet inert fraction at least 0.01,
    /// inert fraction changing by at most 20 % between inlet and outlet. The two inert limits are
    /// engineering judgement (a respiring culture with RQ near 1 changes it by well under 5 %),
    /// not published values: adjust them per process.
    /// </summary>
    public static GasBalanceSettings Default { get; } = new(ReferenceConditions.Normal, MeasurementAccuracy.None, 0, 0.01, 0.2);

    /// <summary>A copy with other accuracies.</summary>
    public GasBalanceSettings WithAccuracy(MeasurementAccuracy accuracy) => this with { Accuracy = accuracy };
}
