using MathNet.Numerics.LinearAlgebra;

namespace SoftSensor.Core.Flux;

/// <summary>
/// Rank, pseudo-inverse and null space of a constraint matrix from its singular value
/// decomposition (Golub &amp; Van Loan, Matrix Computations, 4th ed., sec. 5.5: the numerical rank
/// counts singular values above a tolerance; the right singular vectors beyond it span the null
/// space). A rank-deficient matrix is an ordinary result here, never an exception.
/// </summary>
internal sealed class RankRevealing
{
    /// <summary>Singular values at or below this fraction of the largest count as zero.</summary>
    public const double RelativeTolerance = 1e-10;

    private RankRevealing(int rank, double[,] pseudoInverse, double[,] nullSpace)
    {
        Rank = rank;
        PseudoInverse = pseudoInverse;
        NullSpace = nullSpace;
    }

    /// <summary>Numerical rank.</summary>
    public int Rank { get; }

    /// <summary>Moore-Penrose pseudo-inverse, columns x rows of the input.</summary>
    public double[,] PseudoInverse { get; }

    /// <summary>Orthonormal basis of the null space, columns of the input x nullity.</summary>
    public double[,] NullSpace { get; }

    /// <summary>Decomposes <paramref name="a"/> (rows x columns, either may be zero rows).</summary>
    public static RankRevealing Of(double[,] a)
    {
        int rows = a.GetLength(0), cols = a.GetLength(1);
        if (rows == 0 || cols == 0)
        {
            var identity = new double[cols, cols];
            for (int i = 0; i < cols; i++)
            {
                identity[i, i] = 1;
            }

            return new RankRevealing(0, new double[cols, rows], identity);
        }

        var m = Matrix<double>.Build.DenseOfArray(a);
        var svd = m.Svd(computeVectors: true);
        var s = svd.S;
        double max = s.Count > 0 ? s.AbsoluteMaximum() : 0;
        int rank = 0;
        for (int i = 0; i < s.Count; i++)
        {
            if (s[i] > max * RelativeTolerance && s[i] > 0)
            {
                rank++;
            }
        }

        var u = svd.U;
        var vt = svd.VT;
        var pinv = new double[cols, rows];
        for (int k = 0; k < rank; k++)
        {
            double inv = 1.0 / s[k];
            for (int i = 0; i < cols; i++)
            {
                double vik = vt[k, i] * inv;
                for (int j = 0; j < rows; j++)
                {
                    pinv[i, j] += vik * u[j, k];
                }
            }
        }

        var nullSpace = new double[cols, cols - rank];
        for (int k = rank; k < cols; k++)
        {
            for (int i = 0; i < cols; i++)
            {
                nullSpace[i, k - rank] = vt[k, i];
            }
        }

        return new RankRevealing(rank, pinv, nullSpace);
    }

    /// <summary>Numerical rank of <paramref name="a"/>.</summary>
    public static int RankOf(double[,] a) => Of(a).Rank;

    /// <summary>Euclidean norm of row <paramref name="i"/> of <paramref name="m"/>.</summary>
    public static double RowNorm(double[,] m, int i)
    {
        double s = 0;
        for (int j = 0; j < m.GetLength(1); j++)
        {
            s += m[i, j] * m[i, j];
        }

        return Math.Sqrt(s);
    }

    /// <summary>Product a (r x k) times b (k x c).</summary>
    public static double[,] Multiply(double[,] a, double[,] b)
    {
        int r = a.GetLength(0), k = a.GetLength(1), c = b.GetLength(1);
        var p = new double[r, c];
        for (int i = 0; i < r; i++)
        {
            for (int j = 0; j < c; j++)
            {
                double sum = 0;
                for (int t = 0; t < k; t++)
                {
                    sum += a[i, t] * b[t, j];
                }

                p[i, j] = sum;
            }
        }

        return p;
    }
}
