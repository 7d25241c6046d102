using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// The model-uncertainty terms of <see cref="BalanceKernel"/> (docs/model-uncertainty.md): the
/// uncertain columns' equation error, growing with the rate, and its gain and covariance terms.
/// </summary>
internal sealed partial class BalanceKernel
{
    /// <summary>qhat_c² per uncertain column: the measured rate, or K q_m for an unknown (before reconciliation; first order).</summary>
    private void UncertainRates(ref double q)
    {
        unchecked
        {
            int m = MeasuredColumns.Length;
            for (int c = 0; c < _uncertainColumns.Length; c++)
            {
                int col = _uncertainColumns[c];
                int mi = _measuredAt[col];
                double r = mi >= 0
                    ? Unsafe.Add(ref q, mi)
                    : Dot(ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(_k), _unknownAt[col] * m), ref q, m);
                _qhat2[c] = double.IsFinite(r) ? r * r : 0;
            }
        }
    }

    /// <summary>Y = Phi^-1 sum_c qhat_c² Q_c (rho x u, stored per unknown column: y[j rho + k]).</summary>
    private void ModelErrorGain(int rho)
    {
        unchecked
        {
            int u = UnknownColumns.Length;
            Array.Clear(_y);
            for (int c = 0; c < _qhat2.Length; c++)
            {
                double w2 = _qhat2[c];
                int off = c * rho * u;
                for (int k = 0; k < rho; k++)
                {
                    for (int j = 0; j < u; j++)
                    {
                        _y[(j * rho) + k] += w2 * _qc[off + (k * u) + j];
                    }
                }
            }

            for (int j = 0; j < u; j++)
            {
                DenseCholesky.SolveInPlace(_phi, rho, _y.AsSpan(j * rho, rho));
            }
        }
    }

    /// <summary>
    /// The model-error terms of the covariance (docs/model-uncertainty.md, eq. 6-7):
    /// Cov(q_u, q_m) += (T Y)^T, Cov(q_u) += sum_c qhat_c² N_c + K T Y + (K T Y)^T (the last through <see cref="CovarianceEntry"/>).
    /// </summary>
    private void ModelErrorCovariance(int m, int u)
    {
        unchecked
        {
            int rho = Redundancy;
            Array.Clear(_extra);
            for (int c = 0; c < _qhat2.Length; c++)
            {
                double w2 = _qhat2[c];
                int off = c * u * u;
                for (int i = 0; i < u * u; i++)
                {
                    _extra[i] += w2 * _nc[off + i];
                }
            }

            if (rho == 0)
            {
                return;
            }

            // kp[j, i] += sum_k t[i, k] y[j, k]; kt = K T (u x rho); extra += K T Y.
            for (int j = 0; j < u; j++)
            {
                for (int i = 0; i < m; i++)
                {
                    double s = 0;
                    for (int k = 0; k < rho; k++)
                    {
                        s += _t[(i * rho) + k] * _y[(j * rho) + k];
                    }

                    _kp[(j * m) + i] += s;
                }

                for (int k = 0; k < rho; k++)
                {
                    double s = 0;
                    for (int i = 0; i < m; i++)
                    {
                        s += _k[(j * m) + i] * _t[(i * rho) + k];
                    }

                    _kt[(j * rho) + k] = s;
                }
            }

            for (int a = 0; a < u; a++)
            {
                for (int b = 0; b < u; b++)
                {
                    double s = 0;
                    for (int k = 0; k < rho; k++)
                    {
                        s += _kt[(a * rho) + k] * _y[(b * rho) + k];
                    }

                    _extra[(a * u) + b] += s;
                }
            }
        }
    }
}
