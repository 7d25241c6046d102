using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Estimation;

/// <summary>The heat balance's estimates in the frame (docs/pathway.md §4): metabolic heat, heat-based OUR beside the gas-based one, and the heat-augmented consistency test.</summary>
internal static class HeatFrames
{
    public static void Append(List<EstimateValue> list, CycleOutputs o)
    {
        var h = o.Heat;
        var gas = o.Rates.GasQuality;
        var q = double.IsFinite(h.MetabolicW) ? SampleQuality.Good : SampleQuality.Bad;
        list.Add(EstimateFrames.Value(EstimateNames.HeatMetabolicW, h.MetabolicW, "W", h.MetabolicSigmaW, q));
        list.Add(EstimateFrames.Value(EstimateNames.HeatOur, h.OurMmolPerLh, "mmol/(L·h)", h.OurSigmaMmolPerLh, q));
        list.Add(EstimateFrames.Value(EstimateNames.HeatStatistic, h.H, "1", double.NaN, SampleQualities.Worst(q, gas)));
        list.Add(EstimateFrames.Value(EstimateNames.HeatCritical, h.Critical, "1", double.NaN, SampleQualities.Worst(q, gas)));
        list.Add(EstimateFrames.Value(EstimateNames.HeatRedundancy, h.Redundancy, "1", double.NaN, SampleQuality.Good));
    }
}
