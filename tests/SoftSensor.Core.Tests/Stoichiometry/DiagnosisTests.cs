using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Tests.Stoichiometry;

/// <summary>
/// Gross-error diagnosis (van der Heijden et al. 1994b, Biotechnol. Bioeng. 44) on the demo glycerol
/// model. The rates are made up for the demo (invented), built to close the balances exactly.
/// </summary>
public class DiagnosisTests
{
    // A consistent invented set per C-mol glycerol: biomass 0.5 C-mol. Balances C, H, O, N close it:
    //   C: -1 + 0.5 + co2 = 0 -> co2 = 0.5;  N: 0.2(0.5) + nh3 = 0 -> nh3 = -0.1;
    //   gamma: 4.667(-1) + 4.2(0.5) - 4 o2 = 0 -> o2 = -(4.6667 - 2.1)/4 = -0.641667.
    private const double Biomass = 0.5, Co2 = 0.5, Nh3 = -0.1;
    private static readonly double O2 = -((14.0 / 3.0) - 2.1) / 4.0;

    [Fact]
    public void Diagnose_missing_acetate_is_named_by_the_candidate_hypothesis()
    {
        // The cells also make 0.1 C-mol acetate (gamma 4), which nobody measures. With biomass 0.5,
        // NH3 -0.1 and O2 as above, the gamma balance fixes the glycerol uptake:
        //   (14/3) g = 4.2(0.5) + 4(0.1) + 4(0.641667) -> g = 1.08571, and carbon gives
        //   co2 = g - 0.5 - 0.1 = 0.48571. Without acetate the balances fail; adding it closes them.
        var model = TestModels.Glycerol;
        var solver = BalanceSolver.Create(model, ["glycerol", "o2", "co2", "biomass", "nh3"]);
        double glycerol = -(2.1 + 0.4 + (4 * -O2)) / (14.0 / 3.0);
        double co2 = -glycerol - Biomass - 0.1;
        double[] q = [glycerol, O2, co2, Biomass, Nh3];
        var psi = TestModels.Relative(0.02, q);
        var outcomes = new HypothesisOutcome[solver.Hypotheses.Count];

        var summary = solver.Diagnose(q, psi, outcomes);

        Assert.False(summary.Base.Consistent);
        int acetate = solver.Hypotheses.ToList().IndexOf(new Hypothesis(HypothesisKind.MissingProduct, "acetate"));
        Assert.True(acetate >= 0);
        Assert.True(outcomes[acetate].Consistent);
        Assert.Equal(0.1, outcomes[acetate].SuspectRate, 9);
        Assert.Equal(0.0, outcomes[acetate].H, 9);
    }

    [Fact]
    public void Diagnose_with_one_redundancy_detects_but_cannot_isolate()
    {
        // Glycerol, O2, CO2 measured with C, H, O, N: unknowns biomass, nh3, h2o (3 columns, rank 3);
        // rho = rank(E) - rank(E_u) = 4 - 3 = 1.
        var solver = BalanceSolver.Create(TestModels.Glycerol, ["glycerol", "o2", "co2"]);
        Assert.Equal(1, solver.Analysis.Redundancy);
        double[] q = [-1.0, O2 * 1.5, Co2];
        var outcomes = new HypothesisOutcome[solver.Hypotheses.Count];

        var summary = solver.Diagnose(q, TestModels.Relative(0.02, q), outcomes);

        Assert.False(summary.Base.Consistent);
        Assert.Equal(DiagnosisVerdict.DetectedNotIsolable, summary.Verdict);
        Assert.Equal(-1, summary.IsolatedIndex);
        Assert.All(outcomes, o => Assert.False(o.Testable));
    }

    [Fact]
    public void Diagnose_consistent_set_needs_no_diagnosis()
    {
        var solver = BalanceSolver.Create(TestModels.Glycerol, ["glycerol", "o2", "co2", "biomass", "nh3"]);
        double[] q = [-1.0, O2, Co2, Biomass, Nh3];
        var outcomes = new HypothesisOutcome[solver.Hypotheses.Count];

        var summary = solver.Diagnose(q, TestModels.Relative(0.02, q), outcomes);

        Assert.Equal(DiagnosisVerdict.NotNeeded, summary.Verdict);
        Assert.Equal(0.0, summary.Base.H, 9);
    }

    [Fact]
    public void Solve_full_covariance_is_accepted_and_changes_h()
    {
        // OUR and CER share the outlet flow of the inert balance, so their errors correlate
        // (docs/methods.md §2.4). A positive correlation between O2 (negative) and CO2 (positive) errors
        // differs from the diagonal case.
        var solver = BalanceSolver.Create(TestModels.FourCompound, ["substrate", "o2", "co2", "biomass"]);
        double[] q = [-1.000, -0.380, 0.400, 0.600];
        var diagonal = TestModels.Relative(0.05, q);
        var full = (double[])diagonal.Clone();
        double c = -0.8 * 0.05 * 0.380 * 0.05 * 0.400;
        full[(1 * 4) + 2] = c;
        full[(2 * 4) + 1] = c;

        var d = solver.Solve(q, diagonal, new double[4], []);
        var f = solver.Solve(q, full, new double[4], []);

        Assert.True(f.HasTest);
        Assert.NotEqual(d.H, f.H, 6);
    }

    [Fact]
    public void Solve_nan_measurement_or_negative_variance_is_a_result_not_an_exception()
    {
        var solver = BalanceSolver.Create(TestModels.FourCompound, ["substrate", "o2", "co2", "biomass"]);
        var psi = TestModels.Relative(0.05, -1, -0.38, 0.4, 0.6);

        var nan = solver.Solve([-1, double.NaN, 0.4, 0.6], psi, new double[4], []);
        psi[0] = -1e-4;
        var negative = solver.Solve([-1, -0.38, 0.4, 0.6], psi, new double[4], []);
        var zero = solver.Solve([-1, -0.38, 0.4, 0.6], new double[16], new double[4], []);

        Assert.Equal(BalanceStatus.InvalidMeasurement, nan.Status);
        Assert.Equal(BalanceStatus.InvalidMeasurement, negative.Status);
        Assert.Equal(BalanceStatus.CovarianceNotPositiveDefinite, zero.Status);
        Assert.False(nan.HasRates);
    }

    [Theory]
    [InlineData(new[] { "glycerol", "ethanol" }, "measured[1]: 'ethanol' names no compound")]
    [InlineData(new[] { "glycerol", "glycerol" }, "measured[1]: 'glycerol' is measured twice")]
    [InlineData(new string[0], "measured: no measured rate")]
    public void TryCreate_bad_measured_set_names_the_entry(string[] measured, string expected)
    {
        Assert.False(BalanceSolver.TryCreate(TestModels.Glycerol, measured, [], null, out var solver, out string? error));
        Assert.Null(solver);
        Assert.StartsWith(expected, error, StringComparison.Ordinal);
    }

    [Fact]
    public void TryCreate_specification_naming_no_compound_names_it()
    {
        Assert.False(BalanceSolver.TryCreate(TestModels.Glycerol, ["glycerol"], [Specification.Yield("cells", "glycerol", 0.5)], null, out _, out string? error));
        Assert.StartsWith("specifications[0] (yield:cells/glycerol=0.5): 'cells' names no compound", error, StringComparison.Ordinal);
    }
}
