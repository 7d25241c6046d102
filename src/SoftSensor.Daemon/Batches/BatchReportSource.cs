using SoftSensor.Core.Estimation;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Replay;
using SoftSensor.Daemon.Store;

namespace SoftSensor.Daemon.Batches;

/// <summary>
/// Turns a batch's stored frames back into the replay's <see cref="ReplaySeries"/>, so that the live
/// batch report is drawn and written by the same <see cref="Report.ReportPlots"/> and
/// <see cref="Report.ReportWriter"/> as the replay's. Values a frame does not carry stay NaN.
/// </summary>
internal static class BatchReportSource
{
    /// <summary>The series and the replay-shaped result of one batch's frames (oldest first).</summary>
    public static ReplayResult FromFrames(IReadOnlyList<StoredFrameValues> frames, int points = 1500)
    {
        var series = new ReplaySeries(points);
        var o = new CycleOutputs();
        foreach (var f in frames)
        {
            double V(string name) => f.Values.TryGetValue(name, out var v) ? v.Value : double.NaN;
            double h = V(EstimateNames.ConsistencyH), hc = V(EstimateNames.ConsistencyCritical);
            o.Time = f.Time;
            o.Quality = f.Quality;
            o.Rates = new BalanceRates
            {
                OurMmolPerLh = V(EstimateNames.Our),
                CerMmolPerLh = V(EstimateNames.Cer),
                Rq = V(EstimateNames.Rq),
                H = h,
                HCritical = hc,
                Inconsistent = double.IsFinite(h) && double.IsFinite(hc) && h > hc,
            };
            o.BiomassGPerL = V(EstimateNames.BiomassGPerL);
            o.BiomassSigmaGPerL = f.Values.TryGetValue(EstimateNames.BiomassGPerL, out var x) ? x.Sigma : double.NaN;
            o.IntegratorBiomassGPerL = V(EstimateNames.BiomassIntegratorGPerL);
            o.EkfBiomassGPerL = V(EstimateNames.BiomassEkfGPerL);
            o.MuPerH = V(EstimateNames.MuPerH);
            o.MuRawPerH = V(EstimateNames.MuRawPerH);
            o.Feed = new FeedAdvice(double.NaN, double.NaN, double.NaN, V(EstimateNames.FeedAdvisoryLPerH), double.NaN, double.NaN, default);
            series.Add(o, double.NaN);
        }

        return new ReplayResult(frames.Count, frames.Count, 0, [], 0, new EstimatorState(2), series, [], false);
    }
}
