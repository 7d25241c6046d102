namespace SoftSensor.Daemon.Tests.Cli;

/// <summary>Every malformed flag: one line on stderr naming the flag, the value and the expectation; exit code 2; nothing on stdout.</summary>
public class OffgasVerbBadInputTests
{
    private static readonly string[] Valid = ["offgas", "--air", "10", "--outlet-o2", "19.5", "--outlet-co2", "1.5", "--volume", "10"];

    private static string[] With(string flag, string? value) => With(Valid, flag, value);

    private static string[] With(string[] baseArgs, string flag, string? value)
    {
        var args = new List<string>(baseArgs);
        int i = args.IndexOf(flag);
        if (i >= 0)
        {
            args.RemoveRange(i, 2);
        }

        args.Add(flag);
        if (value is not null)
        {
            args.Add(value);
        }

        return [.. args];
    }

    private static void AssertBadInput(string[] args, params string[] mustContain)
    {
        var (code, output, error) = CliRunner.Run(args);
        Assert.Equal(2, code);
        Assert.Empty(output);
        var lines = error.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Single(lines);
        Assert.StartsWith("error: ", lines[0], StringComparison.Ordinal);
        foreach (var part in mustContain)
        {
            Assert.Contains(part, lines[0], StringComparison.Ordinal);
        }
    }

    [Theory]
    [InlineData("--volume", "-3", "expected a liquid volume in L above 0")]
    [InlineData("--volume", "0", "above 0")]
    [InlineData("--outlet-o2", "abc", "expected a percentage")]
    [InlineData("--outlet-o2", "120", "expected a percentage")]
    [InlineData("--outlet-co2", "NaN", "expected a percentage")]
    [InlineData("--air", "-1", "expected a flow in NL/min")]
    [InlineData("--o2", "1,5", "expected a flow in NL/min")]
    [InlineData("--ref-temp", "-300", "above -273.15")]
    [InlineData("--ref-pressure", "0", "above 0")]
    [InlineData("--inlet-o2", "101", "expected a percentage")]
    [InlineData("--inlet-co2", "x", "expected a percentage")]
    [InlineData("--analyser-basis", "wet", "expected dry or saturated")]
    [InlineData("--o2-accuracy", "-0.1", "0 or more")]
    [InlineData("--co2-accuracy", "Infinity", "0 or more")]
    [InlineData("--flow-accuracy", "one", "0 or more")]
    [InlineData("--min-aeration", "-2", "0 or more")]
    [InlineData("--humidity", "100", "expected a percentage")]
    public void Offgas_malformed_value_names_flag_value_and_expectation(string flag, string value, string expectation)
    {
        AssertBadInput(With(flag, value), flag, "'" + value + "'", expectation);
    }

    [Theory]
    [InlineData("--outlet-o2")]
    [InlineData("--outlet-co2")]
    [InlineData("--volume")]
    public void Offgas_missing_required_flag_names_it(string flag)
    {
        var args = new List<string>(Valid);
        args.RemoveRange(args.IndexOf(flag), 2);
        AssertBadInput([.. args], flag, "missing");
    }

    [Fact]
    public void Offgas_without_any_gas_flow_is_bad_input()
    {
        AssertBadInput(["offgas", "--outlet-o2", "19.5", "--outlet-co2", "1.5", "--volume", "10"], "--air", "no gas flow");
    }

    [Fact]
    public void Offgas_saturated_without_analyser_temp_is_bad_input()
    {
        AssertBadInput(With("--analyser-basis", "saturated"), "--analyser-temp", "missing");
    }

    [Fact]
    public void Offgas_saturated_above_boiling_is_bad_input()
    {
        AssertBadInput(With(With("--analyser-basis", "saturated"), "--analyser-temp", "105"), "--analyser-temp", "'105'", "boils");
    }

    [Fact]
    public void Offgas_analyser_temp_on_dry_basis_is_bad_input()
    {
        AssertBadInput(With("--analyser-temp", "30"), "--analyser-temp", "only used with --analyser-basis saturated");
    }

    [Fact]
    public void Offgas_analyser_temp_with_humidity_is_bad_input()
    {
        AssertBadInput(With(With("--humidity", "4"), "--analyser-temp", "30"), "--analyser-temp", "only used with --analyser-basis saturated");
    }

    [Fact]
    public void Offgas_humidity_with_analyser_basis_is_bad_input()
    {
        AssertBadInput(With(With("--humidity", "4"), "--analyser-basis", "dry"), "--humidity", "not both");
    }

    [Fact]
    public void Offgas_outlet_fractions_summing_over_100_percent_is_bad_input()
    {
        AssertBadInput(With(With("--outlet-o2", "60"), "--outlet-co2", "45"), "--outlet-o2", "below 100 %");
    }

    [Fact]
    public void Offgas_flag_without_value_is_bad_input()
    {
        AssertBadInput([.. Valid[..^2], "--volume"], "--volume");
    }
}
