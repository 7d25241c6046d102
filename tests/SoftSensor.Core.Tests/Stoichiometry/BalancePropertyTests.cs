using CsCheck;
using MathNet.Numerics.LinearAlgebra;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Tests.Stoichiometry;

/// <summary>
/// Invariants of the reconciliation (Wang &amp; Stephanopoulos 1983; van der Heijden et al. 1994a), checked
/// with CsCheck's generators on the demo glycerol model (C, H, O, N over six compounds). The
/// generated rates are arbitrary numbers, not data; CsCheck prints the seed of any failure.
/// </summary>
public class BalancePropertyTests
{
    private static readonly StoichiometricModel Model = TestModels.Glycerol;
    private static readonly string[] Ids = ["glycerol", "o2", "co2", "nh3", "h2o", "biomass"];

    // A measured subset (bit mask over Ids), measured values and relative sigmas.
    private static readonly Gen<(int Mask, double[] Values, double[] Relative)> Case =
        Gen.Select(Gen.Int[1, 63], Gen.Double[-10, 10].Array[6], Gen.Double[0.005, 0.2].Array[6]);

    private static string[] Measured(int mask) => Ids.Where((_, i) => (mask & (1 << i)) != 0).ToArray();

    private static double[] Take(int mask, double[] all) => all.Where((_, i) => (mask & (1 << i)) != 0).ToArray();

    [Fact]
    public void Solve_reconciled_rates_close_every_balance_to_1e9_relative()
    {
        Case.Sample(c =>
        {
            var solver = BalanceSolver.Create(Model, Measured(c.Mask));
            if (!solver.Analysis.IsDetermined)
            {
                return;
            }

            double[] q = Take(c.Mask, c.Values).Select(v => Math.Abs(v) < 0.01 ? 0.01 : v).ToArray();
            var psi = TestModels.Diagonal(q.Zip(Take(c.Mask, c.Relative), (v, r) => Math.Abs(v) * r).ToArray());
            var rates = new double[solver.CompoundIds.Count];
            var outcome = solver.Solve(q, psi, rates, []);
            Assert.Equal(BalanceStatus.Solved, outcome.Status);

            // Relative to the size of the terms: |sum_j e_ij q_j| <= 1e-9 * sum_j |e_ij| * max |q|, the
            // largest rate measured or reconciled (a row whose terms nearly cancel cannot be held to its
            // own tiny sum, and a reconciliation that moves a rate by orders of magnitude keeps the
            // rounding of the value it started from).
            var e = Model.ElementMatrix(solver.Compounds);
            double qMax = Math.Max(rates.Max(Math.Abs), q.Max(Math.Abs));
            for (int i = 0; i < e.GetLength(0); i++)
            {
                double sum = 0, scale = 0;
                for (int j = 0; j < rates.Length; j++)
                {
                    sum += e[i, j] * rates[j];
                    scale += Math.Abs(e[i, j]) * qMax;
                }

                Assert.True(Math.Abs(sum) <= 1e-9 * scale, $"balance {Model.Balances[i]}: residual {sum:G3} of scale {scale:G3}");
            }
        }, iter: 300);
    }

    [Fact]
    public void Solve_h_is_invariant_to_scaling_a_balance_row()
    {
        var gen = Gen.Select(Case, Gen.Int[0, 3], Gen.Double[-3, 3]);
        gen.Sample(t =>
        {
            var (c, row, log10Scale) = t;
            var compounds = Ids.Select(id => Model[id]).ToArray();
            var a = Model.ElementMatrix(compounds);
            var scaled = (double[,])a.Clone();
            double s = Math.Pow(10, log10Scale);
            for (int j = 0; j < scaled.GetLength(1); j++)
            {
                scaled[row, j] *= s;
            }

            int[] measured = Enumerable.Range(0, 6).Where(i => (c.Mask & (1 << i)) != 0).ToArray();
            var k1 = new BalanceKernel(a, measured, 1e-9, 0.05);
            var k2 = new BalanceKernel(scaled, measured, 1e-9, 0.05);
            Assert.Equal(k1.Redundancy, k2.Redundancy);
            if (k1.Redundancy == 0)
            {
                return;
            }

            double[] q = Take(c.Mask, c.Values).Select(v => Math.Abs(v) < 0.01 ? 0.01 : v).ToArray();
            var psi = TestModels.Diagonal(q.Zip(Take(c.Mask, c.Relative), (v, r) => Math.Abs(v) * r).ToArray());
            k1.Solve(q, psi, new double[6], [], [], out double h1);
            k2.Solve(q, psi, new double[6], [], [], out double h2);
            // Relative 1e-8: the generated sigmas span a factor of 40 and the values three decades, so
            // Phi's condition number reaches about 1e8 and the two factorisations round differently.
            Assert.True(Math.Abs(h1 - h2) <= 1e-8 * Math.Max(1, Math.Abs(h1)), $"h {h1} vs {h2} (row {row} x {s:G3})");
        }, iter: 300);
    }

    [Fact]
    public void Solve_without_redundancy_equals_the_direct_solve()
    {
        // Two measured rates leave E_u square (4 x 4): where it is regular the answer must equal
        // q_u = -E_u^-1 E_m q_m computed by MathNet's LU solver, and nothing is reconciled.
        var gen = Gen.Select(Gen.Int[0, 5], Gen.Int[0, 5], Gen.Double[-10, 10], Gen.Double[-10, 10]);
        gen.Sample(t =>
        {
            var (i1, i2, v1, v2) = t;
            if (i1 == i2)
            {
                return;
            }

            var solver = BalanceSolver.Create(Model, [Ids[i1], Ids[i2]]);
            var kernel = Enumerable.Range(0, 6).Where(i => i != i1 && i != i2).ToArray();
            var e = Matrix<double>.Build.DenseOfArray(Model.ElementMatrix(solver.Compounds));
            var eu = Matrix<double>.Build.DenseOfColumnVectors(kernel.Select(e.Column));
            if (solver.Analysis.Redundancy != 0 || !solver.Analysis.IsDetermined)
            {
                Assert.True(eu.Rank() < 4);
                return;
            }

            var em = Matrix<double>.Build.DenseOfColumnVectors(e.Column(i1), e.Column(i2));
            var direct = eu.Solve(-(em * Vector<double>.Build.Dense([v1, v2])));
            var rates = new double[6];
            var outcome = solver.Solve([v1, v2], TestModels.Diagonal(0.1, 0.1), rates, []);

            Assert.Equal(0, outcome.Dof);
            Assert.Equal(v1, rates[i1]);
            Assert.Equal(v2, rates[i2]);
            for (int j = 0; j < 4; j++)
            {
                Assert.True(Math.Abs(direct[j] - rates[kernel[j]]) <= 1e-9 * Math.Max(1, Math.Abs(direct[j])), $"{Ids[kernel[j]]}: {rates[kernel[j]]} vs {direct[j]}");
            }
        }, iter: 200);
    }
}
