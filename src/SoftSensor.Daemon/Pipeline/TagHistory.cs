using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// The recent samples of one tag, oldest first, in a ring (no allocation per sample once it has grown
/// to what the tag's dead time needs). Samples are kept in source-time order; one older than the
/// newest is inserted in place (late delivery). The ring starts small and doubles up to its
/// capacity, then the oldest sample falls out: the signal store trims each tag to its dead time, so
/// a thousand reactors do not hold a full ring per tag. The entries hold no references (the tag
/// name lives here once), so the garbage collector never scans them. Not thread-safe: the signal
/// store's owner serialises access.
/// </summary>
internal sealed class TagHistory
{
    private const int InitialCapacity = 8;
    private readonly string _tag;
    private readonly int _capacity;
    private Entry[] _ring;
    private int _start;
    private int _count;

    public TagHistory(int capacity, string tag = "")
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(capacity, 2);
        _capacity = capacity;
        _tag = tag;
        _ring = new Entry[Math.Min(InitialCapacity, capacity)];
    }

    /// <summary>Number of samples held.</summary>
    public int Count => _count;

    /// <summary>The newest sample, or null.</summary>
    public Sample? Latest => _count == 0 ? null : ToSample(At(_count - 1));

    /// <summary>Adds a sample; the oldest falls out when the ring is full at its capacity.</summary>
    public void Add(in Sample sample)
    {
        if (_count == _ring.Length)
        {
            if (_ring.Length < _capacity)
            {
                Grow();
            }
            else
            {
                _start = (_start + 1) % _ring.Length;
                _count--;
            }
        }

        var entry = new Entry(sample.Value, sample.SourceTime, sample.Quality, sample.StatusCode);
        int i = _count;
        while (i > 0 && At(i - 1).SourceTime > entry.SourceTime)
        {
            Put(i, At(i - 1));
            i--;
        }

        Put(i, entry);
        _count++;
    }

    /// <summary>The newest sample whose source time is at or before <paramref name="time"/>, or null.</summary>
    public Sample? AtOrBefore(DateTimeOffset time)
    {
        for (int i = _count - 1; i >= 0; i--)
        {
            var e = At(i);
            if (e.SourceTime <= time)
            {
                return ToSample(e);
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
            samples.Add(ToSample(At(i)));
        }
    }

    private void Grow()
    {
        var bigger = new Entry[Math.Min(_ring.Length * 2, _capacity)];
        for (int i = 0; i < _count; i++)
        {
            bigger[i] = At(i);
        }

        _ring = bigger;
        _start = 0;
    }

    private Sample ToSample(in Entry e) => new(_tag, e.Value, e.SourceTime, e.Quality, e.StatusCode);

    private Entry At(int i) => _ring[(_start + i) % _ring.Length];

    private void Put(int i, in Entry e) => _ring[(_start + i) % _ring.Length] = e;

    /// <summary>A sample without its tag: no references.</summary>
    private readonly record struct Entry(double Value, DateTimeOffset SourceTime, SampleQuality Quality, uint StatusCode);
}
