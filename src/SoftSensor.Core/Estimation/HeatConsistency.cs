using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// The consistency test with the heat balance as one more redundant measurement (docs/pathway.md §4).
/// With Thornton's rule the metabolic heat is Q = ΔH_ox · OUR (about 115 kJ per mol of electrons
/// passed to O2, i.e. 460 kJ per mol O2; Thornton 1917, Phil. Mag. 33; von Stockar &amp; Marison
/// 1989, Adv. Biochem. Eng. Biotechnol. 40), so the heat-based O2 rate is a second measurement of
/// r_O2 and adds one redundant relation to the elemental ones R_r (Wang &amp; Stephanopoulos 1983,
/// Biotechnol. Bioeng. 25; van der Heijden et al. 1994, Biotechnol. Bioeng. 43):
///   z = [q_m, r_O2,heat],  R_aug = [[R_r, 0], [e_O2, -1]],  h = ε^T (R_aug Ψ R_aug^T)^-1 ε,  ε = R_aug z.
/// Diagnosis: each measurement in turn moved to the unknowns leaves the relations free of it; a
/// hypothesis whose h passes while the full test fails names the suspect; isolated when exactly one
/// passes (with redundancy 1 every leave-one-out has no relation left: detection only). The relation
/// matrices are built once; <see cref="Test"/> allocates nothing.
/// </summary>
public sealed class HeatConsistency
{
    private readonly double[][,] _relations; // [0]: full R_aug; [1 + j]: without measurement j
    private readonly double[] _critical;
    private readonly double[] _eps;
    private readonly double[] _phi;
    private readonly double[] _work;
    private readonly string[] _ids;

    /// <summary>Builds the relations for <paramref name="measured"/> (compound ids, the order of the measured rates) plus the heat.</summary>
    public HeatConsistency(StoichiometricModel model, IReadOnlyList<string> measured, double alpha)
    {
        ArgumentNullException.ThrowIfNull(model);
        var oxygen = model.Compounds.FirstOrDefault(c => c.Role == CompoundRole.Oxygen) ?? throw new ArgumentException($"model '{model.Name}' has no oxygen compound", nameof(model));
        int o2 = measured.ToList().IndexOf(oxygen.Id);
        if (o2 < 0)
        {
            throw new ArgumentException("the heat row needs O2 among the measured rates", nameof(measured));
        }

        var columns = model.Compounds.Where(c => c.Role != CompoundRole.Candidate && model.Balances.Any(b => b.CoefficientOf(c) != 0)).ToList();
        var unknown = columns.Where(c => !measured.Contains(c.Id)).ToList();
        var em = Matrix<double>.Build.Dense(model.Balances.Count, measured.Count, (i, j) => model.Balances[i].CoefficientOf(model[measured[j]]));
        var eu = Matrix<double>.Build.Dense(model.Balances.Count, Math.Max(unknown.Count, 1), (i, j) => unknown.Count == 0 ? 0 : model.Balances[i].CoefficientOf(unknown[j]));
        var r = em - (eu * eu.PseudoInverse() * em);
        var svd = r.Svd(true);
        double tol = 1e-9 * Math.Max(1, svd.S.Count > 0 ? svd.S[0] : 0);
        int rho = svd.S.Count(s => s > tol);
        int m = measured.Count + 1;
        var full = new double[rho + 1, m];
        for (int i = 0; i < rho; i++)
        {
            var row = svd.U.Column(i) * r;
            for (int j = 0; j < measured.Count; j++)
            {
                full[i, j] = row[j];
            }
        }

        full[rho, o2] = 1;
        full[rho, m - 1] = -1;
        ElementalRedundancy = rho;
        Redundancy = rho + 1;
        _relations = new double[m + 1][,];
        _relations[0] = full;
        for (int j = 0; j < m; j++)
        {
            _relations[1 + j] = Without(full, j);
        }

        _critical = new double[Redundancy + 1];
        for (int d = 1; d <= Redundancy; d++)
        {
            _critical[d] = ChiSquared.InvCDF(d, 1 - alpha);
        }

        _eps = new double[Redundancy];
        _phi = new double[Redundancy * Redundancy];
        _work = new double[Redundancy * Redundancy];
        _ids = [.. measured, "heat"];
    }

    /// <summary>Redundancy of the elemental balances alone, and with the heat row.</summary>
    public int ElementalRedundancy { get; }

    /// <inheritdoc cref="ElementalRedundancy"/>
    public int Redundancy { get; }

    /// <summary>χ² critical value of the full test.</summary>
    public double Critical => _critical[Redundancy];

