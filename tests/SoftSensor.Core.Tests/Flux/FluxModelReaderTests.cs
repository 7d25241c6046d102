using SoftSensor.Core.Flux;

namespace SoftSensor.Core.Tests.Flux;

public class FluxModelReaderTests
{
    private const string Compounds = """ "compounds": { "glc": { "formula": "C6H12O6", "role": "substrate" }, "co2": { "formula": "CO2", "role": "carbonDioxide" } } """;

    [Theory]
    [InlineData("{" + Compounds + "}", "reactions: missing")]
    [InlineData("{" + Compounds + ", \"reactions\": {} }", "reactions: empty")]
    [InlineData("{" + Compounds + ", \"metabolites\": { \"glc\": { \"formula\": \"C6H12O6\" } }, \"reactions\": { \"r\": \"glc -> 6 co2\" } }", "metabolites.glc: 'glc' is already a compound")]
    [InlineData("{" + Compounds + ", \"metabolites\": { \"ATP\": { } }, \"reactions\": { \"r\": \"glc -> 6 co2\" } }", "metabolites.ATP: give either \"formula\"")]
    [InlineData("{" + Compounds + ", \"reactions\": { \"r\": \"glc -> 6 co2\" }, \"splits\": { \"s\": { \"flux\": \"r\", \"per\": \"q\", \"ratio\": 0.5 } } }", "splits.s: 'q' is not a reaction")]
    [InlineData("{" + Compounds + ", \"reactions\": { \"r\": \"glc -> 6 co2\" }, \"maintenance\": { \"reaction\": \"r\", \"atpMmolPerGramPerH\": 1 } }", "a per-gram value needs a compound with role biomass")]
    [InlineData("{ \"compounds\": { \"Glc\": { \"formula\": \"C6H12O6\" } }, \"reactions\": { \"r\": \"Glc ->\" } }", "compounds.Glc: id 'Glc' must be lower case")]
    [InlineData("{" + Compounds + ", \"reactions\": { \"r\": \"glc -> 6 co2\" }, \"parameters\": { \"PO\": \"two\" } }", "parameters.PO: expected an object")]
    public void Load_rejects_bad_models_naming_the_field(string json, string expected)
    {
        var ex = Assert.Throws<FluxModelException>(() => FluxModel.Load(json));
        Assert.Contains(expected, ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Load_ignores_top_level_keys_of_other_readers_and_keeps_parameter_sources()
    {
        var model = FluxModel.Load("{" + Compounds + """
            , "balances": ["C"], "observer": { "any": 1 },
              "parameters": { "PO": { "value": 1.5, "unit": "mol/mol", "source": "assumed" } },
              "reactions": { "r": "glc -> 6 co2" } }
            """);
        var p = Assert.Single(model.Parameters);
        Assert.Equal(1.5, p.Value);
        Assert.Equal("assumed", p.Source);
    }
}
