namespace SoftSensor.Core.Estimation;

/// <summary>
/// Feed advisory for a fed-batch (docs/methods.md §4): the feed that holds mu at a setpoint,
/// capped by the vessel's oxygen transfer capacity and by the onset of overflow metabolism.
/// Strain- and medium-specific numbers are configuration.
/// </summary>
public sealed record FeedAdvisorySettings
{
    /// <summary>Growth-rate setpoint, 1/h.</summary>
    public double MuSetpointPerH { get; init; } = 0.15;

    /// <summary>Biomass yield on substrate, g/g.</summary>
    public double YieldXSGPerG { get; init; } = 0.5;

    /// <summary>Maintenance substrate demand, g/(g·h).</summary>
    public double MaintenanceSGPerGh { get; init; } = 0.02;

    /// <summary>Volumetric O2 transfer coefficient used for the cap when no DO-based estimate is available, 1/h.</summary>
    public double KlaPerH { get; init; } = 400;

    /// <summary>O2 saturation concentration in the broth at the operating point, mmol/L (air, 30 °C, 1 atm: 7.56 mg/L = 0.236 mmol/L, Benson &amp; Krause 1984).</summary>
    public double OxygenSaturationMmolPerL { get; init; } = 0.236;

    /// <summary>Lowest dissolved O2 the cap allows, as a fraction of saturation (the driving force left at the cap).</summary>
    public double MinimumDissolvedOxygenFraction { get; init; } = 0.2;

    /// <summary>Specific substrate uptake above which overflow metabolism starts, g/(g·h) (strain- and medium-specific).</summary>
    public double CriticalSubstrateUptakeGPerGh { get; init; } = 1.0;

    internal void Validate(List<string> errors)
    {
        EstimatorSettings.NonNegative(errors, "Feed." + nameof(MuSetpointPerH), MuSetpointPerH);
        EstimatorSettings.Positive(errors, "Feed." + nameof(YieldXSGPerG), YieldXSGPerG);
        EstimatorSettings.NonNegative(errors, "Feed." + nameof(MaintenanceSGPerGh), MaintenanceSGPerGh);
        EstimatorSettings.Positive(errors, "Feed." + nameof(KlaPerH), KlaPerH);
        EstimatorSettings.Positive(errors, "Feed." + nameof(OxygenSaturationMmolPerL), OxygenSaturationMmolPerL);
        if (!(MinimumDissolvedOxygenFraction >= 0 && MinimumDissolvedOxygenFraction < 1))
        {
            errors.Add($"Feed.{nameof(MinimumDissolvedOxygenFraction)} is {MinimumDissolvedOxygenFraction}; expected a fraction in [0, 1)");
        }

        EstimatorSettings.Positive(errors, "Feed." + nameof(CriticalSubstrateUptakeGPerGh), CriticalSubstrateUptakeGPerGh);
    }
}
