using SoftSensor.Core.Flux;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// The cycle's hook for the pathway model (docs/pathway.md): hands the measured rates and the
/// cycle's biomass to the <see cref="PathwayStage"/>, stores its outputs and, when the model knows
/// the respiratory capacity, caps the feed advisory at the critical uptake it implies.
/// Allocation-free.
/// </summary>
internal static class PathwayStep
{
    public static void Run(PathwayStage stage, AlignedInputs inputs, in VolumeStep volume, double ourCerCovariance, CycleSettings settings, EstimatorState state, CycleOutputs o)
    {
        var r = o.Rates;
        double v = volume.VolumeL;
        double feed = inputs[SignalRole.FeedRateLPerH];
        // The feed is the uptake only while the residual substrate stays near zero (docs/methods.md §2.7).
        bool feedOn = inputs.QualityOf(SignalRole.FeedRateLPerH) != SampleQuality.Bad && feed > settings.MinimumFeedLPerH && v > 0
            && !(o.SubstrateGPerL > stage.Settings.FeedIsUptakeBelowGPerL);
        double cFeed = settings.Estimator.FeedSubstrateGPerL;
        double mS = stage.Response.SubstrateGPerCmol;
        double rS = feedOn ? -feed * cFeed * 1000.0 / (mS * v) : double.NaN;
        bool gas = r.GasQuality != SampleQuality.Bad;
        double floor = settings.MinimumGasRelativeSigma;
        var x = new PathwayInputs
        {
            DtH = volume.DtH,
            SubstrateCmmolPerLh = rS,
            SubstrateSigmaCmmolPerLh = settings.SubstrateRelativeSigma * Math.Abs(rS),
            OurMmolPerLh = gas ? r.OurMmolPerLh : double.NaN,
            OurSigmaMmolPerLh = Math.Max(r.OurSigmaMmolPerLh, floor * Math.Abs(r.OurMmolPerLh)),
            CerMmolPerLh = gas ? r.CerMmolPerLh : double.NaN,
            CerSigmaMmolPerLh = Math.Max(r.CerSigmaMmolPerLh, floor * Math.Abs(r.CerMmolPerLh)),
            OurCerCovariance = ourCerCovariance,
            BiomassGPerL = o.BiomassGPerL,
            BiomassSigmaGPerL = o.BiomassSigmaGPerL,
        };
        var p = o.Pathway;
        stage.Run(x, state.Pathway, ref p);
        o.Pathway = p;
        o.OverflowProduct = stage.Response.OverflowProduct;

        // The critical uptake caps the feed (docs/methods.md §4: overflow starts above it).
        double crit = p.CriticalUptakeCmmolPerLh;
        if (double.IsFinite(crit) && cFeed > 0 && o.Feed.Limit != FeedLimit.None)
        {
            double cap = crit * v * mS / 1000.0 / cFeed;
            var f = o.Feed;
            double overflowCap = Math.Min(f.OverflowCapLPerH, cap);
            double advised = Math.Min(f.AdvisedLPerH, overflowCap);
            o.Feed = f with
            {
                OverflowCapLPerH = overflowCap,
                AdvisedLPerH = advised,
                Limit = advised < f.AdvisedLPerH ? FeedLimit.Overflow : f.Limit,
            };
        }
    }
}
