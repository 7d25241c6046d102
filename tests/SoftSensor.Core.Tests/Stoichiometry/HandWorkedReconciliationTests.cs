using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Tests.Stoichiometry;

/// <summary>
/// The reconciliation case of docs/methods.md §6, worked by hand with the equations of section 2.4
/// (Wang &amp; Stephanopoulos 1983; van der Heijden et al. 1994).
/// </summary>
public class HandWorkedReconciliationTests
{
    // Derivation. Compounds (substrate CH2O per C-mol, O2, CO2, biomass CH1.8O0.5N0.2), balances C and
    // gamma (Roels 1983: gamma = 4, -4, 0, 4.2):
    //   E = [ 1   0   1   1  ]        q = (-1.000, -0.380, 0.400, 0.600)
    //       [ 4  -4   0  4.2 ]
    // Every rate is measured, so R = E (no unknowns) and rho = rank(E) = 2.
    //   eps = E q = (-1 + 0.4 + 0.6, -4 + 1.52 + 2.52) = (0, 0.04)
    //   Psi = diag((0.05 q)^2) = diag(0.0025, 0.000361, 0.0004, 0.0009)
    //   Phi = E Psi E^T: Phi_CC = 0.0025 + 0.0004 + 0.0009 = 0.0038
    //                    Phi_Cg = 4(0.0025) + 4.2(0.0009) = 0.01378
    //                    Phi_gg = 16(0.0025) + 16(0.000361) + 17.64(0.0009) = 0.061652
    //   det Phi = 0.0038(0.061652) - 0.01378^2 = 4.4394e-5;  (Phi^-1)_gg = 0.0038 / det = 85.60
    //   h = 0.04^2 (85.60) = 0.1370  <  5.99 (χ², 2 dof, 95 %: NIST/SEMATECH e-Handbook table)  -> passes.
    // With O2 = -0.500: eps = (0, 0.52), Psi_O2 = 0.025^2 = 0.000625, Phi_gg = 0.065876,
    //   det = 6.0439e-5, (Phi^-1)_gg = 62.873, h = 0.2704 (62.873) = 17.00  >  5.99  -> fails.
    // Diagnosis, O2 moved to the unknowns: the C balance alone is left (rho = 1) and it closes
    //   exactly (-1 + 0.4 + 0.6 = 0), so h = 0; the gamma balance gives the O2 the others imply:
    //   -4 - 4 q_O2 + 4.2 (0.6) = 0  ->  q_O2 = -0.370.
    private static readonly string[] Measured = ["substrate", "o2", "co2", "biomass"];

    [Fact]
    public void Solve_consistent_set_gives_h_0_137_with_2_dof_and_passes()
    {
        var solver = BalanceSolver.Create(TestModels.FourCompound, Measured);
        double[] q = [-1.000, -0.380, 0.400, 0.600];
        var rates = new double[4];
        var sigmas = new double[4];

        var outcome = solver.Solve(q, TestModels.Relative(0.05, q), rates, sigmas);

        Assert.Equal(BalanceStatus.Solved, outcome.Status);
        Assert.Equal(2, outcome.Dof);
        Assert.Equal(0.137, outcome.H, 0.0005); // docs/methods.md §6: 0.137 (hand value above: 0.13697)
        Assert.Equal(5.991, outcome.Critical, 3); // χ² 2 dof 95 %: 5.99 (NIST/SEMATECH e-Handbook, section 1.3.6.7.4)
        Assert.True(outcome.Consistent);
        Assert.True(outcome.HasTest);
    }

    [Fact]
    public void Solve_wrong_oxygen_gives_h_17_0_and_fails()
    {
        var solver = BalanceSolver.Create(TestModels.FourCompound, Measured);
        double[] q = [-1.000, -0.500, 0.400, 0.600];

        var outcome = solver.Solve(q, TestModels.Relative(0.05, q), new double[4], new double[4]);

        Assert.Equal(17.0, outcome.H, 0.005); // docs/methods.md §6: 17.0 (hand value above: 17.0005)
        Assert.False(outcome.Consistent);
    }

    [Fact]
    public void Diagnose_wrong_oxygen_isolates_the_oxygen_measurement()
    {
        var solver = BalanceSolver.Create(TestModels.FourCompound, Measured);
        double[] q = [-1.000, -0.500, 0.400, 0.600];
        var outcomes = new HypothesisOutcome[solver.Hypotheses.Count];

        var summary = solver.Diagnose(q, TestModels.Relative(0.05, q), outcomes);

        Assert.Equal(DiagnosisVerdict.Isolated, summary.Verdict);
        var suspect = solver.Hypotheses[summary.IsolatedIndex];
        Assert.Equal(new Hypothesis(HypothesisKind.MeasurementInError, "o2"), suspect);
        var o2 = outcomes[summary.IsolatedIndex];
        Assert.Equal(1, o2.Dof);
        Assert.Equal(0.0, o2.H, 12);
        Assert.Equal(-0.370, o2.SuspectRate, 12);
        Assert.Equal(3.841, o2.Critical, 3); // χ² 1 dof 95 %: 3.84 (NIST/SEMATECH e-Handbook)
        for (int i = 0; i < outcomes.Length; i++)
        {
            Assert.Equal(i == summary.IsolatedIndex, outcomes[i].Consistent);
        }
    }

    [Fact]
    public void Solve_reconciled_rates_close_both_balances_and_shrink_the_variances()
    {
        var solver = BalanceSolver.Create(TestModels.FourCompound, Measured);
        double[] q = [-1.000, -0.380, 0.400, 0.600];
        var psi = TestModels.Relative(0.05, q);
        var rates = new double[4];
        var sigmas = new double[4];
        var cov = new double[16];

        solver.Solve(q, psi, rates, sigmas, cov);

        // Reconciled values satisfy E q* = 0 (van der Heijden et al. 1994a: q* = q - Psi R^T Phi^-1 eps).
        Assert.Equal(0.0, rates[0] + rates[2] + rates[3], 12);
        Assert.Equal(0.0, (4 * rates[0]) - (4 * rates[1]) + (4.2 * rates[3]), 12);
        for (int i = 0; i < 4; i++)
        {
            Assert.True(sigmas[i] <= Math.Sqrt(psi[(i * 4) + i]) + 1e-15, $"sigma {i} did not shrink");
            Assert.Equal(sigmas[i] * sigmas[i], cov[(i * 4) + i], 15);
        }
    }
}
