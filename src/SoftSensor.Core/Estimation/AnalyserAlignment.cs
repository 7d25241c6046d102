using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// Aligns the off-gas readings with the process (docs/methods.md §1.4): the analyser sees the gas a
/// dead time θ late (sample line, dryer), so the reading taken at τ belongs to the process at
/// τ - θ. Each pushed snapshot at τ yields the aligned inputs of time τ - θ: every slot from the
/// newest snapshot at or before τ - θ, the outlet O2/CO2 and the calibration flag from τ. Keeps
/// a preallocated ring of snapshots; allocation-free after construction.
/// </summary>
public sealed class AnalyserAlignment
{
    private readonly AlignedInputs[] _ring;
    private readonly long _deadTimeTicks;
    private int _start;
    private int _count;

    /// <summary>Creates an aligner for dead time <paramref name="deadTimeS"/> keeping up to <paramref name="capacity"/> snapshots.</summary>
    public AnalyserAlignment(double deadTimeS, int capacity)
    {
        if (!(deadTimeS >= 0 && double.IsFinite(deadTimeS)))
        {
            throw new ArgumentOutOfRangeException(nameof(deadTimeS), deadTimeS, "analyser dead time must be a finite number of seconds >= 0");
        }

        if (capacity < 2)
        {
            throw new ArgumentOutOfRangeException(nameof(capacity), capacity, "alignment capacity must be at least 2 snapshots");
        }

        _deadTimeTicks = (long)Math.Round(deadTimeS * TimeSpan.TicksPerSecond);
        _ring = new AlignedInputs[capacity];
        for (int i = 0; i < capacity; i++)
        {
            _ring[i] = new AlignedInputs();
        }
    }

    /// <summary>The dead time, s.</summary>
    public double DeadTimeS => _deadTimeTicks / (double)TimeSpan.TicksPerSecond;

    /// <summary>
    /// Pushes the snapshot of time τ and writes the aligned inputs of τ - θ into
    /// <paramref name="aligned"/>; false while the history does not yet reach back θ.
    /// </summary>
    public bool Push(AlignedInputs snapshot, AlignedInputs aligned)
    {
        if (_count == _ring.Length)
        {
            _start = (_start + 1) % _ring.Length;
            _count--;
        }

        _ring[(_start + _count) % _ring.Length].CopyFrom(snapshot);
        _count++;

        long target = snapshot.Time.UtcTicks - _deadTimeTicks;
        int found = -1;
        for (int i = _count - 1; i >= 0; i--)
        {
            if (_ring[(_start + i) % _ring.Length].Time.UtcTicks <= target)
            {
                found = i;
                break;
            }
        }

        if (found < 0)
        {
            return false;
        }

        // Drop what is older than the snapshot now in use: it will not be needed again.
        _start = (_start + found) % _ring.Length;
        _count -= found;

        var process = _ring[_start];
        aligned.CopyFrom(process);
        aligned.Time = new DateTimeOffset(target, TimeSpan.Zero);
        CopySlot(snapshot, aligned, SignalRole.OutletO2Percent);
        CopySlot(snapshot, aligned, SignalRole.OutletCo2Percent);
        CopySlot(snapshot, aligned, SignalRole.AnalyserCalibrating);
        return true;
    }

    /// <summary>Forgets every snapshot.</summary>
    public void Clear()
    {
        _start = 0;
        _count = 0;
    }

    private static void CopySlot(AlignedInputs from, AlignedInputs to, SignalRole role)
    {
        if (from.Has(role))
        {
            to.Set(role, from[role], from.QualityOf(role), from.SourceTimeOf(role));
        }
        else
        {
            to.Remove(role);
        }
    }
}
