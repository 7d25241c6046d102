namespace SoftSensor.Simulation.Instruments;

/// <summary>Normal deviates from a seeded <see cref="Random"/> (Box–Muller, Box &amp; Muller 1958, Ann. Math. Stat. 29).</summary>
internal sealed class GaussianSource
{
    private readonly Random _random;
    private double _spare;
    private bool _hasSpare;

    public GaussianSource(int seed) => _random = new Random(seed);

    /// <summary>A deviate with mean 0 and standard deviation <paramref name="sd"/>.</summary>
    public double Next(double sd)
    {
        if (_hasSpare)
        {
            _hasSpare = false;
            return _spare * sd;
        }

        double u1 = 1.0 - _random.NextDouble(); // (0, 1]
        double u2 = _random.NextDouble();
        double radius = Math.Sqrt(-2.0 * Math.Log(u1));
        double angle = 2.0 * Math.PI * u2;
        _spare = radius * Math.Sin(angle);
        _hasSpare = true;
        return radius * Math.Cos(angle) * sd;
    }
}
