using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Tests.Stoichiometry;

/// <summary>The per-cycle path allocates nothing once the solver is built (factor once, solve many: MathNet.Numerics ISolver.Solve(input, result)).</summary>
public class AllocationTests
{
    [Fact]
    public void Solve_and_Diagnose_allocate_no_managed_memory()
    {
        var solver = BalanceSolver.Create(TestModels.Glycerol, ["glycerol", "o2", "co2", "biomass", "nh3"]);
        double[] q = [-1.0, -0.8, 0.5, 0.5, -0.1];
        var psi = TestModels.Relative(0.03, q);
        AssertSolveAndDiagnoseAllocateNothing(solver, q, psi);
    }

    /// <summary>Warms the solver up, then asserts 100 Solve + Diagnose calls allocate no managed memory.</summary>
    internal static void AssertSolveAndDiagnoseAllocateNothing(BalanceSolver solver, double[] q, double[] psi)
    {
        int n = solver.Compounds.Count;
        var rates = new double[n];
        var sigmas = new double[n];
        var cov = new double[n * n];
        var outcomes = new HypothesisOutcome[solver.Hypotheses.Count];
        solver.Solve(q, psi, rates, sigmas, cov);
        solver.Diagnose(q, psi, outcomes);

        long before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 100; i++)
        {
            solver.Solve(q, psi, rates, sigmas, cov);
            solver.Diagnose(q, psi, outcomes);
        }

        Assert.Equal(0, GC.GetAllocatedBytesForCurrentThread() - before);
    }
}
