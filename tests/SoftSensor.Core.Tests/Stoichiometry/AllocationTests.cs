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
        var rates = new double[6];
        var sigmas = new double[6];
        var cov = new double[36];
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
