namespace SoftSensor.Core.Tests.Stoichiometry;

/// <summary>
/// The per-cycle arithmetic of the balance kernel written the plain way, with fresh arrays and
/// nested loops (the code the kernel had before it was tuned for speed): eps = R_r q, Phi = R_r Psi R_r^T,
/// h = eps^T Phi^-1 eps, q* = q - Psi R_r^T Phi^-1 eps, Psi* = Psi - Psi R_r^T Phi^-1 R_r Psi,
/// q_u = K q*, Cov(q_u) = K Psi* K^T (Wang &amp; Stephanopoulos 1983; van der Heijden et al. 1994a;
/// docs/methods.md §2.4). Cholesky: Golub &amp; Van Loan, Matrix Computations, 4th ed., algorithm 4.2.1.
/// A test oracle for <c>BalanceKernelSpeedTests</c>, not used by the product.
/// </summary>
internal static class StraightforwardKernel
{
    public sealed record Result(double H, double[] Rates, double[] Sigmas, double[] Covariance, bool Ok);

    /// <summary>rr: rho x m reduced redundancy rows; k: u x m gain (q_u = K q_m); columns of the measured and unknown rates.</summary>
    public static Result Solve(double[] rr, int rho, double[] k, int[] measuredColumns, int[] unknownColumns, bool[] calculable,
        double[] q, double[] psi)
    {
        int m = measuredColumns.Length, u = unknownColumns.Length, n = m + u;
        var qs = (double[])q.Clone();
        var psiS = (double[])psi.Clone();
        double h = 0;
        if (rho > 0)
        {
            var eps = new double[rho];
            for (int i = 0; i < rho; i++)
            {
                for (int j = 0; j < m; j++)
                {
                    eps[i] += rr[(i * m) + j] * q[j];
                }
            }

            var t = new double[m * rho]; // Psi R_r^T
            for (int i = 0; i < m; i++)
            {
                for (int c = 0; c < rho; c++)
                {
                    for (int j = 0; j < m; j++)
                    {
                        t[(i * rho) + c] += psi[(i * m) + j] * rr[(c * m) + j];
                    }
                }
            }

            var l = new double[rho * rho]; // Phi, then its Cholesky factor (lower)
            for (int r1 = 0; r1 < rho; r1++)
            {
                for (int r2 = 0; r2 <= r1; r2++)
                {
                    for (int j = 0; j < m; j++)
                    {
                        l[(r1 * rho) + r2] += rr[(r1 * m) + j] * t[(j * rho) + r2];
                    }
                }
            }

            for (int j = 0; j < rho; j++)
            {
                double original = l[(j * rho) + j], d = original;
                for (int c = 0; c < j; c++)
                {
                    d -= l[(j * rho) + c] * l[(j * rho) + c];
                }

                if (!(d > 1e-13 * Math.Abs(original)) || !double.IsFinite(d))
                {
                    return new Result(double.NaN, [], [], [], false);
                }

                l[(j * rho) + j] = Math.Sqrt(d);
                for (int i = j + 1; i < rho; i++)
                {
                    double s = l[(i * rho) + j];
                    for (int c = 0; c < j; c++)
                    {
                        s -= l[(i * rho) + c] * l[(j * rho) + c];
                    }

                    l[(i * rho) + j] = s / l[(j * rho) + j];
                }
            }

            // z = Phi^-1 eps by forward and back substitution.
            var z = (double[])eps.Clone();
            for (int i = 0; i < rho; i++)
            {
                for (int c = 0; c < i; c++)
                {
                    z[i] -= l[(i * rho) + c] * z[c];
                }

                z[i] /= l[(i * rho) + i];
            }

            for (int i = rho - 1; i >= 0; i--)
            {
                for (int c = i + 1; c < rho; c++)
                {
                    z[i] -= l[(c * rho) + i] * z[c];
                }

                z[i] /= l[(i * rho) + i];
            }

            for (int i = 0; i < rho; i++)
            {
                h += eps[i] * z[i];
            }

            for (int i = 0; i < m; i++)
            {
                double s = 0;
                for (int c = 0; c < rho; c++)
                {
                    s += t[(i * rho) + c] * z[c];
                }

                qs[i] = q[i] - s;
            }

            // G = L^-1 T^T; Psi* = Psi - G^T G.
            var g = new double[rho * m];
            for (int c = 0; c < m; c++)
            {
                for (int i = 0; i < rho; i++)
                {
                    double s = t[(c * rho) + i];
                    for (int p = 0; p < i; p++)
                    {
                        s -= l[(i * rho) + p] * g[(p * m) + c];
                    }

                    g[(i * m) + c] = s / l[(i * rho) + i];
                }
            }

            for (int i = 0; i < m; i++)
            {
                for (int j = 0; j < m; j++)
                {
                    double s = 0;
                    for (int c = 0; c < rho; c++)
                    {
                        s += g[(c * m) + i] * g[(c * m) + j];
                    }

                    psiS[(i * m) + j] -= s;
                }
            }
        }

        // Full result vector x = [q*; K q*] with covariance [[Psi*, Psi* K^T], [K Psi*, K Psi* K^T]].
        var rates = new double[n];
        var full = new double[n * n];
        int[] position = new int[n];
        for (int i = 0; i < m; i++)
        {
            position[measuredColumns[i]] = i;
        }

        for (int j = 0; j < u; j++)
        {
            position[unknownColumns[j]] = m + j;
        }

        // B = [I; K] maps q* to all rates.
        var b = new double[n * m];
        for (int i = 0; i < m; i++)
        {
            b[(i * m) + i] = 1;
        }

        for (int j = 0; j < u; j++)
        {
            Array.Copy(k, j * m, b, (m + j) * m, m);
        }

        var bp = new double[n * m];
        for (int i = 0; i < n; i++)
        {
            for (int c = 0; c < m; c++)
            {
                for (int l = 0; l < m; l++)
                {
                    bp[(i * m) + c] += b[(i * m) + l] * psiS[(l * m) + c];
                }
            }
        }

        var sigmas = new double[n];
        for (int a = 0; a < n; a++)
        {
            int pa = position[a];
            bool known = pa < m || calculable[pa - m];
            double r = 0;
            for (int c = 0; c < m; c++)
            {
                r += b[(pa * m) + c] * qs[c];
            }

            rates[a] = known ? r : double.NaN;
            for (int bb = 0; bb < n; bb++)
            {
                int pb = position[bb];
                bool knownB = pb < m || calculable[pb - m];
                double s = 0;
                for (int c = 0; c < m; c++)
                {
                    s += bp[(pa * m) + c] * b[(pb * m) + c];
                }

                full[(a * n) + bb] = known && knownB ? s : double.NaN;
            }

            sigmas[a] = known ? Math.Sqrt(Math.Max(0, full[(a * n) + a])) : double.NaN;
        }

        return new Result(h, rates, sigmas, full, true);
    }
}
