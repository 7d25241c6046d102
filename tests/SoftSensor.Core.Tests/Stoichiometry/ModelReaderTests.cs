using SoftSensor.Core.Chemistry;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Tests.Stoichiometry;

public class ModelReaderTests
{
    [Fact]
    public void Parse_demo_model_reads_roles_ash_and_default_balances()
    {
        var model = TestModels.Glycerol;

        Assert.Equal("aerobic bacterium on glycerol", model.Name);
        Assert.Equal(7, model.Compounds.Count);
        Assert.Equal(["C", "H", "O", "N"], model.Balances.Select(b => b.Name));
        var biomass = model["biomass"];
        Assert.Equal(CompoundRole.Biomass, biomass.Role);
        Assert.Equal(0.06, biomass.AshFraction);
        // 24.6263 g/C-mol (IUPAC 2021 weights, see FormulaTests) / (1 - 0.06) = 26.198 g dry weight per C-mol.
        Assert.Equal(24.6263 / 0.94, biomass.WeighedMassGPerRateUnit, 3);
        Assert.Equal(CompoundRole.Candidate, model["acetate"].Role);
        Assert.Equal(14.0 / 3.0, model["glycerol"].DegreeOfReductionPerRateUnit, 12); // Roels 1983: glycerol 4.67 per C-mol
    }

    [Fact]
    public void ElementMatrix_counts_organics_per_C_mol()
    {
        var model = TestModels.Glycerol;
        var e = model.ElementMatrix([model["glycerol"], model["o2"]]);

        // Glycerol C3H8O3 per C-mol is CH2.667O: C 1, H 8/3, O 1, N 0; O2 per mol: O 2.
        Assert.Equal(1.0, e[0, 0], 12);
        Assert.Equal(8.0 / 3.0, e[1, 0], 12);
        Assert.Equal(1.0, e[2, 0], 12);
        Assert.Equal(2.0, e[2, 1], 12);
    }

    [Fact]
    public void Parse_molar_mass_override_is_used_for_mass_yields()
    {
        var model = ModelReader.Parse("""{ "compounds": { "biomass": { "formula": "CH1.8O0.5N0.2", "role": "biomass", "molarMass": 25.0 } } }""");
        Assert.Equal(25.0, model["biomass"].MassGPerRateUnit);
        Assert.Equal(CompoundRole.Biomass, model["biomass"].Role);
        Assert.Equal("unnamed model", model.Name);
    }

    [Fact]
    public void Parse_upper_case_ids_lists_every_one_with_the_id_to_write_in_one_message()
    {
        // The ids a user writes first (formulas as ids); the fix names each, so one run is enough.
        var ex = Assert.Throws<ModelFormatException>(() => ModelReader.Parse(
            """{ "compounds": { "glycerol": { "formula": "C3H8O3" }, "O2": { "formula": "O2" }, "CO2": { "formula": "CO2" }, "NH3": { "formula": "NH3" }, "2x": { "formula": "CH2O" } } }"""));
        Assert.Equal("compounds.O2", ex.Field);
        Assert.Contains("(rename 'O2' → 'o2', 'CO2' → 'co2', 'NH3' → 'nh3', '2x' → 'c_2x', and the same ids wherever the file names them)", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("""{ "compounds": { "x": { "formula": "CH1.8Xe0.5" } } }""", "compounds.x.formula", "unknown element 'Xe'")]
    [InlineData("""{ "compounds": { "o2": { "formula": "O2" }, "o2": { "formula": "O2" } } }""", "compounds.o2", "duplicate key")]
    [InlineData("""{ "compounds": { "o2": { "formula": "O2", "formula": "O3" } } }""", "compounds.o2.formula", "duplicate key")]
    [InlineData("""{ "name": "a", "name": "b", "compounds": { "o2": { "formula": "O2" } } }""", "name", "duplicate key")]
    [InlineData("""{ "compounds": { "O2": { "formula": "O2" } } }""", "compounds.O2", "lower case")]
    [InlineData("""{ "compounds": { "o2": { "formula": "O2", "role": "oxidant" } } }""", "compounds.o2.role", "'oxidant' is not a role")]
    [InlineData("""{ "compounds": { "o2": { "formula": "O2", "colour": "blue" } } }""", "compounds.o2.colour", "unknown key")]
    [InlineData("""{ "compounds": { "o2": { "role": "oxygen" } } }""", "compounds.o2.formula", "missing")]
    [InlineData("""{ "compounds": { "x": { "formula": "CH2O", "role": "biomass", "ashFraction": 1.5 } } }""", "compounds.x.ashFraction", "outside [0, 1)")]
    [InlineData("""{ "compounds": { "x": { "formula": "CH2O", "ashFraction": 0.1 } } }""", "compounds.x.ashFraction", "only a compound with role")]
    [InlineData("""{ "compounds": { "x": { "formula": "CH2O", "molarMass": -3 } } }""", "compounds.x.molarMass", "molar mass")]
    [InlineData("""{ "compounds": { "x": { "formula": "CH2O" } }, "balances": ["C", "electrons"] }""", "balances[1]", "'electrons' is not a balance")]
    [InlineData("""{ "compounds": { "x": { "formula": "CH2O" } }, "balances": ["C", "S"] }""", "balances[1]", "no compound contains S")]
    [InlineData("""{ "compounds": { "x": { "formula": "CH2O" } }, "balances": ["C", "C"] }""", "balances[1]", "listed twice")]
    [InlineData("""{ "compounds": { } }""", "compounds", "empty")]
    [InlineData("""{ "name": "no compounds" }""", "compounds", "missing")]
    [InlineData("""{ "compounds": { "x": { "formula": "CH2O" } """, "model", "not valid JSON")]
    public void Parse_bad_model_names_the_field(string json, string field, string expected)
    {
        var ex = Assert.Throws<ModelFormatException>(() => ModelReader.Parse(json));

        Assert.Equal(field, ex.Field);
        Assert.StartsWith(field + ": ", ex.Message, StringComparison.Ordinal);
        Assert.Contains(expected, ex.Message, StringComparison.Ordinal);
        Assert.False(ModelReader.TryParse(json, out _, out string? error));
        Assert.Equal(ex.Message, error);
    }

    [Fact]
    public void Parse_ignores_keys_of_other_readers_at_the_top_level()
    {
        // The flux model extends the same file with its own top-level keys.
        var model = ModelReader.Parse("""{ "compounds": { "x": { "formula": "CH2O" } }, "reactions": [ { "any": 1 } ] }""");
        Assert.Single(model.Compounds);
        Assert.Equal(Balance.Of(Element.C), model.Balances[0]);
    }
}
