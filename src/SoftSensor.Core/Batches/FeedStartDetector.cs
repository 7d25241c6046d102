using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Batches;

/// <summary>
/// Detects the start of the fed-batch phase from the feed rate: the feed must stay above a threshold
/// for a hold time, so that a pump test or a single spike does not count (common practice). A bad or
/// missing reading, or one at or below the threshold, restarts the hold. Pure: time comes with each
/// reading; one instance per reactor, not thread-safe.
/// </summary>
public sealed class FeedStartDetector
{
    private readonly double _thresholdLPerH;
    private readonly TimeSpan _hold;
    private DateTimeOffset? _aboveSince;

    /// <summary>Creates the detector; throws <see cref="ArgumentException"/> naming a bad value.</summary>
    public FeedStartDetector(double thresholdLPerH, TimeSpan hold)
    {
        if (!(thresholdLPerH >= 0 && double.IsFinite(thresholdLPerH)))
        {
            throw new ArgumentException($"feed threshold is {thresholdLPerH} L/h; expected a finite number >= 0", nameof(thresholdLPerH));
        }

        if (hold < TimeSpan.Zero)
        {
            throw new ArgumentException($"hold time is {hold}; expected 0 or more", nameof(hold));
        }

        _thresholdLPerH = thresholdLPerH;
        _hold = hold;
    }

    /// <summary>Since when the feed has been above the threshold without a break, or null.</summary>
    public DateTimeOffset? AboveSince => _aboveSince;

    /// <summary>Takes one reading at <paramref name="time"/>; true once the feed has stayed above the threshold for the hold time.</summary>
    public bool Update(DateTimeOffset time, double feedLPerH, SampleQuality quality)
    {
        if (quality == SampleQuality.Bad || !double.IsFinite(feedLPerH) || feedLPerH <= _thresholdLPerH)
        {
            _aboveSince = null;
            return false;
        }

        _aboveSince ??= time;
        return time - _aboveSince.Value >= _hold;
    }

    /// <summary>Forgets the hold (a new batch).</summary>
    public void Reset() => _aboveSince = null;
}
