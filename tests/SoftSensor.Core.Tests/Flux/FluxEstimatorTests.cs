using CsCheck;
using SoftSensor.Core.Flux;
using static SoftSensor.Core.Tests.Flux.ShippedModels;

namespace SoftSensor.Core.Tests.Flux;

/// <summary>Live use: growth from OUR/CER with no yield specification (docs/methods.md §3).</summary>
public class FluxEstimatorTests
{
    [Fact]
    public void Estimate_from_model_consistent_OUR_and_CER_recovers_growth_rate_and_zero_gap()
    {
        var net = Network(Bacterium);
        double x = net.Model.BiomassCmmolPerL(12.0);
        double rx = 0.25 * x;
        var truth = AtGrowth(net, rx, x);
        var est = FluxEstimator.ForGas(net);
        double[] measured = [RateOf(net, truth, "o2"), RateOf(net, truth, "co2")];
        var predicted = new double[net.Model.Compounds.Count];
        var gap = new double[2];
        var e = est.Estimate(measured, [1.0, 1.0], x, predicted, gap);
        Assert.Equal(FluxEstimateStatus.Estimated, e.Status);
        Assert.Equal(rx, e.BiomassRateCmmolPerLh, 9);
        Assert.Equal(0.25, e.MuPerH, 12);
        Assert.Equal(0.0, gap[0], 9);
        Assert.Equal(0.0, gap[1], 9);
        Assert.Equal(RateOf(net, truth, "glycerol"), predicted[net.Model.CompoundIndex("glycerol")], 9);
        Assert.Equal(1, e.DegreesOfFreedom);
    }

    [Fact]
    public void Estimate_with_CER_biased_shows_a_gap_and_a_large_chi_square()
    {
        var net = Network(Bacterium);
        double x = net.Model.BiomassCmmolPerL(12.0);
        var truth = AtGrowth(net, 0.25 * x, x);
        var est = FluxEstimator.ForGas(net);
        double our = -RateOf(net, truth, "o2"), cer = RateOf(net, truth, "co2");
        var predicted = new double[net.Model.Compounds.Count];
        var gap = new double[2];
        var e = est.Estimate([-our, cer * 1.2], [0.02 * our, 0.02 * cer], x, predicted, gap);
        Assert.True(gap[1] > 0 && gap[0] > 0, $"gaps {gap[0]}, {gap[1]}");
        Assert.True(e.ChiSquare > 6.63, $"chi2 {e.ChiSquare}"); // chi-square 1 dof, 99 %: 6.63 (NIST/SEMATECH e-Handbook)
    }

    [Fact]
    public void Estimate_from_OUR_alone_at_zero_growth_attributes_it_to_maintenance()
    {
        // Pirt 1965: with mu = 0 the cells still respire for maintenance; OUR equal to the maintenance OUR gives r_X = 0.
        var net = Network(Bacterium);
        double x = net.Model.BiomassCmmolPerL(12.0);
        var resting = AtGrowth(net, 0, x);
        var est = new FluxEstimator(net, ["o2"]);
        var predicted = new double[net.Model.Compounds.Count];
        var gap = new double[1];
        var e = est.Estimate([RateOf(net, resting, "o2")], [0.5], x, predicted, gap);
        Assert.Equal(0.0, e.BiomassRateCmmolPerLh, 9);
        Assert.Equal(0, e.DegreesOfFreedom);
    }

    [Fact]
    public void Estimate_with_missing_values_or_biomass_returns_a_status()
    {
        var net = Network(Bacterium);
        var est = FluxEstimator.ForGas(net);
        var predicted = new double[net.Model.Compounds.Count];
        var gap = new double[2];
        Assert.Equal(FluxEstimateStatus.NoInformation, est.Estimate([double.NaN, double.NaN], [1, 1], 100, predicted, gap).Status);
        Assert.Equal(FluxEstimateStatus.NoInformation, est.Estimate([-10, 8], [0, double.NaN], 100, predicted, gap).Status);
        Assert.Equal(FluxEstimateStatus.BiomassConcentrationMissing, est.Estimate([-10, 8], [1, 1], double.NaN, predicted, gap).Status);
    }

    [Fact]
    public void Estimate_allocates_nothing_after_setup()
    {
        var net = Network(Yeast);
        var est = new FluxEstimator(net, ["co2", "ethanol"]);
        var predicted = new double[net.Model.Compounds.Count];
        var gap = new double[2];
        double[] y = [100, 150], s = [2, 3];
        est.Estimate(y, s, 200, predicted, gap);
        long before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 100; i++)
        {
            est.Estimate(y, s, 200 + i, predicted, gap);
        }

        Assert.Equal(before, GC.GetAllocatedBytesForCurrentThread());
    }

    [Fact]
    public void Solve_into_a_preallocated_solution_allocates_nothing()
    {
        var net = Network(Bacterium);
        var solver = new FluxSolver(net, ["biomass"]);
        var s = solver.CreateSolution();
        double[] basis = [10.0];
        solver.Solve(basis, 300, s);
        long before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 100; i++)
        {
            basis[0] = i;
            solver.Solve(basis, 300, s);
        }

        Assert.Equal(before, GC.GetAllocatedBytesForCurrentThread());
    }

    [Fact]
    public void Solve_for_any_growth_and_biomass_closes_the_balances_of_both_networks()
    {
        // Property (seeded): every predicted rate vector of an elementally balanced network closes E q = 0.
        var bacterium = new FluxSolver(Network(Bacterium), ["biomass"]);
        var yeast = new FluxSolver(Network(Yeast), ["biomass"]);
        Gen.Select(Gen.Double[0, 1000], Gen.Double[0, 2000], Gen.Bool).Sample((rx, x, which) =>
        {
            var solver = which ? bacterium : yeast;
            var s = solver.Solve([rx], x);
            double scale = 1 + s.Exchange.Max(Math.Abs);
            return s.Status == FluxSolveStatus.Determined && s.Closure.All(r => Math.Abs(r) <= 1e-12 * scale * 100);
        }, seed: "0N0XIzNsQ0O2", iter: 200, threads: 1); // one thread: a solver owns its scratch vectors
    }
}
