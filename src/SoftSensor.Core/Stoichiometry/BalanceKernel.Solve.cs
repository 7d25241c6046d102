using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// The per-cycle arithmetic of <see cref="BalanceKernel"/> (docs/methods.md §2.4):
///   eps = R_r q,  T = Psi R_r^T,  Phi = R_r T = L L^T,  z = Phi^-1 eps,  h = eps^T z,
///   q* = q - T z,  Psi* = Psi - G^T G with G = L^-1 T^T,  q_u = K q*,  Cov(q_u) = K Psi* K^T.
/// The sizes are fixed when the kernel is built and checked once per call, so the loops run on
/// references into the preallocated arrays without bounds checks or span slices; every sum is
/// accumulated from 0 in ascending index order, so the results are those of the plain nested
/// loops (the test oracle StraightforwardKernel) bit for bit.
/// </summary>
internal sealed partial class BalanceKernel
{
    /// <summary>The independent rows R_r of the redundancy matrix, rho x m row-major.</summary>
    internal ReadOnlySpan<double> ReducedRedundancy => _rr;

    /// <summary>K = -pinv(A_u) A_m, u x m row-major: q_u = K q_m.</summary>
    internal ReadOnlySpan<double> Gain => _k;

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
            int m = MeasuredColumns.Length, n = Columns;
            if (q.Length != m || psi.Length < m * m || rates.Length < n || (!sigmas.IsEmpty && sigmas.Length < n) || (!covariance.IsEmpty && covariance.Length < n * n))
            {
                throw new ArgumentException($"kernel of {m} measured rates and {n} columns: got {q.Length} rates, {psi.Length} covariance entries and result spans of {rates.Length}, {sigmas.Length}, {covariance.Length}");
            }

            ref double q0 = ref MemoryMarshal.GetReference(q);
            ref double p0 = ref MemoryMarshal.GetReference(psi);
            if (!ValidMeasurements(ref q0, ref p0, m))
            {
                h = double.NaN;
                return BalanceStatus.InvalidMeasurement;
            }

            h = 0;

            q.CopyTo(_qs);
            UncertainRates(ref q0);
            bool wantCov = !sigmas.IsEmpty || !covariance.IsEmpty;
            if (wantCov)
            {
                psi[..(m * m)].CopyTo(_psiS);
            }

            if (Redundancy > 0 && !Reconcile(ref q0, ref p0, wantCov, out h))
            {
                h = double.NaN;
                return BalanceStatus.CovarianceNotPositiveDefinite;
            }

