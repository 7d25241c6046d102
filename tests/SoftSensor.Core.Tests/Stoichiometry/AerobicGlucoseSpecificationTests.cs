using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Tests.Stoichiometry;

/// <summary>
/// Aerobic growth on glucose with a yield specification: docs/methods.md §2.3 (6 compounds, rank 4, 2 degrees
/// of freedom) and the check values of docs/methods.md §6 (recomputed from the elemental balance).
/// </summary>
public class AerobicGlucoseSpecificationTests
{
    [Fact]
    public void Analysis_six_compounds_rank_four_leaves_two_degrees_of_freedom()
    {
        // docs/methods.md §2.3: {glucose, O2, NH3, biomass, CO2, H2O}: 6 - 4 = 2.
        var solver = BalanceSolver.Create(TestModels.AerobicGlucose, ["glucose"]);

        Assert.Equal(4, solver.Analysis.ElementMatrixRank);
        Assert.Equal(2, solver.Analysis.DegreesOfFreedom);
        Assert.Equal(1, solver.Analysis.MissingInformation);
        Assert.False(solver.Analysis.IsDetermined);
        Assert.Contains("1 more independent measurement", solver.Analysis.Advice, StringComparison.Ordinal);
    }

    [Fact]
    public void Solve_yield_of_half_a_gram_per_gram_gives_the_METHODS_rates_and_RQ()
    {
        // docs/methods.md §6: Y_XS = 0.5 g/g, biomass CH1.8O0.5N0.2 -> per C-mol glucose: biomass 0.6096,
        // CO2 0.3904, O2 0.3599, NH3 0.1219, H2O 0.6342; RQ 1.085 (elemental balance, recomputed).
        var model = TestModels.AerobicGlucose;
        var yield = Specification.MassYield(model, "biomass", "glucose", 0.5);
        var solver = BalanceSolver.Create(model, ["glucose"], [yield]);
        var rates = new double[6];
        var sigmas = new double[6];

        var outcome = solver.Solve([-1.0], [0.01 * 0.01], rates, sigmas);

        Assert.Equal(BalanceStatus.Solved, outcome.Status);
        Assert.Equal(0, outcome.Dof);
        Assert.True(outcome.Consistent);
        double Rate(string id) => rates[solver.CompoundIds.ToList().IndexOf(id)];
        Assert.Equal(0.6096, Rate("biomass"), 4);
        Assert.Equal(0.3904, Rate("co2"), 4);
        Assert.Equal(-0.3599, Rate("o2"), 4);
        Assert.Equal(-0.1219, Rate("nh3"), 4);
        Assert.Equal(0.6342, Rate("h2o"), 4);
        Assert.Equal(1.085, Rate("co2") / -Rate("o2"), 3);

        // Every rate is proportional to the glucose rate, so its relative uncertainty (1 %) carries over.
        Assert.Equal(0.01 * 0.6096, sigmas[solver.CompoundIds.ToList().IndexOf("biomass")], 4);
    }

    [Fact]
    public void Solve_RQ_ratio_specification_reproduces_the_yield_case()
    {
        // The same case specified by its RQ instead (ratio of signed rates co2/o2 = -RQ).
        var model = TestModels.AerobicGlucose;
        var byYield = BalanceSolver.Create(model, ["glucose"], [Specification.MassYield(model, "biomass", "glucose", 0.5)]);
        var yieldRates = new double[6];
        byYield.Solve([-1.0], [1e-4], yieldRates, []);
        int co2 = byYield.CompoundIds.ToList().IndexOf("co2"), o2 = byYield.CompoundIds.ToList().IndexOf("o2");
        double rq = yieldRates[co2] / -yieldRates[o2];

        var byRq = BalanceSolver.Create(model, ["glucose"], [Specification.Ratio("co2", "o2", -rq)]);
        var rqRates = new double[6];
        byRq.Solve([-1.0], [1e-4], rqRates, []);

        for (int j = 0; j < 6; j++)
        {
            Assert.Equal(yieldRates[j], rqRates[j], 10);
        }
    }

    [Fact]
    public void Solve_without_specification_reports_which_rates_are_open()
    {
        var solver = BalanceSolver.Create(TestModels.AerobicGlucose, ["glucose"]);
        var rates = new double[6];

        var outcome = solver.Solve([-1.0], [1e-4], rates, new double[6]);

        Assert.Equal(BalanceStatus.PartlyDetermined, outcome.Status);
        Assert.Empty(solver.Analysis.Calculable);
        Assert.Equal(["o2", "nh3", "biomass", "co2", "h2o"], solver.Analysis.NotCalculable);
        Assert.All(rates.Skip(1), r => Assert.True(double.IsNaN(r)));
    }
}
