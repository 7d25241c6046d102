using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Alarms;

/// <summary>One signal's value and quality as the alarm rules see it.</summary>
public readonly record struct SignalReading(double Value, SampleQuality Quality);

/// <summary>
/// Everything the alarm rules may read in one evaluation: the evaluation time (the cycle's time,
/// never a clock) and the latest reading of each signal. Reusable: <see cref="Clear"/> and refill.
/// </summary>
public sealed class AlarmSnapshot
{
    private readonly Dictionary<SignalRef, SignalReading> _readings = [];

    /// <summary>The evaluation time (UTC); delays, rates and shelving expiry are measured on it.</summary>
    public DateTimeOffset Time { get; set; }

    /// <summary>Number of readings held.</summary>
    public int Count => _readings.Count;

    /// <summary>Forgets every reading.</summary>
    public void Clear() => _readings.Clear();

    /// <summary>Sets one reading.</summary>
    public void Set(SignalRef signal, double value, SampleQuality quality) => _readings[signal] = new SignalReading(value, quality);

    /// <summary>The reading of a signal, when present.</summary>
    public bool TryGet(SignalRef signal, out SignalReading reading) => _readings.TryGetValue(signal, out reading);

    /// <summary>Adds every estimate of a frame and sets <see cref="Time"/> to the frame's source time.</summary>
    public void AddFrame(EstimateFrame frame)
    {
        Time = frame.Time;
        foreach (var v in frame.Values)
        {
            Set(SignalRef.Estimate(v.Name), v.Value, v.Quality);
        }
    }

    /// <summary>Adds every present slot of the cycle's aligned inputs.</summary>
    public void AddInputs(AlignedInputs inputs)
    {
        foreach (var role in Enum.GetValues<SignalRole>())
        {
            if (inputs.Has(role))
            {
                Set(SignalRef.Input(role), inputs[role], inputs.QualityOf(role));
            }
        }
    }

    /// <summary>Adds a raw tag sample.</summary>
    public void AddSample(Sample sample) => Set(SignalRef.Tag(sample.Tag), sample.Value, sample.Quality);
}
