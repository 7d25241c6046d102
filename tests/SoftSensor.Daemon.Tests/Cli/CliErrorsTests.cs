using SoftSensor.Daemon.Cli;

namespace SoftSensor.Daemon.Tests.Cli;

/// <summary>A mistyped verb or flag gets the nearest one; no verb gets the list of verbs.</summary>
public sealed class CliErrorsTests
{
    [Fact]
    public void A_mistyped_verb_is_answered_with_the_nearest_verb()
    {
        var (code, _, error) = CliRunner.Run("offgass", "--air", "10");
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("'offgass'", error, StringComparison.Ordinal);
        Assert.Contains("(did you mean 'offgas'?)", error, StringComparison.Ordinal);
        Assert.Single(error.TrimEnd().Split('\n'));
    }

    [Fact]
    public void A_mistyped_flag_is_answered_with_the_nearest_flag_of_that_verb()
    {
        var (code, _, error) = CliRunner.Run("demo", "--sped", "600");
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("(did you mean '--speed'?)", error, StringComparison.Ordinal);
    }

    [Fact]
    public void No_verb_lists_the_verbs()
    {
        var (code, _, error) = CliRunner.Run();
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("no verb given", error, StringComparison.Ordinal);
        foreach (var verb in new[] { "balance", "batch", "check", "demo", "flux", "offgas", "replay", "run", "sample", "simulate" })
        {
            Assert.Contains(verb, error, StringComparison.Ordinal);
        }
    }

    [Theory]
    [InlineData("offgass", "offgas", 1)]   // Levenshtein 1966: one insertion
    [InlineData("kitten", "sitting", 3)]   // the textbook example: two substitutions, one insertion
    [InlineData("", "abc", 3)]
    public void Distance_is_the_Levenshtein_distance(string a, string b, int d) => Assert.Equal(d, CliErrors.Distance(a, b));

    [Fact]
    public void Nearest_offers_nothing_for_a_word_far_from_every_candidate() =>
        Assert.Null(CliErrors.Nearest("xyzzy", ["offgas", "balance", "demo"]));
}
