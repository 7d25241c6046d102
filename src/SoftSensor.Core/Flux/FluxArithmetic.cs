namespace SoftSensor.Core.Flux;

/// <summary>Allocation-free matrix-vector products of the cycle.</summary>
internal static class FluxArithmetic
{
    /// <summary>y = M x.</summary>
    public static void Apply(double[,] m, ReadOnlySpan<double> x, Span<double> y)
    {
        int rows = m.GetLength(0), cols = m.GetLength(1);
        for (int i = 0; i < rows; i++)
        {
            double s = 0;
            for (int j = 0; j < cols; j++)
            {
                s += m[i, j] * x[j];
            }

            y[i] = s;
        }
    }

    /// <summary>max_i |(A v - b)_i|.</summary>
    public static double MaxResidual(double[,] a, ReadOnlySpan<double> v, ReadOnlySpan<double> b)
    {
        double max = 0;
        for (int i = 0; i < a.GetLength(0); i++)
        {
            double s = -b[i];
            for (int k = 0; k < a.GetLength(1); k++)
            {
                s += a[i, k] * v[k];
            }

            max = Math.Max(max, Math.Abs(s));
        }

        return max;
    }

    /// <summary>q = T v (exchange rates from fluxes).</summary>
    public static void Exchange(double[,] t, ReadOnlySpan<double> v, Span<double> q) => Apply(t, v, q);
}
