namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// In-place Cholesky factorisation Phi = L L^T of a small symmetric positive-definite matrix stored
/// row-major (lower triangle read), and the triangular solves that use it; allocation-free, for the
/// per-cycle path (Golub &amp; Van Loan, Matrix Computations, 4th ed., algorithm 4.2.1).
/// </summary>
internal static class DenseCholesky
{
    // A pivot this small relative to its diagonal entry means Phi is singular to working precision.
    private const double RelativePivotFloor = 1e-13;

    /// <summary>Overwrites the lower triangle with L; false when the matrix is not positive definite.</summary>
    public static bool FactorInPlace(Span<double> a, int n)
    {
        unchecked
        {
            for (int j = 0; j < n; j++)
            {
                double original = a[(j * n) + j];
                double d = original;
                for (int k = 0; k < j; k++)
                {
                    d -= a[(j * n) + k] * a[(j * n) + k];
                }

                if (!(d > RelativePivotFloor * Math.Abs(original)) || !double.IsFinite(d))
                {
                    return false;
                }

                double l = Math.Sqrt(d);
                a[(j * n) + j] = l;
                for (int i = j + 1; i < n; i++)
                {
                    double s = a[(i * n) + j];
                    for (int k = 0; k < j; k++)
                    {
                        s -= a[(i * n) + k] * a[(j * n) + k];
                    }

                    a[(i * n) + j] = s / l;
                }
            }

            return true;
        }
    }

    /// <summary>Solves L L^T x = b in place.</summary>
    public static void SolveInPlace(ReadOnlySpan<double> l, int n, Span<double> b)
    {
        unchecked
        {
            for (int i = 0; i < n; i++)
            {
                double s = b[i];
                for (int k = 0; k < i; k++)
                {
                    s -= l[(i * n) + k] * b[k];
                }

                b[i] = s / l[(i * n) + i];
            }

            for (int i = n - 1; i >= 0; i--)
            {
                double s = b[i];
                for (int k = i + 1; k < n; k++)
                {
                    s -= l[(k * n) + i] * b[k];
                }

                b[i] = s / l[(i * n) + i];
            }
        }
    }

    /// <summary>Solves L Y = G in place for G of n rows and <paramref name="columns"/> columns, row-major.</summary>
    public static void ForwardColumns(ReadOnlySpan<double> l, int n, Span<double> g, int columns)
    {
        unchecked
        {
            for (int c = 0; c < columns; c++)
            {
                for (int i = 0; i < n; i++)
                {
                    double s = g[(i * columns) + c];
                    for (int k = 0; k < i; k++)
                    {
                        s -= l[(i * n) + k] * g[(k * columns) + c];
                    }

                    g[(i * columns) + c] = s / l[(i * n) + i];
                }
            }
        }
    }
}
