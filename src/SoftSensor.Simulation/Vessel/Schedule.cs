using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Simulation.Vessel;

/// <summary>Set points over time: the feed profile and the gas-line flows.</summary>
internal sealed class Schedule
{
    private readonly FeedSpec _feed;
    private readonly IReadOnlyList<FlowSegment> _air;
    private readonly IReadOnlyList<FlowSegment> _oxygen;

    public Schedule(FeedSpec feed, GasSpec gas)
    {
        _feed = feed;
        _air = gas.Air;
        _oxygen = gas.Oxygen;
    }

    /// <summary>Feed pump set point at <paramref name="tH"/>, L/h (0 before the first segment; capped).</summary>
    public double FeedLPerH(double tH)
    {
        var segs = _feed.Segments;
        for (int i = segs.Count - 1; i >= 0; i--)
        {
            if (tH >= segs[i].FromH)
            {
                double f = segs[i].RateLPerH * Math.Exp(segs[i].GrowthPerH * (tH - segs[i].FromH));
                return Math.Min(f, _feed.MaxRateLPerH);
            }
        }

        return 0;
    }

    public double AirNlPerMin(double tH) => Step(_air, tH);

    public double OxygenNlPerMin(double tH) => Step(_oxygen, tH);

    private static double Step(IReadOnlyList<FlowSegment> list, double tH)
    {
        for (int i = list.Count - 1; i >= 0; i--)
        {
            if (tH >= list[i].FromH)
            {
                return list[i].NlPerMin;
            }
        }

        return 0;
    }
}
