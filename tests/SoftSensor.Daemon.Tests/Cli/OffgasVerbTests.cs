using System.Text.Json;

namespace SoftSensor.Daemon.Tests.Cli;

public class OffgasVerbTests
{
    // The hand-worked case of docs/methods.md §6 (inert balance, recomputed twice independently):
    // 10.0 NL/min dry air at 0 °C/101.325 kPa, 10 L, inlet 20.946 % O2 / 0.042 % CO2, dry outlet
    // 19.500 % / 1.500 % -> OTR 38.629, CTR 39.035 mmol/(L h), RQ 1.0105; outlet flow 10.0015 NL/min.
    private static readonly string[] HandCase =
        ["offgas", "--air", "10", "--inlet-o2", "20.946", "--inlet-co2", "0.042", "--outlet-o2", "19.5", "--outlet-co2", "1.5", "--volume", "10"];

    private static JsonElement Json(string output) => JsonDocument.Parse(output).RootElement;

    [Fact]
    public void Offgas_hand_case_json_gives_published_rates_and_good_quality()
    {
        var (code, output, error) = CliRunner.Run([.. HandCase, "--json"]);

        Assert.Equal(0, code);
        Assert.Empty(error);
        var root = Json(output);
        Assert.Equal(38.629, root.GetProperty("our").GetDouble(), 0.0005);
        Assert.Equal(39.035, root.GetProperty("cer").GetDouble(), 0.0005);
        Assert.Equal(1.0105, root.GetProperty("rq").GetDouble(), 0.00005);
        Assert.Equal(10.0015, root.GetProperty("outletFlow").GetDouble(), 0.00005);
        Assert.Equal("good", root.GetProperty("quality").GetProperty("level").GetString());
        Assert.Equal(0, root.GetProperty("quality").GetProperty("reasons").GetArrayLength());
        Assert.False(root.TryGetProperty("ourSigma", out _));
    }

    [Fact]
    public void Offgas_with_accuracies_json_adds_sigmas_and_covariance()
    {
        var (code, output, _) = CliRunner.Run([.. HandCase, "--o2-accuracy", "0.02", "--co2-accuracy", "0.02", "--flow-accuracy", "1", "--json"]);

        Assert.Equal(0, code);
        var root = Json(output);
        double ourSigma = root.GetProperty("ourSigma").GetDouble();
        double cerSigma = root.GetProperty("cerSigma").GetDouble();
        Assert.True(ourSigma > 0 && cerSigma > 0 && root.GetProperty("rqSigma").GetDouble() > 0);
        var cov = root.GetProperty("covariance");
        Assert.Equal(ourSigma * ourSigma, cov.GetProperty("ourOur").GetDouble(), 1e-9);
        Assert.Equal(cerSigma * cerSigma, cov.GetProperty("cerCer").GetDouble(), 1e-9);
    }

    [Fact]
    public void Offgas_saturated_basis_recovers_dry_answer()
    {
        // Off-gas of the hand case saturated in a 30 °C cell at 101.325 kPa: y_H2O = 4.2467/101.325
        // = 0.041912 (IAPWS-IF97 region 4), read O2 = 19.5 * 0.958088 = 18.6827 %, CO2 1.43713 %.
        var (code, output, _) = CliRunner.Run(
            "offgas", "--air", "10", "--inlet-o2", "20.946", "--inlet-co2", "0.042", "--outlet-o2", "18.682725", "--outlet-co2", "1.437133",
            "--analyser-basis", "saturated", "--analyser-temp", "30", "--analyser-pressure", "101.325", "--volume", "10", "--json");

        Assert.Equal(0, code);
        var root = Json(output);
        Assert.Equal(38.629, root.GetProperty("our").GetDouble(), 0.0005);
        Assert.Equal(39.035, root.GetProperty("cer").GetDouble(), 0.0005);
        Assert.Equal("saturated", root.GetProperty("outlet").GetProperty("basis").GetString());
    }

    [Fact]
    public void Offgas_measured_humidity_recovers_dry_answer()
    {
        // As above with the water content given directly: 4.1912 % H2O (p_sat(30 °C)/101.325 kPa, IAPWS-IF97).
        var (code, output, _) = CliRunner.Run(
            "offgas", "--air", "10", "--inlet-o2", "20.946", "--inlet-co2", "0.042", "--outlet-o2", "18.682725", "--outlet-co2", "1.437133",
            "--humidity", "4.19116", "--volume", "10", "--json");

        Assert.Equal(0, code);
        var root = Json(output);
        Assert.Equal(38.629, root.GetProperty("our").GetDouble(), 0.0005);
        Assert.Equal("measured-humidity", root.GetProperty("outlet").GetProperty("basis").GetString());
    }

    [Fact]
    public void Offgas_human_output_is_a_table_with_units()
    {
        var (code, output, _) = CliRunner.Run(HandCase);

        Assert.Equal(0, code);
        var lines = output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.StartsWith("OUR", lines[0], StringComparison.Ordinal);
        Assert.Contains("38.629", lines[0], StringComparison.Ordinal);
        Assert.Contains("mmol/(L·h)", lines[0], StringComparison.Ordinal);
        Assert.Contains("1.0105", lines[2], StringComparison.Ordinal);
        Assert.Contains(lines, l => l.StartsWith("quality", StringComparison.Ordinal) && l.Contains("good", StringComparison.Ordinal));
    }

    [Fact]
    public void Offgas_below_minimum_aeration_reports_bad_quality_with_reason_and_exits_0()
    {
        var (code, output, _) = CliRunner.Run([.. HandCase, "--min-aeration", "20", "--json"]);

        Assert.Equal(0, code);
        var quality = Json(output).GetProperty("quality");
        Assert.Equal("bad", quality.GetProperty("level").GetString());
        Assert.Equal("aeration-below-minimum", quality.GetProperty("reasons")[0].GetString());
    }

    [Fact]
    public void Offgas_zero_uptake_gives_null_rq_and_reason()
    {
        var (code, output, _) = CliRunner.Run(
            "offgas", "--air", "10", "--outlet-o2", "20.9476", "--outlet-co2", "0.042", "--volume", "10", "--json");

        Assert.Equal(0, code);
        var root = Json(output);
        Assert.Equal(0.0, root.GetProperty("our").GetDouble(), 1e-9);
        Assert.Equal(JsonValueKind.Null, root.GetProperty("rq").ValueKind);
        Assert.Equal("rq-undefined", root.GetProperty("quality").GetProperty("reasons")[0].GetString());
    }
}
