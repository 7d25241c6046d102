namespace SoftSensor.Core.Estimation;

/// <summary>
/// A fixed-capacity ring buffer of the last cycles, oldest overwritten first. It lets a late
/// offline sample be applied at its sampling time and the observers re-run to the present
/// without touching the estimates already published.
/// </summary>
public sealed class CycleHistory
{
    private readonly HistoryEntry[] _entries;
    private int _start;

    /// <summary>Creates an empty history.</summary>
    public CycleHistory(int capacity)
    {
        if (capacity < 2)
        {
            throw new ArgumentOutOfRangeException(nameof(capacity), capacity, "history capacity must be at least 2 cycles");
        }

        _entries = new HistoryEntry[capacity];
    }

    /// <summary>Maximum number of cycles kept.</summary>
    public int Capacity => _entries.Length;

    /// <summary>Number of cycles kept.</summary>
    public int Count { get; private set; }

    /// <summary>The i-th kept cycle, 0 = oldest.</summary>
    public ref HistoryEntry this[int i] => ref _entries[(_start + i) % _entries.Length];

    /// <summary>Appends a cycle, dropping the oldest when full.</summary>
    public void Push(in HistoryEntry entry)
    {
        if (Count < _entries.Length)
        {
            _entries[(_start + Count) % _entries.Length] = entry;
            Count++;
        }
        else
        {
            _entries[_start] = entry;
            _start = (_start + 1) % _entries.Length;
        }
    }

    /// <summary>Index of the newest cycle at or before <paramref name="timeTicks"/>, or -1 when all are later.</summary>
    public int IndexAtOrBefore(long timeTicks)
    {
        int lo = 0, hi = Count - 1, found = -1;
        while (lo <= hi)
        {
            int mid = lo + ((hi - lo) / 2);
            if (this[mid].TimeTicks <= timeTicks)
            {
                found = mid;
                lo = mid + 1;
            }
            else
            {
                hi = mid - 1;
            }
        }

        return found;
    }

    /// <summary>Empties the history.</summary>
    public void Clear()
    {
        _start = 0;
        Count = 0;
    }
}
