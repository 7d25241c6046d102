namespace SoftSensor.Simulation.Instruments;

/// <summary>The sample line and dryer of the off-gas analyser: a pure dead time over the headspace composition.</summary>
internal sealed class AnalyserDelay
{
    private readonly double[] _o2;
    private readonly double[] _co2;
    private int _next;

    /// <param name="delaySteps">Dead time in integration steps.</param>
    /// <param name="o2">Headspace O2 fraction before the run.</param>
    /// <param name="co2">Headspace CO2 fraction before the run.</param>
    public AnalyserDelay(int delaySteps, double o2, double co2)
    {
        _o2 = new double[delaySteps + 1];
        _co2 = new double[delaySteps + 1];
        Array.Fill(_o2, o2);
        Array.Fill(_co2, co2);
    }

    /// <summary>Records the headspace composition of the step just finished.</summary>
    public void Push(double o2, double co2)
    {
        _o2[_next] = o2;
        _co2[_next] = co2;
        _next = (_next + 1) % _o2.Length;
    }

    /// <summary>The composition that reaches the analyser cell now (the oldest one kept).</summary>
    public (double O2, double Co2) AtCell => (_o2[_next], _co2[_next]);
}
