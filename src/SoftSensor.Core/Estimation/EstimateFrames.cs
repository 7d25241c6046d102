using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// Flattens the <see cref="CycleOutputs"/> of one cycle into the named values the sinks take
/// (<see cref="EstimateNames"/>), each with its unit, standard uncertainty, quality and a status
/// code (OPC UA Part 8 §7.3.2: Good 0, else the bare severity, the biomass its own code); the
/// daemon refines the codes of values that are not Good from its inputs' health.
/// </summary>
public static class EstimateFrames
{
    /// <summary>The values of one cycle; a value that is not finite is Bad.</summary>
    public static EstimateValue[] Values(CycleOutputs o)
    {
        ArgumentNullException.ThrowIfNull(o);
        var r = o.Rates;
        var f = o.Feed;
        var gas = r.GasQuality;
        var growth = r.GrowthQuality;
        var biomass = o.BiomassQuality;
        var feed = f.Limit == FeedLimit.None ? SampleQuality.Bad : biomass;
        EstimateValue[] core =
        [
            Value(EstimateNames.Our, r.OurMmolPerLh, "mmol/(L·h)", r.OurSigmaMmolPerLh, gas),
            Value(EstimateNames.Cer, r.CerMmolPerLh, "mmol/(L·h)", r.CerSigmaMmolPerLh, gas),
            Value(EstimateNames.Rq, r.Rq, "mol/mol", r.RqSigma, gas),
            Value(EstimateNames.OutletFlow, r.OutletFlowNlPerMin, "NL/min", double.NaN, gas),
            Value(EstimateNames.MuPerH, o.MuPerH, "1/h", double.NaN, biomass),
            Value(EstimateNames.MuRawPerH, o.MuRawPerH, "1/h", double.NaN, growth),
            Biomass(EstimateNames.BiomassGPerL, o.BiomassGPerL, "g/L", o.BiomassSigmaGPerL, o),
            Biomass(EstimateNames.BiomassG, o.BiomassGPerL * o.VolumeL, "g", o.BiomassSigmaGPerL * o.VolumeL, o),
            Value(EstimateNames.LiquidVolumeL, o.VolumeL, "L", double.NaN, SampleQuality.Good),
            Value(EstimateNames.ConsistencyH, r.H, "1", double.NaN, growth),
            Value(EstimateNames.ConsistencyCritical, r.HCritical, "1", double.NaN, growth),
            Value(EstimateNames.FeedAdvisoryLPerH, f.AdvisedLPerH, "L/h", double.NaN, feed),
            Value(EstimateNames.FeedCapLPerH, Math.Min(f.OxygenCapLPerH, f.OverflowCapLPerH), "L/h", double.NaN, feed),
        ];
        return PathwayFrames.Append(core, o);
    }

    /// <summary>The generic status code of a severity (OPC UA Part 4 §7.39: the top two bits).</summary>
    public static uint CodeOf(SampleQuality quality) => quality switch
    {
        SampleQuality.Good => 0u,
        SampleQuality.Uncertain => 0x40000000u,
        _ => 0x80000000u,
    };

    internal static EstimateValue Value(string name, double value, string unit, double sigma, SampleQuality quality)
    {
        var q = double.IsFinite(value) ? quality : SampleQuality.Bad;
        return new EstimateValue(name, value, unit, sigma, q, CodeOf(q));
    }

    private static EstimateValue Biomass(string name, double value, string unit, double sigma, CycleOutputs o) =>
        double.IsFinite(value)
            ? new EstimateValue(name, value, unit, sigma, o.BiomassQuality, o.BiomassStatusCode)
            : new EstimateValue(name, value, unit, sigma, SampleQuality.Bad, CodeOf(SampleQuality.Bad));
}
