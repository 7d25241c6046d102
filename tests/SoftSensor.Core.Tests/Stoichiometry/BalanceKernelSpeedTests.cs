using CsCheck;
using MathNet.Numerics.LinearAlgebra;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Tests.Stoichiometry;

/// <summary>
/// The tuned per-cycle kernel (references instead of spans, no bounds checks, the base solve of the
/// diagnosis reused from the cycle's own solve) gives the numbers of the plain computation: the
/// oracle <see cref="StraightforwardKernel"/> to 1e-12 relative, and the textbook formula with
/// MathNet's pseudo-inverse (h = eps^T pinv(R Psi R^T) eps over the full, unreduced R =
/// A_m - A_u pinv(A_u) A_m; Wang &amp; Stephanopoulos 1983; van der Heijden et al. 1994a) to 1e-8.
/// Inputs are CsCheck's random measured sets of the glycerol model, rates and full covariances.
/// </summary>
public class BalanceKernelSpeedTests
{
    private static readonly string[] Ids = ["glycerol", "o2", "co2", "nh3", "h2o", "biomass"];

    // Measured subset (bit mask), rates, and a factor B of Psi = B B^T + diag(d).
    private static readonly Gen<(int Mask, double[] Q, double[] B, double[] D)> Case =
        Gen.Select(Gen.Int[1, 63], Gen.Double[-50, 50].Array[6], Gen.Double[-1, 1].Array[36], Gen.Double[0.01, 2].Array[6]);

    [Fact]
    public void Solve_equals_the_straightforward_computation_to_1e12_relative()
    {
        var a = TestModels.Glycerol.ElementMatrix(Ids.Select(id => TestModels.Glycerol[id]).ToArray());
        Case.Sample(c =>
        {
            int[] measured = Enumerable.Range(0, 6).Where(i => (c.Mask & (1 << i)) != 0).ToArray();
            var kernel = new BalanceKernel(a, measured, 1e-9, 0.05);
            var (q, psi) = Inputs(c, measured.Length);
            var rates = new double[6];
            var sigmas = new double[6];
            var cov = new double[36];
            var status = kernel.Solve(q, psi, rates, sigmas, cov, out double h);
            var oracle = StraightforwardKernel.Solve(kernel.ReducedRedundancy.ToArray(), kernel.Redundancy, kernel.Gain.ToArray(),
                kernel.MeasuredColumns, kernel.UnknownColumns, kernel.Calculable, q, psi);

            Assert.Equal(oracle.Ok, status != BalanceStatus.CovarianceNotPositiveDefinite);
            if (!oracle.Ok)
            {
                return;
            }

            double scale = q.Max(Math.Abs);
            Close(oracle.H, h, Math.Max(1, Math.Abs(oracle.H)), "h");
            for (int j = 0; j < 6; j++)
            {
                Close(oracle.Rates[j], rates[j], scale, $"rate {Ids[j]}");
                Close(oracle.Sigmas[j], sigmas[j], Math.Max(1e-300, oracle.Sigmas.Where(double.IsFinite).DefaultIfEmpty(1).Max()), $"sigma {Ids[j]}");
                for (int k = 0; k < 6; k++)
                {
                    Close(oracle.Covariance[(j * 6) + k], cov[(j * 6) + k], Math.Max(1e-300, psi.Max(Math.Abs)), $"cov {Ids[j]},{Ids[k]}");
                }
            }
        }, iter: 500);
    }

    [Fact]
    public void Solve_h_equals_the_pseudo_inverse_formula_to_1e8_relative()
    {
        var a = TestModels.Glycerol.ElementMatrix(Ids.Select(id => TestModels.Glycerol[id]).ToArray());
        var am = Matrix<double>.Build.DenseOfArray(a);
        Case.Sample(c =>
        {
            int[] measured = Enumerable.Range(0, 6).Where(i => (c.Mask & (1 << i)) != 0).ToArray();
            int[] unknown = Enumerable.Range(0, 6).Except(measured).ToArray();
            var kernel = new BalanceKernel(a, measured, 1e-9, 0.05);
            if (kernel.Redundancy == 0 || unknown.Length == 0)
            {
                return;
            }

            var (q, psi) = Inputs(c, measured.Length);
            kernel.Solve(q, psi, new double[6], [], [], out double h);

            var em = Matrix<double>.Build.DenseOfColumnVectors(measured.Select(am.Column));
            var eu = Matrix<double>.Build.DenseOfColumnVectors(unknown.Select(am.Column));
            var r = em - (eu * eu.PseudoInverse() * em);
            var p = Matrix<double>.Build.Dense(measured.Length, measured.Length, (i, j) => psi[(i * measured.Length) + j]);
            var eps = r * Vector<double>.Build.Dense(q);
            double reference = eps * (r * p * r.Transpose()).PseudoInverse() * eps;
            Assert.True(Math.Abs(h - reference) <= 1e-8 * Math.Max(1, Math.Abs(reference)), $"h {h} vs pinv formula {reference} (mask {c.Mask})");
        }, iter: 300);
    }

    [Fact]
    public void Diagnosis_after_the_cycle_solve_equals_the_full_diagnosis()
    {
        var solver = BalanceSolver.Create(TestModels.Glycerol, ["o2", "co2", "nh3", "glycerol"]);
        Case.Sample(c =>
        {
            var (q, psi) = Inputs(c, 4);
            var full = new HypothesisOutcome[solver.Hypotheses.Count];
            var after = new HypothesisOutcome[solver.Hypotheses.Count];
            var baseOutcome = solver.Solve(q, psi, new double[solver.CompoundIds.Count], new double[solver.CompoundIds.Count]);
            var s1 = solver.Diagnose(q, psi, full);
            var s2 = solver.DiagnoseAfterSolve(q, psi, after, baseOutcome);
            Assert.Equal(s1, s2);
            Assert.Equal(full, after);
        }, iter: 200, threads: 1); // one solver, whose scratch buffers are not thread-safe: CsCheck samples on every core by default
    }

    private static (double[] Q, double[] Psi) Inputs((int Mask, double[] Q, double[] B, double[] D) c, int m)
    {
        var q = c.Q.Take(m).ToArray();
        var psi = new double[m * m];
        for (int i = 0; i < m; i++)
        {
            for (int j = 0; j < m; j++)
            {
                double s = i == j ? c.D[i] : 0;
                for (int k = 0; k < m; k++)
                {
                    s += c.B[(i * 6) + k] * c.B[(j * 6) + k];
                }

                psi[(i * m) + j] = s;
            }
        }

        return (q, psi);
    }

    private static void Close(double expected, double actual, double scale, string what)
    {
        if (double.IsNaN(expected))
        {
            Assert.True(double.IsNaN(actual), $"{what}: {actual}, expected NaN");
            return;
        }

        Assert.True(Math.Abs(expected - actual) <= 1e-12 * Math.Max(Math.Abs(expected), scale), $"{what}: {actual:R} vs {expected:R}");
    }
}
