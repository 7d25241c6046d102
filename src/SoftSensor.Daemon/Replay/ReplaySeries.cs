using SoftSensor.Core.Estimation;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Replay;

/// <summary>
/// The cycles kept for the report's plots, thinned evenly to at most twice the requested number
/// of points (every other point is dropped and the stride doubled when full), plus exact counts
/// over every cycle: inconsistent cycles and the diagnosis per suspect.
/// </summary>
internal sealed class ReplaySeries
{
    /// <summary>Failed cycles closer than this (about two cycles of 10 s) join one interval, h.</summary>
    private const double MergeGapH = 0.01;

    private readonly int _max;
    private int _stride = 1;
    private long _seen;

    public ReplaySeries(int points) => _max = Math.Max(points, 10) * 2;

    public List<double> TimeH { get; } = [];
    public List<double> Our { get; } = [];
    public List<double> Cer { get; } = [];
    public List<double> Rq { get; } = [];
    public List<double> Biomass { get; } = [];
    public List<double> BiomassSigma { get; } = [];
    public List<double> BiomassIntegrator { get; } = [];
    public List<double> BiomassEkf { get; } = [];
    public List<double> Mu { get; } = [];
    public List<double> MuRaw { get; } = [];
    public List<double> H { get; } = [];
    public List<double> HCritical { get; } = [];
    public List<double> FeedAdvised { get; } = [];
    public List<double> FeedActual { get; } = [];
    public List<double> Inconsistent { get; } = [];

    /// <summary>Start of the run (time zero of the plots).</summary>
    public DateTimeOffset Start { get; private set; }

    /// <summary>Cycles seen, cycles whose test failed, and cycles with each quality.</summary>
    public long Cycles => _seen;

    public long InconsistentCycles { get; private set; }

    public long[] QualityCounts { get; } = new long[3];

    /// <summary>Per suspect named by the diagnosis, the number of cycles (null key: failed but not isolated, as "not isolated").</summary>
    public Dictionary<string, long> Suspects { get; } = new(StringComparer.Ordinal);

    /// <summary>Time (h from start) and reason of each interval in which the test failed.</summary>
    public List<(double FromH, double ToH, string Suspect)> InconsistentIntervals { get; } = [];

    public void Add(CycleOutputs o, double feedActual)
    {
        if (_seen == 0)
        {
            Start = o.Time;
        }

        _seen++;
        var r = o.Rates;
        QualityCounts[(int)o.Quality]++;
        double t = (o.Time - Start).TotalHours;
        if (r.Inconsistent)
        {
            InconsistentCycles++;
            string key = r.Suspect ?? "not isolated";
            Suspects[key] = Suspects.TryGetValue(key, out long n) ? n + 1 : 1;
            var last = InconsistentIntervals.Count > 0 ? InconsistentIntervals[^1] : (FromH: -1.0, ToH: -1.0, Suspect: string.Empty);
            if (InconsistentIntervals.Count > 0 && t - last.ToH < MergeGapH)
            {
                InconsistentIntervals[^1] = (last.FromH, t, last.Suspect);
            }
            else
            {
                InconsistentIntervals.Add((t, t, key));
            }
        }

        if ((_seen - 1) % _stride != 0)
        {
            return;
        }

        TimeH.Add(t);
        Our.Add(r.OurMmolPerLh);
        Cer.Add(r.CerMmolPerLh);
        Rq.Add(r.Rq);
        Biomass.Add(o.BiomassGPerL);
        BiomassSigma.Add(o.BiomassSigmaGPerL);
        BiomassIntegrator.Add(o.IntegratorBiomassGPerL);
        BiomassEkf.Add(o.EkfBiomassGPerL);
        Mu.Add(o.MuPerH);
        MuRaw.Add(o.MuRawPerH);
        H.Add(r.H);
        HCritical.Add(r.HCritical);
        FeedAdvised.Add(o.Feed.AdvisedLPerH);
        FeedActual.Add(feedActual);
        Inconsistent.Add(r.Inconsistent ? 1 : 0);
        if (TimeH.Count >= _max)
        {
            Thin();
        }
    }

    /// <summary>Number of cycles with a quality.</summary>
    public long CountOf(SampleQuality q) => QualityCounts[(int)q];

    private void Thin()
    {
        foreach (var list in new[] { TimeH, Our, Cer, Rq, Biomass, BiomassSigma, BiomassIntegrator, BiomassEkf, Mu, MuRaw, H, HCritical, FeedAdvised, FeedActual, Inconsistent })
        {
            int w = 0;
            for (int i = 0; i < list.Count; i += 2)
            {
                list[w++] = list[i];
            }

            list.RemoveRange(w, list.Count - w);
        }

        _stride *= 2;
    }
}
