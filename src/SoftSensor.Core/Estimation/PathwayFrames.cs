using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// The pathway model's estimates in the frame (docs/pathway.md §5): μ, predicted OUR and CER, the
/// overflow product's rate (its id in the name, e.g. <c>pathway_overflow_ethanol_cmmol_per_l_h</c>),
/// the consistency statistic between the two estimators with its threshold, and the tracked
/// energy parameters. A statistic above its threshold makes the pathway values Uncertain.
/// </summary>
internal static class PathwayFrames
{
    public static EstimateValue[] Append(EstimateValue[] core, CycleOutputs o)
    {
        var p = o.Pathway;
        bool pathway = double.IsFinite(p.PoRatio);
        var heat = o.Heat;
        bool hasHeat = heat.Configured;
        if (!pathway && !hasHeat)
        {
            return core;
        }

        var list = new List<EstimateValue>(core.Length + 20);
        list.AddRange(core);
        if (pathway)
        {
            bool flagged = p.Statistic > p.Critical;
            var gas = o.Rates.GasQuality;
            var q = flagged ? SampleQualities.Worst(o.BiomassQuality, SampleQuality.Uncertain) : o.BiomassQuality;
            var qGas = flagged ? SampleQualities.Worst(gas, SampleQuality.Uncertain) : gas;
            list.Add(EstimateFrames.Value(EstimateNames.PathwayMuPerH, p.MuPerH, "1/h", p.MuSigmaPerH, q));
            list.Add(EstimateFrames.Value(EstimateNames.PathwayOur, p.PredictedOurMmolPerLh, "mmol/(L·h)", p.PredictedOurSigmaMmolPerLh, qGas));
            list.Add(EstimateFrames.Value(EstimateNames.PathwayCer, p.PredictedCerMmolPerLh, "mmol/(L·h)", p.PredictedCerSigmaMmolPerLh, qGas));
            list.Add(EstimateFrames.Value(EstimateNames.PathwayStatistic, p.Statistic, "1", double.NaN, gas));
            list.Add(EstimateFrames.Value(EstimateNames.PathwayCritical, p.Critical, "1", double.NaN, gas));
            list.Add(EstimateFrames.Value(EstimateNames.PoRatio, p.PoRatio, "mol ATP/mol O", p.PoSigma, qGas));
            list.Add(EstimateFrames.Value(EstimateNames.MaintenanceAtp, p.MaintenanceAtpMmolPerGh, "mmol ATP/(g·h)", p.MaintenanceSigmaAtpMmolPerGh, qGas));
            if (o.OverflowProduct is { } product)
            {
                list.Add(EstimateFrames.Value(EstimateNames.PathwayOverflow, p.Overflow ? 1 : 0, "1", double.NaN, double.IsFinite(p.Statistic) || p.Basis != Flux.PathwayBasis.None ? qGas : SampleQuality.Bad));
                list.Add(EstimateFrames.Value(EstimateNames.PathwayOverflowPrefix + product + "_cmmol_per_l_h", p.OverflowProductCmmolPerLh, "C-mmol/(L·h)", double.NaN, qGas));
            }
        }

        if (hasHeat)
        {
            HeatFrames.Append(list, o);
        }

        return [.. list];
    }
}
