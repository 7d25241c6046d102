using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// In-place Cholesky factorisation Phi = L L^T of a small symmetric positive-definite matrix stored
/// row-major (lower triangle read), and the triangular solves that use it; allocation-free, for the
/// per-cycle path (Golub &amp; Van Loan, Matrix Computations, 4th ed., algorithm 4.2.1). The sizes are
/// checked once per call; the loops then run on references without bounds checks.
/// </summary>
internal static class DenseCholesky
{
    // A pivot this small relative to its diagonal entry means Phi is singular to working precision.
    private const double RelativePivotFloor = 1e-13;

    /// <summary>Overwrites the lower triangle with L; false when the matrix is not positive definite.</summary>
    public static bool FactorInPlace(Span<double> matrix, int n)
    {
        unchecked
        {
            Check(matrix.Length, n * n);
            ref double a = ref MemoryMarshal.GetReference(matrix);
            for (int j = 0; j < n; j++)
            {
                ref double rowJ = ref Unsafe.Add(ref a, j * n);
                double original = Unsafe.Add(ref rowJ, j);
                double d = original;
                for (int k = 0; k < j; k++)
                {
                    d -= Unsafe.Add(ref rowJ, k) * Unsafe.Add(ref rowJ, k);
                }

                if (!(d > RelativePivotFloor * Math.Abs(original)) || !double.IsFinite(d))
                {
                    return false;
                }

                double l = Math.Sqrt(d);
                Unsafe.Add(ref rowJ, j) = l;
                for (int i = j + 1; i < n; i++)
                {
                    ref double rowI = ref Unsafe.Add(ref a, i * n);
                    double s = Unsafe.Add(ref rowI, j);
                    for (int k = 0; k < j; k++)
                    {
                        s -= Unsafe.Add(ref rowI, k) * Unsafe.Add(ref rowJ, k);
                    }

                    Unsafe.Add(ref rowI, j) = s / l;
                }
            }

            return true;
        }
    }

    /// <summary>Solves L L^T x = b in place.</summary>
    public static void SolveInPlace(ReadOnlySpan<double> factor, int n, Span<double> rhs)
    {
        unchecked
        {
            Check(factor.Length, n * n);
            Check(rhs.Length, n);
            ref double l = ref MemoryMarshal.GetReference(factor);
            ref double b = ref MemoryMarshal.GetReference(rhs);
            for (int i = 0; i < n; i++)
            {
                double s = Unsafe.Add(ref b, i);
                for (int k = 0; k < i; k++)
                {
                    s -= Unsafe.Add(ref l, (i * n) + k) * Unsafe.Add(ref b, k);
                }

                Unsafe.Add(ref b, i) = s / Unsafe.Add(ref l, (i * n) + i);
            }

            for (int i = n - 1; i >= 0; i--)
            {
                double s = Unsafe.Add(ref b, i);
                for (int k = i + 1; k < n; k++)
                {
                    s -= Unsafe.Add(ref l, (k * n) + i) * Unsafe.Add(ref b, k);
                }

                Unsafe.Add(ref b, i) = s / Unsafe.Add(ref l, (i * n) + i);
            }
        }
    }

    /// <summary>Solves L Y = G in place for G of n rows and <paramref name="columns"/> columns, row-major.</summary>
    public static void ForwardColumns(ReadOnlySpan<double> factor, int n, Span<double> matrix, int columns)
    {
        unchecked
        {
            Check(factor.Length, n * n);
            Check(matrix.Length, n * columns);
            ref double l = ref MemoryMarshal.GetReference(factor);
            ref double g = ref MemoryMarshal.GetReference(matrix);
            for (int c = 0; c < columns; c++)
            {
                for (int i = 0; i < n; i++)
                {
                    double s = Unsafe.Add(ref g, (i * columns) + c);
                    for (int k = 0; k < i; k++)
                    {
                        s -= Unsafe.Add(ref l, (i * n) + k) * Unsafe.Add(ref g, (k * columns) + c);
                    }

                    Unsafe.Add(ref g, (i * columns) + c) = s / Unsafe.Add(ref l, (i * n) + i);
                }
            }
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Check(int length, int needed)
    {
        if (length < needed)
        {
            TooShort(length, needed);
        }
    }

    [MethodImpl(MethodImplOptions.NoInlining)]
    private static void TooShort(int length, int needed) =>
        throw new ArgumentException($"span of {length} values where {needed} are needed");
}