            Propagate(ref MemoryMarshal.GetReference(rates), sigmas, covariance, wantCov);
            return Nullity == 0 ? BalanceStatus.Solved : BalanceStatus.PartlyDetermined;
        }
    }

    /// <summary>
    /// A diagnosis hypothesis' share of <see cref="Solve"/>: the test statistic and the one rate the
    /// hypothesis reports (the suspect measurement or the missing product), by the same arithmetic;
    /// false where <see cref="Solve"/> would not have solved.
    /// </summary>
    public bool TestHypothesis(ReadOnlySpan<double> q, ReadOnlySpan<double> psi, int column, out double h, out double rate)
    {
        unchecked
        {
            int m = MeasuredColumns.Length;
            rate = double.NaN;
            if (q.Length != m || psi.Length < m * m || (uint)column >= (uint)Columns)
            {
                throw new ArgumentException($"kernel of {m} measured rates and {Columns} columns: got {q.Length} rates, {psi.Length} covariance entries, column {column}");
            }

            ref double q0 = ref MemoryMarshal.GetReference(q);
            ref double p0 = ref MemoryMarshal.GetReference(psi);
            if (!ValidMeasurements(ref q0, ref p0, m))
            {
                h = double.NaN;
                return false;
            }

            h = 0;

            q.CopyTo(_qs);
            UncertainRates(ref q0);
            if (Redundancy > 0 && !Reconcile(ref q0, ref p0, false, out h))
            {
                h = double.NaN;
                return false;
            }

            int mi = _measuredAt[column], ui = _unknownAt[column];
            if (mi >= 0)
            {
                rate = _qs[mi];
            }
            else if (Calculable[ui])
            {
                rate = Dot(ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(_k), ui * m), ref MemoryMarshal.GetArrayDataReference(_qs), m);
            }

            return true;
        }
    }

    private bool Reconcile(ref double q, ref double psi, bool wantCov, out double h)
    {
        unchecked
        {
            int m = MeasuredColumns.Length, rho = Redundancy;
            ref double rr = ref MemoryMarshal.GetArrayDataReference(_rr);
            ref double t = ref MemoryMarshal.GetArrayDataReference(_t);
            ref double phi = ref MemoryMarshal.GetArrayDataReference(_phi);
            ref double eps = ref MemoryMarshal.GetArrayDataReference(_eps);
            ref double z = ref MemoryMarshal.GetArrayDataReference(_z);
            ref double qs = ref MemoryMarshal.GetArrayDataReference(_qs);

            // eps = R_r q_m; T = Psi R_r^T; Phi = R_r T (lower triangle).
            for (int i = 0; i < rho; i++)
            {
                double e = Dot(ref Unsafe.Add(ref rr, i * m), ref q, m);
                Unsafe.Add(ref eps, i) = e;
                Unsafe.Add(ref z, i) = e;
            }

            for (int i = 0; i < m; i++)
            {
                ref double psiRow = ref Unsafe.Add(ref psi, i * m);
                for (int k = 0; k < rho; k++)
                {
                    Unsafe.Add(ref t, (i * rho) + k) = Dot(ref psiRow, ref Unsafe.Add(ref rr, k * m), m);
                }
            }

            for (int a = 0; a < rho; a++)
            {
                ref double rrRow = ref Unsafe.Add(ref rr, a * m);
                for (int b = 0; b <= a; b++)
                {
                    double s = 0;
                    for (int j = 0; j < m; j++)
                    {
                        s += Unsafe.Add(ref rrRow, j) * Unsafe.Add(ref t, (j * rho) + b);
                    }

                    Unsafe.Add(ref phi, (a * rho) + b) = s;
                }
            }

            // Model uncertainty: Phi += sum_c qhat_c² M_c (docs/model-uncertainty.md, eq. 3).
            for (int c = 0; c < _qhat2.Length; c++)
            {
                double w2 = _qhat2[c];
                ref double mc = ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(_mc), c * rho * rho);
                for (int a = 0; a < rho; a++)
                {
                    for (int b = 0; b <= a; b++)
                    {
                        Unsafe.Add(ref phi, (a * rho) + b) += w2 * Unsafe.Add(ref mc, (a * rho) + b);
                    }
                }
            }

            if (!DenseCholesky.FactorInPlace(_phi, rho))
            {
                h = double.NaN;
                return false;
            }

            // z = Phi^-1 eps, h = eps^T z; reconciled q* = q - T z.
            DenseCholesky.SolveInPlace(_phi, rho, _z);
            h = Dot(ref eps, ref z, rho);
            for (int i = 0; i < m; i++)
            {
                Unsafe.Add(ref qs, i) = Unsafe.Add(ref q, i) - Dot(ref Unsafe.Add(ref t, i * rho), ref z, rho);
            }

            if (wantCov)
            {
                ReconciledCovariance(m, rho);
                if (_qhat2.Length > 0)
                {
                    ModelErrorGain(rho);
                }
            }

            return true;
        }
    }

    /// <summary>Psi* = Psi - T Phi^-1 T^T = Psi - G^T G with G = L^-1 T^T (rho x m).</summary>
    private void ReconciledCovariance(int m, int rho)
    {
        unchecked
        {
            ref double t = ref MemoryMarshal.GetArrayDataReference(_t);
            ref double g = ref MemoryMarshal.GetArrayDataReference(_g);
            ref double psiS = ref MemoryMarshal.GetArrayDataReference(_psiS);
            for (int j = 0; j < m; j++)
            {
                for (int k = 0; k < rho; k++)
                {
                    Unsafe.Add(ref g, (k * m) + j) = Unsafe.Add(ref t, (j * rho) + k);
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
                        s += Unsafe.Add(ref g, (k * m) + i) * Unsafe.Add(ref g, (k * m) + j);
                    }

                    Unsafe.Add(ref psiS, (i * m) + j) -= s;
                }
            }
        }
    }

    private void Propagate(ref double rates, Span<double> sigmas, Span<double> covariance, bool wantCov)
    {
        unchecked
        {
            int m = MeasuredColumns.Length, u = UnknownColumns.Length, n = Columns;
            ref double qs = ref MemoryMarshal.GetArrayDataReference(_qs);
            ref double k = ref MemoryMarshal.GetArrayDataReference(_k);
            int[] measuredColumns = MeasuredColumns, unknownColumns = UnknownColumns;
            bool[] calculable = Calculable;
            for (int i = 0; i < m; i++)
            {
                Unsafe.Add(ref rates, measuredColumns[i]) = Unsafe.Add(ref qs, i);
            }

            for (int j = 0; j < u; j++)
            {
                Unsafe.Add(ref rates, unknownColumns[j]) = calculable[j] ? Dot(ref Unsafe.Add(ref k, j * m), ref qs, m) : double.NaN;
            }

            if (!wantCov)
            {
                return;
            }

            // Cov(q_u) = K Psi* K^T, Cov(q_u, q_m) = K Psi*.
            ref double psiS = ref MemoryMarshal.GetArrayDataReference(_psiS);
            ref double kp = ref MemoryMarshal.GetArrayDataReference(_kp);
            for (int j = 0; j < u; j++)
            {
                ref double kRow = ref Unsafe.Add(ref k, j * m);
                for (int i = 0; i < m; i++)
                {
                    double s = 0;
                    for (int l = 0; l < m; l++)
                    {
                        s += Unsafe.Add(ref kRow, l) * Unsafe.Add(ref psiS, (l * m) + i);
                    }

                    Unsafe.Add(ref kp, (j * m) + i) = s;
                }
            }

            if (_qhat2.Length > 0)
            {
                ModelErrorCovariance(m, u);
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

            double kk = Dot(ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(_kp), ua * m), ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(_k), ub * m), m);
            return _qhat2.Length > 0 ? kk + _extra[(ua * UnknownColumns.Length) + ub] : kk;
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double Dot(ref double x, ref double y, int n)
    {
        unchecked
        {
            double s = 0;
            for (int i = 0; i < n; i++)
            {
                s += Unsafe.Add(ref x, i) * Unsafe.Add(ref y, i);
            }

            return s;
        }
    }

    /// <summary>True when every measured rate is finite and every variance on the diagonal of Ψ (m × m) is finite and not negative.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static bool ValidMeasurements(ref double q0, ref double p0, int m)
    {
        for (int i = 0; i < m; i++)
        {
            double v = Unsafe.Add(ref p0, (i * m) + i);
            double qi = Unsafe.Add(ref q0, i);
            if (!double.IsFinite(qi) || !double.IsFinite(v) || v < 0)
            {
                return false;
            }
        }

        return true;
    }
}
