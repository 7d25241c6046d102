using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// The recent samples of one tag, oldest first, in a fixed ring (no allocation per sample). Samples
/// are kept in source-time order; one older than the newest is inserted in place (late delivery).
/// Not thread-safe: owned by one pipeline task.
/// </summary>
internal sealed class TagHistory
{
    private readonly Sample[] _ring;
    private int _start;
    private int _count;

    public TagHistory(int capacity)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(capacity, 2);
        _ring = new Sample[capacity];
    }

    /// <summary>Number of samples held.</summary>
    public int Count => _count;

    /// <summary>The newest sample, or null.</summary>
    public Sample? Latest => _count == 0 ? null : At(_count - 1);

    /// <summary>Adds a sample; the oldest falls out when full.</summary>
    public void Add(Sample sample)
    {
        if (_count == _ring.Length)
        {
            _start = (_start + 1) % _ring.Length;
            _count--;
        }

        int i = _count;
        while (i > 0 && At(i - 1).SourceTime > sample.SourceTime)
        {
            Put(i, At(i - 1));
            i--;
        }

        Put(i, sample);
        _count++;
    }

    /// <summary>The newest sample whose source time is at or before <paramref name="time"/>, or null.</summary>
    public Sample? AtOrBefore(DateTimeOffset time)
    {
        for (int i = _count - 1; i >= 0; i--)
        {
            var s = At(i);
            if (s.SourceTime <= time)
            {
                return s;
            }
        }

        return null;
    }

    /// <summary>Drops samples older than <paramref name="cutoff"/>, but always keeps the newest.</summary>
    public void TrimBefore(DateTimeOffset cutoff)
    {
        while (_count > 1 && At(1).SourceTime <= cutoff)
        {
            _start = (_start + 1) % _ring.Length;
            _count--;
        }
    }

    /// <summary>Appends every sample held, oldest first.</summary>
    public void CopyTo(List<Sample> samples)
    {
        for (int i = 0; i < _count; i++)
        {
            samples.Add(At(i));
        }
    }

    private Sample At(int i) => _ring[(_start + i) % _ring.Length];

    private void Put(int i, Sample s) => _ring[(_start + i) % _ring.Length] = s;
}
