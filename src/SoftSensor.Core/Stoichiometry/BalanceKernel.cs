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

    // Model uncertainty (docs/model-uncertainty.md): per uncertain column c, with D_c = diag(σ_c²) over
    // the rows, M_c = W_r D_c W_r^T (rho x rho), N_c = P D_c P^T (u x u), Q_c = W_r D_c P^T (rho x u),
    // W_r the left-null-space rows that give R_r = W_r A_m and P = pinv(A_u).
    private readonly int[] _uncertainColumns;
    private readonly double[] _mc, _nc, _qc, _qhat2, _y, _extra, _kt;

    public BalanceKernel(double[,] a, int[] measuredColumns, double rankTolerance, double alpha)
        : this(a, measuredColumns, rankTolerance, alpha, null)
    {
    }

    /// <param name="a">The constraint matrix, rows x columns.</param>
    /// <param name="measuredColumns">Columns measured, in the order of q_m.</param>
    /// <param name="rankTolerance">Relative singular-value threshold.</param>
    /// <param name="alpha">Significance level of the test.</param>
    /// <param name="columnRowSigmas">Per column null or the σ of its entry in every row (docs/model-uncertainty.md).</param>
    public BalanceKernel(double[,] a, int[] measuredColumns, double rankTolerance, double alpha, double[]?[]? columnRowSigmas)
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

        var uncertain = new List<int>();
        for (int c = 0; c < Columns && columnRowSigmas is not null && c < columnRowSigmas.Length; c++)
        {
            if (columnRowSigmas[c] is { } sg && sg.Any(v => v != 0))
            {
                if (sg.Length != rows)
                {
                    throw new ArgumentException($"column {c}: {sg.Length} row sigmas for {rows} rows", nameof(columnRowSigmas));
                }

                uncertain.Add(c);
            }
        }

        _uncertainColumns = [.. uncertain];
        int nu = _uncertainColumns.Length, rho = Redundancy;
        _mc = new double[nu * rho * rho];
        _nc = new double[nu * u * u];
        _qc = new double[nu * rho * u];
        _qhat2 = new double[nu];
        _y = new double[u * rho];
        _extra = new double[u * u];
        _kt = new double[u * rho];
        if (nu > 0)
        {
            var w = svdU.LeftNullSpace();
            var wr = new double[rho, rows];
            for (int i = 0; i < rho; i++)
            {
                for (int l = 0; l < w.GetLength(0); l++)
                {
                    for (int r2 = 0; r2 < rows; r2++)
                    {
                        wr[i, r2] += svdR.U[l, i] * w[l, r2];
                    }
                }
            }

            var p = svdU.PseudoInverse();
            for (int n2 = 0; n2 < nu; n2++)
            {
                var sg = columnRowSigmas![_uncertainColumns[n2]]!;
                for (int r2 = 0; r2 < rows; r2++)
                {
                    double d = sg[r2] * sg[r2];
                    for (int i = 0; i < rho; i++)
                    {
                        for (int j = 0; j < rho; j++)
                        {
                            _mc[(n2 * rho * rho) + (i * rho) + j] += wr[i, r2] * d * wr[j, r2];
                        }

                        for (int j = 0; j < u; j++)
                        {
                            _qc[(n2 * rho * u) + (i * u) + j] += wr[i, r2] * d * p[j, r2];
                        }
                    }

                    for (int i = 0; i < u; i++)
                    {
                        for (int j = 0; j < u; j++)
                        {
                            _nc[(n2 * u * u) + (i * u) + j] += p[i, r2] * d * p[j, r2];
                        }
                    }
                }
            }
        }
    }

    /// <summary>True when some column carries model uncertainty.</summary>
    public bool HasModelUncertainty => _uncertainColumns.Length > 0;

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