    /// <summary>
    /// Tests <paramref name="measured"/> (rates as the elemental stage has them, production &gt; 0) with
    /// <paramref name="covariance"/> (row-major) plus the heat-based O2 rate <paramref name="heatO2Rate"/>
    /// (negative: consumed) with variance <paramref name="heatVariance"/>. The isolated suspect is a
    /// measured id or "heat", or null when none (or several) is isolated.
    /// </summary>
    public HeatTestOutcome Test(ReadOnlySpan<double> measured, ReadOnlySpan<double> covariance, double heatO2Rate, double heatVariance)
    {
        double h = Statistic(_relations[0], measured, covariance, heatO2Rate, heatVariance, out int dof);
        if (!double.IsFinite(h))
        {
            return new HeatTestOutcome(double.NaN, double.NaN, Redundancy, null, false);
        }

        bool fails = h > _critical[dof];
        string? suspect = null;
        int passing = 0;
        if (fails)
        {
            for (int j = 0; j < _ids.Length; j++)
            {
                double hj = Statistic(_relations[1 + j], measured, covariance, heatO2Rate, heatVariance, out int dj);
                if (dj > 0 && hj <= _critical[dj])
                {
                    passing++;
                    suspect = _ids[j];
                }
            }
        }

        return new HeatTestOutcome(h, _critical[dof], dof, passing == 1 ? suspect : null, fails);
    }

    private double Statistic(double[,] rel, ReadOnlySpan<double> q, ReadOnlySpan<double> psi, double heat, double heatVar, out int dof)
    {
        int k = rel.GetLength(0), m = rel.GetLength(1), mq = m - 1;
        dof = k;
        if (k == 0)
        {
            return 0;
        }

        for (int a = 0; a < k; a++)
        {
            double s = rel[a, mq] * heat;
            for (int j = 0; j < mq; j++)
            {
                s += rel[a, j] * q[j];
            }

            _eps[a] = s;
            for (int b = 0; b < k; b++)
            {
                double c = rel[a, mq] * rel[b, mq] * heatVar;
                for (int i = 0; i < mq; i++)
                {
                    for (int j = 0; j < mq; j++)
                    {
                        c += rel[a, i] * psi[(i * mq) + j] * rel[b, j];
                    }
                }

                _phi[(a * k) + b] = c;
            }
        }

        // h = ε^T Φ^-1 ε by Gaussian elimination on a copy (k ≤ 3).
        Array.Copy(_phi, _work, k * k);
        Span<double> x = stackalloc double[k];
        for (int a = 0; a < k; a++)
        {
            x[a] = _eps[a];
        }

        for (int p = 0; p < k; p++)
        {
            double piv = _work[(p * k) + p];
            if (!(Math.Abs(piv) > 1e-300))
            {
                return double.NaN;
            }

            for (int a = p + 1; a < k; a++)
            {
                double f = _work[(a * k) + p] / piv;
                for (int b = p; b < k; b++)
                {
                    _work[(a * k) + b] -= f * _work[(p * k) + b];
                }

                x[a] -= f * x[p];
            }
        }

        for (int p = k - 1; p >= 0; p--)
        {
            double s = x[p];
            for (int b = p + 1; b < k; b++)
            {
                s -= _work[(p * k) + b] * x[b];
            }

            x[p] = s / _work[(p * k) + p];
        }

        double h = 0;
        for (int a = 0; a < k; a++)
        {
            h += _eps[a] * x[a];
        }

        return h;
    }

    // Relations free of measurement j: the rows of W^T R with W spanning the vectors orthogonal to column j.
    private static double[,] Without(double[,] full, int j)
    {
        int k = full.GetLength(0), m = full.GetLength(1);
        var c = Vector<double>.Build.Dense(k, i => full[i, j]);
        if (c.L2Norm() < 1e-12)
        {
            return (double[,])full.Clone();
        }

        var basis = Matrix<double>.Build.DenseOfColumnVectors(c).Transpose().Kernel();
        var r = Matrix<double>.Build.DenseOfArray(full);
        var w = new double[basis.Length, m];
        for (int a = 0; a < basis.Length; a++)
        {
            var row = basis[a] * r;
            for (int b = 0; b < m; b++)
            {
                w[a, b] = b == j ? 0 : row[b];
            }
        }

        return w;
    }
}

/// <summary>Outcome of the heat-augmented consistency test.</summary>
/// <param name="H">Test statistic.</param>
/// <param name="Critical">Its χ² critical value.</param>
/// <param name="DegreesOfFreedom">Redundancy of the augmented set.</param>
/// <param name="Isolated">The one measurement whose removal makes the test pass (a compound id or "heat"), or null.</param>
/// <param name="Inconsistent">True when the test fails.</param>
public readonly record struct HeatTestOutcome(double H, double Critical, int DegreesOfFreedom, string? Isolated, bool Inconsistent);
