using SoftSensor.Core.Flux;

namespace SoftSensor.Core.Tests.Flux;

/// <summary>Unbalanced reactions, undetermined fluxes and contradictory bases are results with names, not exceptions.</summary>
public class NetworkDiagnosisTests
{
    private static string BacteriumWith(string reaction, string equation)
    {
        string json = ShippedModels.Json(ShippedModels.Bacterium);
        var node = System.Text.Json.Nodes.JsonNode.Parse(json, documentOptions: new() { CommentHandling = System.Text.Json.JsonCommentHandling.Skip })!;
        node["reactions"]![reaction] = equation;
        return node.ToJsonString();
    }

    [Fact]
    public void Check_network_with_pyruvate_dehydrogenase_missing_its_NADH_names_that_reaction_and_two_H()
    {
        // PDH releases 1 NADH (Berg, Tymoczko & Stryer, Biochemistry); dropping it loses 2 H per flux.
        var net = FluxNetwork.Load(BacteriumWith("pyruvateDehydrogenase", "pyruvate -> acetyl + co2"));
        var imbalance = Assert.Single(net.Imbalances);
        Assert.Equal("pyruvateDehydrogenase", imbalance.Reaction);
        Assert.Equal("H", imbalance.Element);
        Assert.Equal(-2.0, imbalance.Excess, 12);
    }

    [Fact]
    public void Solve_unbalanced_network_leaves_a_closure_residual_of_the_missing_element()
    {
        var net = FluxNetwork.Load(BacteriumWith("citricAcidCycle", "acetyl + 3 h2o -> 2 co2 + 4 NADH"));
        Assert.Empty(net.Imbalances); // ATP has no elements: an energy error is not an elemental one
        var bad = FluxNetwork.Load(BacteriumWith("citricAcidCycle", "acetyl + 2 h2o -> 2 co2 + 4 NADH + ATP"));
        var imbalances = bad.Imbalances.Where(i => i.Reaction == "citricAcidCycle").ToList();
        Assert.Equal(2, imbalances.Count);
        Assert.Contains(imbalances, i => i.Element == "H" && Math.Abs(i.Excess - 2) < 1e-12);
        Assert.Contains(imbalances, i => i.Element == "O" && Math.Abs(i.Excess - 1) < 1e-12);
        Assert.Equal(imbalances.Count, bad.Imbalances.Count);
        double x = bad.Model.BiomassCmmolPerL(10);
        var s = ShippedModels.AtGrowth(bad, 0.2 * x, x);
        int h = bad.ClosureLabels.ToList().IndexOf("H");
        Assert.True(Math.Abs(s.Closure[h]) > 1, $"H closure {s.Closure[h]}");
    }

    [Fact]
    public void Solver_with_free_overflow_branch_lists_the_undetermined_fluxes_instead_of_failing()
    {
        // Add acetate overflow as a free branch: pyruvate -> acetate is not fixed by the balances
        // when only growth is given; its flux and those it feeds are listed as undetermined.
        string json = BacteriumWith("acetateOverflow", "acetyl + h2o -> acetate + ATP");
        var net = FluxNetwork.Load(json);
        Assert.Empty(net.Imbalances);
        var solver = new FluxSolver(net, ["biomass"]);
        var s = solver.Solve([50.0], 300.0);
        Assert.Equal(FluxSolveStatus.PartlyDetermined, s.Status);
        Assert.Contains("acetateOverflow", solver.Undetermined);
        Assert.Contains("citricAcidCycle", solver.Undetermined);
        Assert.DoesNotContain("biomassSynthesis", solver.Undetermined);
        Assert.Equal(1, solver.MissingBasisCount);
        Assert.True(double.IsNaN(s.FluxesOf(net, "acetateOverflow")));
        Assert.Equal(50.0, s.FluxesOf(net, "biomassSynthesis"), 9);

        // A measured acetate rate closes the gap.
        var full = new FluxSolver(net, ["biomass", "acetate"]).Solve([50.0, 10.0], 300.0);
        Assert.Equal(FluxSolveStatus.Determined, full.Status);
        Assert.Equal(5.0, full.FluxesOf(net, "acetateOverflow"), 9);
        foreach (double r in full.Closure)
        {
            Assert.InRange(r, -1e-9, 1e-9);
        }
    }

    [Fact]
    public void Solver_with_fixed_split_determines_the_branch()
    {
        string json = BacteriumWith("acetateOverflow", "acetyl + h2o -> acetate + ATP");
        var node = System.Text.Json.Nodes.JsonNode.Parse(json)!;
        node["splits"] = System.Text.Json.Nodes.JsonNode.Parse("""{ "overflow": { "flux": "acetateOverflow", "per": ["acetateOverflow", "citricAcidCycle"], "ratio": 0.25 } }""");
        var net = FluxNetwork.Load(node.ToJsonString());
        var s = new FluxSolver(net, ["biomass"]).Solve([50.0], 300.0);
        Assert.Equal(FluxSolveStatus.Determined, s.Status);
        double ac = s.FluxesOf(net, "acetateOverflow"), tca = s.FluxesOf(net, "citricAcidCycle");
        Assert.Equal(0.25, ac / (ac + tca), 12);
    }

    [Fact]
    public void Solver_with_contradicting_bases_reports_inconsistent()
    {
        var net = ShippedModels.Network(ShippedModels.Bacterium);
        var solver = new FluxSolver(net, ["biomass", "glycerol"]);
        Assert.Empty(solver.Undetermined);
        var agree = ShippedModels.AtGrowth(net, 50, 300);
        var ok = solver.Solve([50.0, ShippedModels.RateOf(net, agree, "glycerol")], 300);
        Assert.Equal(FluxSolveStatus.Determined, ok.Status);
        var clash = solver.Solve([50.0, -1000.0], 300);
        Assert.Equal(FluxSolveStatus.Inconsistent, clash.Status);
        Assert.True(clash.ConstraintResidual > 1);
    }

    [Fact]
    public void Solver_without_biomass_concentration_reports_it_missing_when_maintenance_is_modelled()
    {
        var net = ShippedModels.Network(ShippedModels.Yeast);
        var s = ShippedModels.AtGrowth(net, 10, double.NaN);
        Assert.Equal(FluxSolveStatus.BiomassConcentrationMissing, s.Status);
    }
}

internal static class FluxSolutionTestExtensions
{
    public static double FluxesOf(this FluxSolution s, FluxNetwork net, string reaction) => s.Fluxes[net.Model.ReactionIndex(reaction)];
}
