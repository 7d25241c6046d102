using MathNet.Numerics.Distributions;

namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// The factored system for one set of columns and one split into measured and unknown rates
/// (Wang &amp; Stephanopoulos 1983; van der Heijden et al. 1994a, Biotechnol. Bioeng. 43):
/// A_m q_m + A_u q_u = 0 with A the balances and specifications. Precomputes the independent rows
/// R_r of the redundancy matrix R = A_m - A_u pinv(A_u) A_m and K = -pinv(A_u) A_m. Not thread-safe:
/// it owns its scratch vectors so that <see cref="Solve"/> allocates nothing. The per-cycle arithmetic is in BalanceKernel.Solve.cs.
/// </summary>
internal sealed partial class BalanceKernel
{
    // A calculable unknown has a zero row in the null space of A_u (Klamt, Schuster & Gilles 2002);
    // the basis is orthonormal, so the squared row norm is dimensionless.
    private const double NullRowTolerance = 1e-12;

    private readonly double[] _rr;      // rho x m, row-major
    private readonly double[] _k;       // u x m, row-major
    private readonly double[] _eps, _t, _phi, _z, _qs, _psiS, _kp, _g;
    private readonly int[] _measuredAt, _unknownAt; // column -> position in q_m / q_u, or -1

    public BalanceKernel(double[,] a, int[] measuredColumns, double rankTolerance, double alpha)
    {
        int rows = a.GetLength(0);
        Columns = a.GetLength(1);
        MeasuredColumns = measuredColumns;
        UnknownColumns = Enumerable.Range(0, Columns).Where(c => Array.IndexOf(measuredColumns, c) < 0).ToArray();
        int m = measuredColumns.Length, u = UnknownColumns.Length;

        double threshold = rankTolerance * Math.Max(1.0, SingularValues.Largest(a));
        RankA = SingularValues.Of(a, threshold).Rank;
        var am = Select(a, measuredColumns);
        var au = Select(a, UnknownColumns);
        var svdU = SingularValues.Of(au, threshold);
        RankUnknown = svdU.Rank;
        Calculable = new bool[u];
        for (int j = 0; j < u; j++)
        {
            Calculable[j] = svdU.NullSpaceRowNormSquared(j) <= NullRowTolerance;
        }

        // R spans the same rows as W A_m, W a basis of the left null space of A_u; its SVD gives
        // independent rows R_r = S_r V_r^T, well conditioned whatever the scaling of the balances.
        var r = Multiply(svdU.LeftNullSpace(), am);
        var svdR = SingularValues.Of(r, threshold);
        Redundancy = svdR.Rank;
        _rr = new double[Redundancy * m];
        for (int i = 0; i < Redundancy; i++)
        {
            for (int j = 0; j < m; j++)
            {
                _rr[(i * m) + j] = svdR.S[i] * svdR.Vt[i, j];
            }
        }

        var k = Multiply(svdU.PseudoInverse(), am);
        _k = new double[u * m];
        for (int i = 0; i < u; i++)
        {
            for (int j = 0; j < m; j++)
            {
                _k[(i * m) + j] = -k[i, j];
            }
        }

        _measuredAt = Enumerable.Repeat(-1, Columns).ToArray();
        _unknownAt = Enumerable.Repeat(-1, Columns).ToArray();
        for (int i = 0; i < m; i++)
        {
            _measuredAt[measuredColumns[i]] = i;
        }

        for (int j = 0; j < u; j++)
        {
            _unknownAt[UnknownColumns[j]] = j;
        }

        Critical = Redundancy > 0 ? ChiSquared.InvCDF(Redundancy, 1 - alpha) : double.NaN;
        _eps = new double[Redundancy];
        _z = new double[Redundancy];
        _t = new double[m * Redundancy];
        _g = new double[m * Redundancy];
        _phi = new double[Redundancy * Redundancy];
        _qs = new double[m];
        _psiS = new double[m * m];
        _kp = new double[u * m];
    }

    public int Columns { get; }

    public int[] MeasuredColumns { get; }

    public int[] UnknownColumns { get; }

    public int RankA { get; }

    public int RankUnknown { get; }

    /// <summary>Number of independent redundant relations (rho, the χ² degrees of freedom).</summary>
    public int Redundancy { get; }

    /// <summary>Dimensions of the unknown rates that the measurements leave open.</summary>
    public int Nullity => UnknownColumns.Length - RankUnknown;

    /// <summary>Per unknown: determined by the measurements and specifications.</summary>
    public bool[] Calculable { get; }

    /// <summary>The χ² (1 - alpha) quantile with <see cref="Redundancy"/> degrees of freedom.</summary>
    public double Critical { get; }

    private static double[,] Select(double[,] a, int[] columns)
    {
        var s = new double[a.GetLength(0), columns.Length];
        for (int i = 0; i < a.GetLength(0); i++)
        {
            for (int j = 0; j < columns.Length; j++)
            {
                s[i, j] = a[i, columns[j]];
            }
        }

        return s;
    }

    private static double[,] Multiply(double[,] x, double[,] y)
    {
        int r = x.GetLength(0), inner = x.GetLength(1), c = y.GetLength(1);
        var p = new double[r, c];
        for (int i = 0; i < r; i++)
        {
            for (int j = 0; j < c; j++)
            {
                double s = 0;
                for (int l = 0; l < inner; l++)
                {
                    s += x[i, l] * y[l, j];
                }

                p[i, j] = s;
            }
        }

        return p;
    }
}
