using SoftSensor.Core.Chemistry;

namespace SoftSensor.Core.Tests.Chemistry;

public class FormulaTests
{
    // Degrees of reduction per C-mol with NH3, H2O and CO2 as references: Roels 1983 (Energetics
    // and Kinetics in Biotechnology, table 2.1) and Villadsen, Nielsen & Liden 2011 (Bioreaction
    // Engineering Principles, 3rd ed., table 3.1): biomass CH1.8O0.5N0.2 4.2, glucose 4,
    // glycerol 14/3 = 4.667, ethanol 6, methanol 6, O2 -4; CO2, H2O, NH3 0.
    [Theory]
    [InlineData("CH1.8O0.5N0.2", 4.2)]
    [InlineData("C6H12O6", 4.0)]
    [InlineData("C3H8O3", 14.0 / 3.0)]
    [InlineData("C2H6O", 6.0)]
    [InlineData("CH4O", 6.0)]
    [InlineData("C2H4O2", 4.0)]
    [InlineData("CO2", 0.0)]
    [InlineData("H2O", 0.0)]
    [InlineData("NH3", 0.0)]
    public void DegreeOfReduction_per_C_mol_matches_Roels(string text, double expected)
    {
        var f = Formula.Parse(text).PerCMol();
        Assert.Equal(expected, f.DegreeOfReduction, 12);
    }

    [Fact]
    public void DegreeOfReduction_of_oxygen_is_minus_four()
    {
        // Roels 1983: gamma(O2) = -4 per mol.
        Assert.Equal(-4.0, Formula.Parse("O2").DegreeOfReduction, 12);
    }

    [Fact]
    public void DegreeOfReduction_counts_charge()
    {
        // NH4+: -3 + 4 - 1 = 0 (Villadsen, Nielsen & Liden 2011, ch. 3: ammonium is a reference like NH3).
        Assert.Equal(0.0, Formula.Parse("NH4+").DegreeOfReduction, 12);
    }

    [Fact]
    public void MolarMass_of_standard_biomass_is_about_24_6_g_per_C_mol()
    {
        // docs/methods.md §2.1 and Villadsen, Nielsen & Liden 2011, ch. 3: CH1.8O0.5N0.2 about 24.6 g/C-mol.
        // With IUPAC 2021 conventional atomic weights: 12.011 + 1.8*1.008 + 0.5*15.999 + 0.2*14.007 = 24.6263.
        var f = Formula.Parse("CH1.8O0.5N0.2");
        Assert.Equal(24.6263, f.MolarMassGPerMol, 4);
        Assert.InRange(f.MolarMassUncertaintyGPerMol, 1e-4, 2e-3);
    }

    [Fact]
    public void MolarMass_of_glucose_matches_the_handbook_value()
    {
        // CRC Handbook of Chemistry and Physics: glucose 180.156 g/mol (from memory; recomputed
        // from IUPAC 2021 conventional weights: 6*12.011 + 12*1.008 + 6*15.999 = 180.156).
        Assert.Equal(180.156, Formula.Parse("C6H12O6").MolarMassGPerMol, 3);
    }

    [Fact]
    public void PerCMol_normalises_glucose_to_CH2O()
    {
        var f = Formula.Parse("C6H12O6").PerCMol();
        Assert.Equal(1.0, f[Element.C]);
        Assert.Equal(2.0, f[Element.H], 12);
        Assert.Equal(1.0, f[Element.O], 12);
        Assert.Equal("CH2O", f.Render());
    }

    [Fact]
    public void Repeated_elements_are_summed()
    {
        var f = Formula.Parse("C2H5OH");
        Assert.Equal(6.0, f[Element.H]);
        Assert.Equal(Formula.Parse("C2H6O"), f);
    }

    [Theory]
    [InlineData("CH1.8X0.5", 6, "unknown element 'X'")]
    [InlineData("ch2o", 1, "capital letter")]
    [InlineData("C1..8", 3, "malformed number")]
    [InlineData("CH0O", 2, "must be positive")]
    [InlineData("+C", 1, "charge needs elements")]
    [InlineData("C H4", 2, "unexpected character ' '")]
    [InlineData("Cl2", 1, "unknown element 'Cl'")]
    public void Malformed_formula_names_the_formula_and_the_position(string text, int position1, string reason)
    {
        var e = Assert.Throws<FormulaFormatException>(() => Formula.Parse(text));
        Assert.Contains($"'{text}'", e.Message, StringComparison.Ordinal);
        Assert.Contains($"position {position1}", e.Message, StringComparison.Ordinal);
        Assert.Contains(reason, e.Message, StringComparison.Ordinal);
    }
}
