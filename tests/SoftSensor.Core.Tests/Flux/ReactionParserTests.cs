using SoftSensor.Core.Flux;

namespace SoftSensor.Core.Tests.Flux;

public class ReactionParserTests
{
    private static readonly HashSet<string> Species = ["glc", "pyr", "NADH", "ATP", "co2", "o2", "h2o"];

    private static bool Parameter(string name, out double value)
    {
        value = 2.5;
        return name == "PO";
    }

    private static Reaction Parse(string eq) => ReactionParser.Parse("r", eq, Species.Contains, Parameter);

    [Fact]
    public void Parse_reads_decimal_fraction_and_parameter_coefficients()
    {
        var r = Parse("glc + 2 ATP -> 2 pyr + 0.5 NADH + 1/3 co2 + {PO} h2o");
        Assert.False(r.Reversible);
        Assert.Equal(-1.0, r.CoefficientOf("glc"));
        Assert.Equal(-2.0, r.CoefficientOf("ATP"));
        Assert.Equal(2.0, r.CoefficientOf("pyr"));
        Assert.Equal(0.5, r.CoefficientOf("NADH"));
        Assert.Equal(1.0 / 3.0, r.CoefficientOf("co2"), 15);
        Assert.Equal(2.5, r.CoefficientOf("h2o"));
    }

    [Fact]
    public void Parse_reversible_with_empty_side_and_netted_species()
    {
        var r = Parse("ATP + glc <=> glc");
        Assert.True(r.Reversible);
        Assert.Equal(-1.0, r.CoefficientOf("ATP"));
        Assert.Equal(0.0, r.CoefficientOf("glc"));
        Assert.Single(r.Terms);
        Assert.Single(Parse("ATP ->").Terms);
    }

    [Theory]
    [InlineData("glc pyr", "has no arrow")]
    [InlineData("glc -> pyr -> co2", "second arrow")]
    [InlineData("glc -> 2 pyr + xyz", "right side, term 2 at column 16: unknown species 'xyz'")]
    [InlineData("two glc -> pyr", "left side, term 1 at column 1: 'two' is not a coefficient")]
    [InlineData("glc + -> pyr", "left side, term 2 at column 6 is empty")]
    [InlineData("glc -> {PX} pyr", "unknown parameter 'PX'")]
    [InlineData("0 glc -> pyr", "must be positive")]
    [InlineData("glc ->", "")]
    public void Parse_rejects_bad_equations_naming_side_term_and_column(string eq, string expected)
    {
        if (expected.Length == 0)
        {
            Assert.Single(Parse(eq).Terms);
            return;
        }

        var ex = Assert.Throws<FluxModelException>(() => Parse(eq));
        Assert.StartsWith("reactions.r: ", ex.Message, StringComparison.Ordinal);
        Assert.Contains(expected, ex.Message, StringComparison.Ordinal);
    }
}
