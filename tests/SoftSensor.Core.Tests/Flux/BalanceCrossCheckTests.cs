using SoftSensor.Core.Flux;
using SoftSensor.Core.Stoichiometry;
using static SoftSensor.Core.Tests.Flux.ShippedModels;

namespace SoftSensor.Core.Tests.Flux;

/// <summary>The flux model's rates through the elemental-balance engine (docs/methods.md §3, consistency check).</summary>
public class BalanceCrossCheckTests
{
    [Theory]
    [InlineData(Bacterium)]
    [InlineData(Yeast)]
    public void Shipped_model_file_loads_in_the_elemental_balance_reader_too(string file)
    {
        var model = ModelReader.Parse(Json(file));
        Assert.Equal(["C", "gamma", "N"], model.Balances.Select(b => b.Name));
        Assert.True(model.TryGet("biomass", out var biomass));
        Assert.Equal(CompoundRole.Biomass, biomass.Role);
    }

    [Theory]
    [InlineData(Bacterium)]
    [InlineData(Yeast)]
    public void Check_predicted_rates_of_a_balanced_network_pass_with_h_near_zero(string file)
    {
        var net = Network(file);
        double x = net.Model.BiomassCmmolPerL(8);
        var outcome = new BalanceCrossCheck(net).Check(AtGrowth(net, 0.2 * x, x));
        Assert.Equal(BalanceStatus.Solved, outcome.Status);
        Assert.Equal(3, outcome.Dof);
        Assert.True(outcome.H < 1e-12, $"h = {outcome.H}");
        Assert.True(outcome.Consistent);
    }

    [Fact]
    public void Check_predicted_rates_of_a_network_that_loses_carbon_fail_the_test()
    {
        // Pyruvate dehydrogenase without its CO2 destroys one C per flux: the carbon balance cannot close.
        string json = Json(Bacterium).Replace("\"pyruvate -> acetyl + co2 + NADH\"", "\"pyruvate -> acetyl + NADH + h2o\"", StringComparison.Ordinal);
        var net = FluxNetwork.Load(json);
        Assert.Contains(net.Imbalances, i => i.Reaction == "pyruvateDehydrogenase" && i.Element == "C" && i.Excess == -1);
        double x = net.Model.BiomassCmmolPerL(8);
        var outcome = new BalanceCrossCheck(net).Check(AtGrowth(net, 0.2 * x, x));
        Assert.False(outcome.Consistent, $"h = {outcome.H}, critical {outcome.Critical}");
    }
}
