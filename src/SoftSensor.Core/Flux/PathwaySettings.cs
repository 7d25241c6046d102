namespace SoftSensor.Core.Flux;

/// <summary>Which energy parameter the filter tracks; the other is held at its value (docs/pathway.md §2, identifiability).</summary>
public enum TrackedEnergyParameter
{
    /// <summary>Track the P/O ratio, hold m_ATP at the model's value (the default: one residual, one parameter).</summary>
    PoRatio = 0,

    /// <summary>Track m_ATP, hold the P/O ratio.</summary>
    Maintenance,
}

/// <summary>
/// The pathway model in the cycle (docs/pathway.md): the overflow branch, the respiratory capacity,
/// the energy-parameter filter (random walk per √h) and the model's own uncertainty. Units in the names.
/// </summary>
public sealed record PathwaySettings
{
    /// <summary>The reaction of the overflow branch (e.g. <c>alcoholDehydrogenase</c>, <c>acetateKinase</c>), or null when the model has none.</summary>
    public string? OverflowReaction { get; init; }

    /// <summary>Largest specific O2 uptake of the respiratory route, mmol O2/(g dry weight·h); NaN: no overflow test. A strain property (configuration).</summary>
    public double RespiratoryCapacityO2MmolPerGh { get; init; } = double.NaN;

    /// <summary>Which parameter the filter tracks.</summary>
    public TrackedEnergyParameter Tracked { get; init; } = TrackedEnergyParameter.PoRatio;

    /// <summary>Prior standard deviation of the P/O ratio (ATP per O atom).</summary>
    public double PoSigma { get; init; } = 0.3;

    /// <summary>Random-walk intensity of the P/O ratio, per √h (how fast it may drift).</summary>
    public double PoRandomWalkPerSqrtH { get; init; } = 0.1;

    /// <summary>Prior relative standard deviation of m_ATP.</summary>
    public double MaintenanceRelativeSigma { get; init; } = 0.5;

    /// <summary>Random-walk intensity of m_ATP relative to its model value, per √h.</summary>
    public double MaintenanceRandomWalkRelativePerSqrtH { get; init; } = 0.1;

    /// <summary>Relative standard uncertainty of the model's predicted rates (biomass composition, lumped pathways; Roels 1983 ranges, docs/methods.md §2.5).</summary>
    public double ModelRelativeSigma { get; init; } = 0.02;

    /// <summary>Relative standard uncertainty of the biomass concentration the stage divides by when the cycle gives none.</summary>
    public double BiomassRelativeSigmaFloor { get; init; } = 0.03;

    /// <summary>Cycles summed by the consistency statistic (1 to <see cref="PathwayState.WindowCapacity"/>): the sum of the last N normalised innovations squared is χ² with the summed degrees of freedom while model and data agree, and a persistent small gap (a drift of P/O) shows in it before it shows in one cycle.</summary>
    public int Window { get; init; } = 10;

    /// <summary>Residual substrate (the cycle's estimate) above which the feed is not taken as the uptake, g/L (docs/methods.md §2.7: feed equals uptake only while S stays near zero); NaN: not used (the default, because the cycle's residual-substrate estimate is only as good as the balance's consumption).</summary>
    public double FeedIsUptakeBelowGPerL { get; init; } = double.NaN;

    /// <summary>Innovation gate: a cycle whose normalised innovation squared exceeds the χ² quantile at 1 - <see cref="GateAlpha"/> does not update the parameter (an outlier, or the feed not yet the uptake)...</summary>
    public double GateAlpha { get; init; } = 1e-4;

    /// <summary>...unless this many cycles in a row exceed it: then the change is taken as real, the parameter's variance is reset to its prior and the update made.</summary>
    public int GatePersistence { get; init; } = 5;

    /// <summary>Significance level of the consistency statistic.</summary>
    public double Alpha { get; init; } = 0.01;

    /// <summary>Bounds of the tracked P/O ratio.</summary>
    public double PoMinimum { get; init; } = 0.3;

    /// <inheritdoc cref="PoMinimum"/>
    public double PoMaximum { get; init; } = 3.5;

    /// <summary>Every fault (empty when valid), each naming the field, the value and the expectation.</summary>
    public IReadOnlyList<string> Validate()
    {
        var e = new List<string>();
        void Positive(string n, double v)
        {
            if (!(v > 0) || !double.IsFinite(v))
            {
                e.Add($"Pathway.{n} is {v}; expected a positive finite number");
            }
        }

        Positive(nameof(PoSigma), PoSigma);
        Positive(nameof(PoRandomWalkPerSqrtH), PoRandomWalkPerSqrtH);
        Positive(nameof(MaintenanceRelativeSigma), MaintenanceRelativeSigma);
        Positive(nameof(MaintenanceRandomWalkRelativePerSqrtH), MaintenanceRandomWalkRelativePerSqrtH);
        Positive(nameof(ModelRelativeSigma), ModelRelativeSigma);
        Positive(nameof(BiomassRelativeSigmaFloor), BiomassRelativeSigmaFloor);
        if (!double.IsNaN(RespiratoryCapacityO2MmolPerGh))
        {
            Positive(nameof(RespiratoryCapacityO2MmolPerGh), RespiratoryCapacityO2MmolPerGh);
        }

        if (!double.IsNaN(FeedIsUptakeBelowGPerL))
        {
            Positive(nameof(FeedIsUptakeBelowGPerL), FeedIsUptakeBelowGPerL);
        }

        if (!(GateAlpha > 0 && GateAlpha < Alpha))
        {
            e.Add($"Pathway.{nameof(GateAlpha)} is {GateAlpha}; expected a level in (0, Alpha = {Alpha})");
        }

        if (GatePersistence < 1)
        {
            e.Add($"Pathway.{nameof(GatePersistence)} is {GatePersistence}; expected 1 or more cycles");
        }
        if (Window < 1 || Window > PathwayState.WindowCapacity)
        {
            e.Add($"Pathway.{nameof(Window)} is {Window}; expected 1 to {PathwayState.WindowCapacity} cycles");
        }

        if (!(Alpha > 0 && Alpha < 0.5))
        {
            e.Add($"Pathway.{nameof(Alpha)} is {Alpha}; expected a significance level in (0, 0.5)");
        }

        if (!(PoMinimum > 0 && PoMaximum > PoMinimum))
        {
            e.Add($"Pathway.{nameof(PoMinimum)} {PoMinimum} and {nameof(PoMaximum)} {PoMaximum}; expected 0 < minimum < maximum");
        }

        if (!Enum.IsDefined(Tracked))
        {
            e.Add($"Pathway.{nameof(Tracked)} is {Tracked}; expected PoRatio or Maintenance");
        }

        return e;
    }
}
