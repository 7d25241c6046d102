using SoftSensor.Core.Chemistry;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Tests.Stoichiometry;

/// <summary>Water under the C, gamma and N balances (docs/methods.md §2.2: "water drops out").</summary>
public class OutsideBalancesTests
{
    [Fact]
    public void Analysis_water_in_no_balance_is_reported_apart_and_not_counted_as_missing()
    {
        var m = TestModels.Glycerol;
        var model = new StoichiometricModel(m.Name, m.Compounds, [Balance.Of(Element.C), Balance.DegreeOfReduction, Balance.Of(Element.N)]);

        var solver = BalanceSolver.Create(model, ["glycerol", "o2"]);

        Assert.Equal(["h2o"], solver.Analysis.OutsideBalances);
        Assert.DoesNotContain("h2o", solver.CompoundIds);
        Assert.Equal(2, solver.Analysis.DegreesOfFreedom); // 5 compounds, rank 3
        Assert.True(solver.Analysis.IsDetermined);
        var rates = new double[solver.CompoundIds.Count];
        Assert.Equal(BalanceStatus.Solved, solver.Solve([-1.0, -0.6], TestModels.Diagonal(0.01, 0.01), rates, []).Status);
    }
}
