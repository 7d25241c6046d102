using MathNet.Numerics.Distributions;

namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// The factored system for one set of columns and one split into measured and unknown rates
/// (Wang &amp; Stephanopoulos 1983; van der Heijden et al. 1994a, Biotechnol. Bioeng. 43):
/// A_m q_m + A_u q_u = 0 with A the balances and specifications. Precomputes the independent rows
/// R_r of the redundancy matrix R = A_m - A_u pinv(A_u) A_m and K = -pinv(A_u) A_m. Not thread-safe:
/// it owns its scratch vectors so that <see cref="Solve"/> allocates nothing.
/// </summary>
internal sealed class BalanceKernel
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

    /// <summary>
    /// Reconciles and solves. <paramref name="rates"/> (length <see cref="Columns"/>) receives the
    /// reconciled measured and the calculated unknown rates (NaN where not calculable). When
    /// <paramref name="sigmas"/> is not empty it receives standard deviations; when
    /// <paramref name="covariance"/> is not empty (Columns²) the full covariance of the results.
    /// </summary>
    public BalanceStatus Solve(ReadOnlySpan<double> q, ReadOnlySpan<double> psi, Span<double> rates, Span<double> sigmas, Span<double> covariance, out double h)
    {
        unchecked
        {
            int m = MeasuredColumns.Length, rho = Redundancy;
            h = 0;
            for (int i = 0; i < m; i++)
            {
                double v = psi[(i * m) + i];
                if (!double.IsFinite(q[i]) || !double.IsFinite(v) || v < 0)
                {
                    h = double.NaN;
                    return BalanceStatus.InvalidMeasurement;
                }
            }

            q.CopyTo(_qs);
            bool wantCov = !sigmas.IsEmpty || !covariance.IsEmpty;
            if (wantCov)
            {
                psi[..(m * m)].CopyTo(_psiS);
            }

            if (rho > 0)
            {
                if (!Reconcile(q, psi, wantCov, out h))
                {
                    h = double.NaN;
                    return BalanceStatus.CovarianceNotPositiveDefinite;
                }
            }

            Propagate(rates, sigmas, covariance, wantCov);
            return Nullity == 0 ? BalanceStatus.Solved : BalanceStatus.PartlyDetermined;
        }
    }

    private bool Reconcile(ReadOnlySpan<double> q, ReadOnlySpan<double> psi, bool wantCov, out double h)
    {
        unchecked
        {
            int m = MeasuredColumns.Length, rho = Redundancy;
            h = 0;

            // eps = R_r q_m; T = Psi R_r^T; Phi = R_r T (METHODS.md 2.4).
            for (int i = 0; i < rho; i++)
            {
                _eps[i] = Dot(_rr.AsSpan(i * m, m), q);
            }

            for (int i = 0; i < m; i++)
            {
                var psiRow = psi.Slice(i * m, m);
                for (int k = 0; k < rho; k++)
                {
                    _t[(i * rho) + k] = Dot(psiRow, _rr.AsSpan(k * m, m));
                }
            }

            for (int a = 0; a < rho; a++)
            {
                for (int b = 0; b <= a; b++)
                {
                    double s = 0;
                    for (int j = 0; j < m; j++)
                    {
                        s += _rr[(a * m) + j] * _t[(j * rho) + b];
                    }

                    _phi[(a * rho) + b] = s;
                }
            }

            if (!DenseCholesky.FactorInPlace(_phi, rho))
            {
                return false;
            }

            // z = Phi^-1 eps, h = eps^T z; reconciled q* = q - T z.
            _eps.CopyTo(_z, 0);
            DenseCholesky.SolveInPlace(_phi, rho, _z);
            h = Dot(_eps, _z);
            for (int i = 0; i < m; i++)
            {
                _qs[i] = q[i] - Dot(_t.AsSpan(i * rho, rho), _z);
            }

            if (wantCov)
            {
                // Psi* = Psi - T Phi^-1 T^T = Psi - G^T G with G = L^-1 T^T (rho x m).
                for (int j = 0; j < m; j++)
                {
                    for (int k = 0; k < rho; k++)
                    {
                        _g[(k * m) + j] = _t[(j * rho) + k];
                    }
                }

                DenseCholesky.ForwardColumns(_phi, rho, _g, m);
                for (int i = 0; i < m; i++)
                {
                    for (int j = 0; j < m; j++)
                    {
                        double s = 0;
                        for (int k = 0; k < rho; k++)
                        {
                            s += _g[(k * m) + i] * _g[(k * m) + j];
                        }

                        _psiS[(i * m) + j] -= s;
                    }
                }
            }

            return true;
        }
    }

    private void Propagate(Span<double> rates, Span<double> sigmas, Span<double> covariance, bool wantCov)
    {
        unchecked
        {
            int m = MeasuredColumns.Length, u = UnknownColumns.Length, n = Columns;
            for (int i = 0; i < m; i++)
            {
                rates[MeasuredColumns[i]] = _qs[i];
            }

            for (int j = 0; j < u; j++)
            {
                rates[UnknownColumns[j]] = Calculable[j] ? Dot(_k.AsSpan(j * m, m), _qs) : double.NaN;
            }

            if (!wantCov)
            {
                return;
            }

            // Cov(q_u) = K Psi* K^T, Cov(q_u, q_m) = K Psi*.
            for (int j = 0; j < u; j++)
            {
                var kRow = _k.AsSpan(j * m, m);
                for (int i = 0; i < m; i++)
                {
                    double s = 0;
                    for (int l = 0; l < m; l++)
                    {
                        s += kRow[l] * _psiS[(l * m) + i];
                    }

                    _kp[(j * m) + i] = s;
                }
            }

            for (int a = 0; a < n; a++)
            {
                double v = CovarianceEntry(a, a);
                if (!sigmas.IsEmpty)
                {
                    sigmas[a] = double.IsNaN(v) ? double.NaN : Math.Sqrt(Math.Max(0, v));
                }

                if (covariance.IsEmpty)
                {
                    continue;
                }

                for (int b = 0; b <= a; b++)
                {
                    double c = b == a ? v : CovarianceEntry(a, b);
                    covariance[(a * n) + b] = c;
                    covariance[(b * n) + a] = c;
                }
            }
        }
    }

    private double CovarianceEntry(int a, int b)
    {
        unchecked
        {
            int m = MeasuredColumns.Length;
            int ma = _measuredAt[a], mb = _measuredAt[b], ua = _unknownAt[a], ub = _unknownAt[b];
            if ((ua >= 0 && !Calculable[ua]) || (ub >= 0 && !Calculable[ub]))
            {
                return double.NaN;
            }

            if (ma >= 0 && mb >= 0)
            {
                return _psiS[(ma * m) + mb];
            }

            if (ua >= 0 && mb >= 0)
            {
                return _kp[(ua * m) + mb];
            }

            if (ma >= 0 && ub >= 0)
            {
                return _kp[(ub * m) + ma];
            }

            return Dot(_kp.AsSpan(ua * m, m), _k.AsSpan(ub * m, m));
        }
    }

    private static double Dot(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        unchecked
        {
            double s = 0;
            for (int i = 0; i < x.Length; i++)
            {
                s += x[i] * y[i];
            }

            return s;
        }
    }

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
