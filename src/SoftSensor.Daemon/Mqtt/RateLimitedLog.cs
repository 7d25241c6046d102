using System.Collections.Concurrent;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>
/// At most one log line per key (a topic) per interval; the lines left out are counted and the next
/// line says how many. Thread-safe.
/// </summary>
internal sealed class RateLimitedLog(TimeProvider time, TimeSpan interval)
{
    private const int MaxKeys = 10_000;
    private readonly ConcurrentDictionary<string, Entry> _last = new(StringComparer.Ordinal);

    /// <summary>Whether to log now for <paramref name="key"/>; <paramref name="suppressed"/> lines were left out since the last.</summary>
    public bool ShouldLog(string key, out long suppressed)
    {
        long now = time.GetTimestamp();
        if (_last.Count > MaxKeys)
        {
            _last.Clear();
        }

        var e = _last.GetOrAdd(key, _ => new Entry());
        lock (e)
        {
            if (e.LastTicks != 0 && time.GetElapsedTime(e.LastTicks, now) < interval)
            {
                e.Suppressed++;
                suppressed = 0;
                return false;
            }

            suppressed = e.Suppressed;
            e.Suppressed = 0;
            e.LastTicks = now;
            return true;
        }
    }

    private sealed class Entry
    {
        public long LastTicks;
        public long Suppressed;
    }
}
