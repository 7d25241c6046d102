using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Simulation.Faults;

/// <summary>The scenario's injected faults, asked by time: what is wrong at hour t.</summary>
internal sealed class FaultSchedule
{
    private readonly FaultSpec[] _faults;

    public FaultSchedule(IReadOnlyList<FaultSpec> faults) => _faults = [.. faults];

    /// <summary>True when any fault is active.</summary>
    public bool AnyActive(double tH)
    {
        foreach (var f in _faults)
        {
            if (Active(f, tH))
            {
                return true;
            }
        }

        return false;
    }

    /// <summary>True when the aeration is tripped (every gas line closed).</summary>
    public bool AerationTripped(double tH) => Any("aeration_trip", tH);

    /// <summary>True when the feed pump's signal is frozen.</summary>
    public bool FeedSignalFrozen(double tH) => Any("feed_signal_frozen", tH);

    /// <summary>The analyser reading of <paramref name="gas"/> (o2 or co2) with the active faults applied, % by volume.</summary>
    public double ApplyToAnalyser(string gas, double readingPercent, double tH)
    {
        double r = readingPercent;
        foreach (var f in _faults)
        {
            if (!Active(f, tH) || !string.Equals(f.Gas, gas, StringComparison.Ordinal))
            {
                continue;
            }

            if (f.Kind == "analyser_offset")
            {
                r += (readingPercent * f.RelativePercent / 100.0) + f.AbsolutePercent;
            }
            else if (f.Kind == "analyser_drift")
            {
                r += f.RatePercentPerH * (tH - f.FromH);
            }
        }

        return r;
    }

    private bool Any(string kind, double tH)
    {
        foreach (var f in _faults)
        {
            if (f.Kind == kind && Active(f, tH))
            {
                return true;
            }
        }

        return false;
    }

    private static bool Active(FaultSpec f, double tH) => tH >= f.FromH && tH < f.ToH;
}
