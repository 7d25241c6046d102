namespace SoftSensor.Simulation.Vessel;

/// <summary>Classical fourth-order Runge–Kutta with a fixed step, allocation-free (Press et al., Numerical Recipes, 3rd ed., §17.1).</summary>
internal sealed class Integrator
{
    private readonly double[] _k1;
    private readonly double[] _k2;
    private readonly double[] _k3;
    private readonly double[] _k4;
    private readonly double[] _tmp;

    public Integrator(int n)
    {
        _k1 = new double[n];
        _k2 = new double[n];
        _k3 = new double[n];
        _k4 = new double[n];
        _tmp = new double[n];
    }

    /// <summary>Advances <paramref name="y"/> from <paramref name="t"/> by <paramref name="h"/> (hours).</summary>
    public void Step(ReactorModel model, double t, double h, double[] y)
    {
        int n = y.Length;
        model.Evaluate(t, y, _k1);
        for (int i = 0; i < n; i++)
        {
            _tmp[i] = y[i] + (0.5 * h * _k1[i]);
        }

        model.Evaluate(t + (0.5 * h), _tmp, _k2);
        for (int i = 0; i < n; i++)
        {
            _tmp[i] = y[i] + (0.5 * h * _k2[i]);
        }

        model.Evaluate(t + (0.5 * h), _tmp, _k3);
        for (int i = 0; i < n; i++)
        {
            _tmp[i] = y[i] + (h * _k3[i]);
        }

        model.Evaluate(t + h, _tmp, _k4);
        for (int i = 0; i < n; i++)
        {
            y[i] += h / 6.0 * (_k1[i] + (2 * _k2[i]) + (2 * _k3[i]) + _k4[i]);
        }
    }
}
