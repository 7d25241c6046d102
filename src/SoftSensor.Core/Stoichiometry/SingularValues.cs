using MathNet.Numerics.LinearAlgebra;

namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// A full singular value decomposition A = U S V^T (MathNet.Numerics) with a rank decided by an absolute
/// threshold, defined also for matrices with no rows or no columns (MathNet rejects those).
/// </summary>
internal sealed class SingularValues
{
    private SingularValues(int rows, int columns, double[] s, double[,] u, double[,] vt, int rank)
    {
        Rows = rows;
        Columns = columns;
        S = s;
        U = u;
        Vt = vt;
        Rank = rank;
    }

    public int Rows { get; }

    public int Columns { get; }

    /// <summary>Singular values, descending (min(rows, columns) of them).</summary>
    public double[] S { get; }

    /// <summary>Left singular vectors, rows x rows.</summary>
    public double[,] U { get; }

    /// <summary>Right singular vectors transposed, columns x columns.</summary>
    public double[,] Vt { get; }

    /// <summary>Number of singular values above the threshold.</summary>
    public int Rank { get; }

    /// <summary>Decomposes <paramref name="a"/>; singular values at or below <paramref name="threshold"/> count as zero.</summary>
    public static SingularValues Of(double[,] a, double threshold)
    {
        int r = a.GetLength(0), c = a.GetLength(1);
        if (r == 0 || c == 0)
        {
            return new SingularValues(r, c, [], Identity(r), Identity(c), 0);
        }

        var svd = Matrix<double>.Build.DenseOfArray(a).Svd(computeVectors: true);
        double[] s = svd.S.ToArray();
        int rank = s.Count(x => x > threshold);
        return new SingularValues(r, c, s, svd.U.ToArray(), svd.VT.ToArray(), rank);
    }

    /// <summary>The largest singular value of <paramref name="a"/> (0 for an empty or zero matrix).</summary>
    public static double Largest(double[,] a)
    {
        int r = a.GetLength(0), c = a.GetLength(1);
        return r == 0 || c == 0 ? 0 : Matrix<double>.Build.DenseOfArray(a).Svd(computeVectors: false).S[0];
    }

    /// <summary>Rows of a basis of the left null space {w : w^T A = 0}: (rows - rank) x rows.</summary>
    public double[,] LeftNullSpace()
    {
        int k = Rows - Rank;
        var w = new double[k, Rows];
        for (int i = 0; i < k; i++)
        {
            for (int j = 0; j < Rows; j++)
            {
                w[i, j] = U[j, Rank + i];
            }
        }

        return w;
    }

    /// <summary>Squared norm of row <paramref name="j"/> of the right null-space basis (V columns beyond the rank).</summary>
    public double NullSpaceRowNormSquared(int j)
    {
        double sum = 0;
        for (int i = Rank; i < Columns; i++)
        {
            sum += Vt[i, j] * Vt[i, j];
        }

        return sum;
    }

    /// <summary>The Moore-Penrose pseudo-inverse (columns x rows) over the singular values counted in the rank.</summary>
    public double[,] PseudoInverse()
    {
        var p = new double[Columns, Rows];
        for (int k = 0; k < Rank; k++)
        {
            double inv = 1.0 / S[k];
            for (int i = 0; i < Columns; i++)
            {
                double v = Vt[k, i] * inv;
                for (int j = 0; j < Rows; j++)
                {
                    p[i, j] += v * U[j, k];
                }
            }
        }

        return p;
    }

    private static double[,] Identity(int n)
    {
        var m = new double[n, n];
        for (int i = 0; i < n; i++)
        {
            m[i, i] = 1;
        }

        return m;
    }
}
