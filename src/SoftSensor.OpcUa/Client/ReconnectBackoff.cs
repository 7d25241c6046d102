namespace SoftSensor.OpcUa.Client;

/// <summary>
/// Exponential back-off with ±20 % jitter between reconnect attempts (common practice, so that
/// many clients do not return to a restarted server at the same instant).
/// </summary>
public sealed class ReconnectBackoff
{
    private readonly TimeSpan min;
    private readonly TimeSpan max;
    private readonly Random random;
    private TimeSpan next;

    public ReconnectBackoff(TimeSpan min, TimeSpan max, Random? random = null)
    {
        this.min = min;
        this.max = max;
        this.random = random ?? Random.Shared;
        next = min;
    }

    /// <summary>The wait before the next attempt; each call doubles the following one.</summary>
    public TimeSpan Next()
    {
        var current = next;
        next = TimeSpan.FromTicks(Math.Min(max.Ticks, next.Ticks * 2));
        double jitter = 0.8 + (0.4 * random.NextDouble());
        return TimeSpan.FromTicks((long)(current.Ticks * jitter));
    }

    public void Reset() => next = min;
}
