namespace SoftSensor.Daemon.Timeseries;

/// <summary>
/// Exponential back-off with jitter: the n-th consecutive failure waits
/// min(max, initial · 2^(n−1)) scaled by a random factor in [0.5, 1) ("equal jitter", so that
/// several daemons do not retry in step). Not thread-safe: one per sender.
/// </summary>
internal sealed class RetryBackoff(TimeSpan initial, TimeSpan max, Random random)
{
    /// <summary>Consecutive failures so far.</summary>
    public int Failures { get; private set; }

    /// <summary>Counts a failure and returns the delay before the next attempt.</summary>
    public TimeSpan Next()
    {
        Failures++;
        double factor = Math.Pow(2, Math.Min(Failures - 1, 30));
        double ceiling = Math.Min(max.TotalSeconds, initial.TotalSeconds * factor);
        return TimeSpan.FromSeconds(ceiling * (0.5 + (0.5 * random.NextDouble())));
    }

    /// <summary>Forgets the failures after a success.</summary>
    public void Reset() => Failures = 0;
}
