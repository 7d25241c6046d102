namespace SoftSensor.Core.Signals;

/// <summary>
/// The time-aligned inputs of one cycle, one slot per <see cref="SignalRole"/>: value (in the
/// role's unit), quality and source timestamp. Preallocated and reused by the caller so that a
/// cycle allocates nothing; a slot that was not supplied is marked missing.
/// </summary>
public sealed class AlignedInputs
{
    private readonly double[] _values = new double[SignalRoles.Count];
    private readonly SampleQuality[] _qualities = new SampleQuality[SignalRoles.Count];
    private readonly DateTimeOffset[] _times = new DateTimeOffset[SignalRoles.Count];
    private readonly bool[] _present = new bool[SignalRoles.Count];

    /// <summary>The cycle's time (UTC): the moment the inputs are aligned to.</summary>
    public DateTimeOffset Time { get; set; }

    /// <summary>Marks every slot missing.</summary>
    public void Clear()
    {
        Array.Clear(_present);
        Array.Clear(_values);
        Array.Clear(_qualities);
    }

    /// <summary>Sets a slot.</summary>
    public void Set(SignalRole role, double value, SampleQuality quality, DateTimeOffset sourceTime)
    {
        int i = (int)role;
        _values[i] = value;
        _qualities[i] = quality;
        _times[i] = sourceTime;
        _present[i] = true;
    }

    /// <summary>Marks one slot missing.</summary>
    public void Remove(SignalRole role) => _present[(int)role] = false;

    /// <summary>True when the slot was supplied.</summary>
    public bool Has(SignalRole role) => _present[(int)role];

    /// <summary>The slot's value, or <paramref name="fallback"/> when it is missing.</summary>
    public double ValueOr(SignalRole role, double fallback) => _present[(int)role] ? _values[(int)role] : fallback;

    /// <summary>The slot's value (NaN when missing).</summary>
    public double this[SignalRole role] => _present[(int)role] ? _values[(int)role] : double.NaN;

    /// <summary>The slot's quality (Bad when missing).</summary>
    public SampleQuality QualityOf(SignalRole role) => _present[(int)role] ? _qualities[(int)role] : SampleQuality.Bad;

    /// <summary>The slot's source timestamp (default when missing).</summary>
    public DateTimeOffset SourceTimeOf(SignalRole role) => _present[(int)role] ? _times[(int)role] : default;

    /// <summary>Copies every slot from <paramref name="other"/>.</summary>
    public void CopyFrom(AlignedInputs other)
    {
        Time = other.Time;
        other._values.CopyTo(_values, 0);
        other._qualities.CopyTo(_qualities, 0);
        other._times.CopyTo(_times, 0);
        other._present.CopyTo(_present, 0);
    }
}
