using SoftSensor.Core.Chemistry;
using SoftSensor.Core.Flux;
using static SoftSensor.Core.Tests.Flux.ShippedModels;

namespace SoftSensor.Core.Tests.Flux;

/// <summary>The shipped networks against published stoichiometry (sources beside each check).</summary>
public class PublishedChecksTests
{
    // Resting cells: no growth, maintenance only (X = 400 C-mmol/L), so all substrate goes to the catabolic product.
    private const double RestingBiomassCmmolPerL = 400;

    [Fact]
    public void Yeast_without_growth_gives_the_Gay_Lussac_ethanol_yield_0_511_g_per_g_hexose()
    {
        // Gay-Lussac equation C6H12O6 -> 2 C2H5OH + 2 CO2: 2 * 46.07 / 180.16 = 0.511 g/g
        // (docs/methods.md §6; molar masses from IUPAC 2021 standard atomic weights).
        var net = Network(Yeast);
        var s = AtGrowth(net, 0.0, RestingBiomassCmmolPerL);
        Assert.Equal(FluxSolveStatus.Determined, s.Status);
        double hexoseMmol = 2 * FluxOf(net, s, "invertase");
        double ethanolG = RateOf(net, s, "ethanol") / 2 * Formula.Parse("C2H6O").MolarMassGPerMol;
        double hexoseG = hexoseMmol * Formula.Parse("C6H12O6").MolarMassGPerMol;
        Assert.Equal(0.5114, ethanolG / hexoseG, 4);
        Assert.Equal(0.0, RateOf(net, s, "glycerol"), 12);

        // CO2 equals ethanol mole for mole (same equation).
        Assert.Equal(RateOf(net, s, "ethanol") / 2, RateOf(net, s, "co2"), 9);
    }

    [Fact]
    public void Yeast_alcoholic_fermentation_makes_two_ATP_per_hexose()
    {
        // Glycolysis plus alcoholic fermentation: net 2 ATP per glucose (Berg, Tymoczko & Stryer,
        // Biochemistry, chapter "Glycolysis and gluconeogenesis"; Lehninger, Principles of Biochemistry).
        // With no growth, every ATP made goes to the maintenance reaction.
        var net = Network(Yeast);
        var s = AtGrowth(net, 0.0, RestingBiomassCmmolPerL);
        double hexose = 2 * FluxOf(net, s, "invertase");
        Assert.Equal(2.0, FluxOf(net, s, "maintenance") / hexose, 10);
    }

    [Fact]
    public void Bacterium_oxidising_glycerol_without_growth_has_RQ_six_sevenths()
    {
        // C3H8O3 + 3.5 O2 -> 3 CO2 + 4 H2O: RQ = 3 / 3.5 = 6/7 = 0.857 (docs/methods.md §6, stoichiometry).
        var net = Network(Bacterium);
        var s = AtGrowth(net, 0.0, RestingBiomassCmmolPerL);
        Assert.Equal(FluxSolveStatus.Determined, s.Status);
        Assert.Equal(6.0 / 7.0, RateOf(net, s, "co2") / -RateOf(net, s, "o2"), 12);
    }

    [Fact]
    public void Bacterium_ATP_per_glycerol_oxidised_is_substrate_level_plus_PO_times_seven_NADH()
    {
        // Glycerol kinase -1, lower glycolysis +2, citric acid cycle +1 (GTP) = 2 ATP at substrate
        // level; 7 redox pairs (glycerol-3-P dehydrogenase 1, GAP dehydrogenase 1, pyruvate
        // dehydrogenase 1, citric acid cycle 4) (Berg, Tymoczko & Stryer, Biochemistry); 7 pairs is
        // also gamma(C3H8O3) / 2 = 14 / 2 (Roels 1983). With P/O = 2: 2 + 7 * 2 = 16 ATP.
        var net = Network(Bacterium);
        var s = AtGrowth(net, 0.0, RestingBiomassCmmolPerL);
        double glycerolMol = -RateOf(net, s, "glycerol") / 3;
        Assert.Equal(16.0, FluxOf(net, s, "maintenance") / glycerolMol, 10);
        Assert.Equal(7.0, FluxOf(net, s, "respiration") / glycerolMol, 10);
    }

    [Fact]
    public void Complete_oxidation_of_ethanol_has_RQ_two_thirds()
    {
        // C2H6O + 3 O2 -> 2 CO2 + 3 H2O: RQ = 2/3 (docs/methods.md §6, stoichiometry); pathway: alcohol and
        // acetaldehyde dehydrogenase, acetyl-CoA synthetase (2 ATP equivalents), citric acid cycle
        // (Berg, Tymoczko & Stryer, Biochemistry).
        const string json = """
        {
          "name": "ethanol oxidation",
          "compounds": {
            "ethanol": { "formula": "C2H6O", "role": "substrate" },
            "o2": { "formula": "O2", "role": "oxygen" },
            "co2": { "formula": "CO2", "role": "carbonDioxide" },
            "h2o": { "formula": "H2O", "role": "water" }
          },
          "metabolites": {
            "acetaldehyde": { "formula": "C2H4O" }, "acetate": { "formula": "C2H4O2" },
            "acetyl": { "formula": "C2H2O" }, "NADH": { "formula": "H2" }, "ATP": { "carrier": true }
          },
          "reactions": {
            "adh": "ethanol -> acetaldehyde + NADH",
            "ald": "acetaldehyde + h2o -> acetate + NADH",
            "acs": "acetate + 2 ATP -> acetyl + h2o",
            "tca": "acetyl + 3 h2o -> 2 co2 + 4 NADH + ATP",
            "resp": "NADH + 0.5 o2 -> h2o + 1.5 ATP",
            "atpDrain": "ATP ->"
          }
        }
        """;
        var net = FluxNetwork.Load(json);
        Assert.Empty(net.Imbalances);
        var s = new FluxSolver(net, ["ethanol"]).Solve([-2.0], double.NaN);
        Assert.Equal(FluxSolveStatus.Determined, s.Status);
        Assert.Equal(2.0 / 3.0, RateOf(net, s, "co2") / -RateOf(net, s, "o2"), 12);
    }

    [Fact]
    public void Shipped_networks_are_elementally_balanced_reaction_by_reaction()
    {
        Assert.Empty(Network(Bacterium).Imbalances);
        Assert.Empty(Network(Yeast).Imbalances);
    }
}
