using System.Text.Json;
using SoftSensor.Core.Stoichiometry;
using SoftSensor.Daemon.Cli;

namespace SoftSensor.Daemon.Tests.Cli;

/// <summary><c>softsensor balance</c> end to end on the shipped model files (config/models).</summary>
public class BalanceVerbTests
{
    private static readonly string ModelsDir = FindModels();

    private static string Model(string file) => Path.Combine(ModelsDir, file);

    private static string FindModels()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !Directory.Exists(Path.Combine(dir.FullName, "config", "models")))
        {
            dir = dir.Parent;
        }

        return Path.Combine(dir?.FullName ?? throw new DirectoryNotFoundException("config/models not found above " + AppContext.BaseDirectory), "config", "models");
    }

    private static (int Code, string Out, string Err) Run(string model, string[] measures, string[]? specifies = null, double? alpha = null, bool json = true)
    {
        using var o = new StringWriter();
        using var e = new StringWriter();
        int code = BalanceVerb.Run(model, measures, specifies ?? [], alpha, json, o, e);
        return (code, o.ToString(), e.ToString());
    }

    [Fact]
    public void Run_glucose_with_mass_yield_prints_the_METHODS_rates_as_json()
    {
        // docs/methods.md §6: Y_XS 0.5 g/g -> biomass 0.6096, CO2 0.3904, O2 0.3599, NH3 0.1219, H2O 0.6342 per C-mol glucose.
        var (code, stdout, stderr) = Run(Model("balance-glucose-aerobic.json"), ["glucose=-1:1%"], ["massyield:biomass/glucose=0.5"]);

        Assert.Equal(0, code);
        Assert.Empty(stderr);
        using var doc = JsonDocument.Parse(stdout);
        var root = doc.RootElement;
        var rates = root.GetProperty("rates");
        Assert.Equal(0.6096, rates.GetProperty("biomass").GetDouble(), 4);
        Assert.Equal(0.3904, rates.GetProperty("co2").GetDouble(), 4);
        Assert.Equal(-0.3599, rates.GetProperty("o2").GetDouble(), 4);
        Assert.Equal(-0.1219, rates.GetProperty("nh3").GetDouble(), 4);
        Assert.Equal(0.6342, rates.GetProperty("h2o").GetDouble(), 4);
        Assert.Equal(0.01 * 0.6096, root.GetProperty("sigmas").GetProperty("biomass").GetDouble(), 4);
        Assert.Equal(2, root.GetProperty("dof").GetInt32());
        Assert.Equal(JsonValueKind.Null, root.GetProperty("test").ValueKind);
        Assert.Equal(0, root.GetProperty("diagnosis").GetArrayLength());
        Assert.Equal(5, root.GetProperty("calculable").GetArrayLength());
        Assert.Equal(0, root.GetProperty("notCalculable").GetArrayLength());
        Assert.Equal(JsonValueKind.Null, root.GetProperty("recovery").GetProperty("carbon").ValueKind);
    }

    [Fact]
    public void Run_rq_specification_gives_the_same_rates_as_the_yield()
    {
        // RQ 1.085 (docs/methods.md §6) as the specification instead of the yield.
        var (code, stdout, _) = Run(Model("balance-glucose-aerobic.json"), ["glucose=-1"], ["rq=1.0847"]);

        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(stdout);
        Assert.Equal(0.6096, doc.RootElement.GetProperty("rates").GetProperty("biomass").GetDouble(), 3);
    }

    [Fact]
    public void Run_demo_glycerol_with_wrong_oxygen_fails_the_test_and_names_oxygen()
    {
        // Invented demo rates (C-mmol or mmol per L and h) that close C, gamma and N for biomass 20
        // on glycerol 40: co2 = 20, nh3 = -4, o2 = -(4.667(40) - 4.2(20))/4 = -25.667; O2 read 30 % high.
        var (code, stdout, _) = Run(
            Model("balance-bacterium-glycerol.json"),
            ["glycerol=-40:2%", "o2=-33.4:2%", "co2=20:2%", "biomass=20:2%", "nh3=-4:2%"]);

        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(stdout);
        var root = doc.RootElement;
        var test = root.GetProperty("test");
        Assert.False(test.GetProperty("consistent").GetBoolean());
        Assert.Equal(3, test.GetProperty("dof").GetInt32());
        Assert.Equal(7.81, test.GetProperty("critical").GetDouble(), 2); // χ² 3 dof 95 % (NIST/SEMATECH e-Handbook)
        var passing = root.GetProperty("diagnosis").EnumerateArray()
            .Where(h => h.GetProperty("consistent").ValueKind == JsonValueKind.True)
            .Select(h => h.GetProperty("hypothesis").GetString())
            .ToList();
        Assert.Equal(["o2 measurement in error"], passing);
        Assert.Contains("o2 measurement in error", root.GetProperty("verdict").GetString(), StringComparison.Ordinal);
        Assert.InRange(root.GetProperty("recovery").GetProperty("electrons").GetDouble(), 1.05, 1.2);
    }

    [Fact]
    public void Run_underdetermined_set_reports_what_would_fix_it()
    {
        var (code, stdout, _) = Run(Model("balance-bacterium-glycerol.json"), ["glycerol=-40"], json: false);

        Assert.Equal(0, code);
        Assert.Contains("not calculable", stdout, StringComparison.Ordinal);
        // C, gamma, N over glycerol, O2, CO2, NH3, biomass: rank 3, so 5 - 3 = 2 degrees of freedom; one
        // measured leaves one open. Water is in none of these balances (docs/methods.md §2.2) and is reported apart.
        Assert.Contains("1 more independent measurement(s) or specification(s) needed", stdout, StringComparison.Ordinal);
        Assert.Contains("outside      h2o", stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_human_output_shows_tables_of_rates_test_and_diagnosis()
    {
        var (code, stdout, _) = Run(
            Model("balance-bacterium-glycerol.json"),
            ["glycerol=-40:2%", "o2=-33.4:2%", "co2=20:2%", "biomass=20:2%", "nh3=-4:2%"],
            json: false);

        Assert.Equal(0, code);
        Assert.Contains("compound        measured     sigma    result      sigma   source", stdout, StringComparison.Ordinal);
        Assert.Contains("FAILS", stdout, StringComparison.Ordinal);
        Assert.Contains("o2 measurement in error", stdout, StringComparison.Ordinal);
        Assert.Contains("acetate missing from the model", stdout, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(new[] { "ethanol=1" }, null, null, "--measure 'ethanol=1': 'ethanol' names no compound")]
    [InlineData(new[] { "o2=-1:-0.1" }, null, null, "--measure 'o2=-1:-0.1': sigma -0.1 is negative")]
    [InlineData(new[] { "o2=abc" }, null, null, "--measure 'o2=abc': value 'abc' is not a finite number")]
    [InlineData(new[] { "o2" }, null, null, "--measure 'o2': expected ID=VALUE[:SIGMA]")]
    [InlineData(new[] { "o2=-1", "o2=-2" }, null, null, "--measure 'o2=-2': 'o2' is measured twice")]
    [InlineData(new[] { "o2=-1" }, "share:biomass/glycerol=0.5", null, "--specify 'share:biomass/glycerol=0.5': 'share' is not a kind")]
    [InlineData(new[] { "o2=-1" }, "yield:cells/glycerol=0.5", null, "--specify 'yield:cells/glycerol=0.5': 'cells' names no compound")]
    [InlineData(new[] { "o2=-1" }, null, 1.5, "--alpha is 1.5")]
    public void Run_bad_arguments_print_one_line_naming_the_flag_and_exit_2(string[] measures, string? specify, double? alpha, string expected)
    {
        var (code, stdout, stderr) = Run(Model("balance-bacterium-glycerol.json"), measures, specify is null ? null : [specify], alpha);

        Assert.Equal(2, code);
        Assert.Empty(stdout);
        Assert.StartsWith("error: " + expected, stderr, StringComparison.Ordinal);
        Assert.Single(stderr.TrimEnd().Split('\n'));
    }

    [Fact]
    public void Run_bad_model_file_names_the_field_and_exits_2()
    {
        string path = Path.Combine(Path.GetTempPath(), $"balance-bad-{Guid.NewGuid():N}.json");
        File.WriteAllText(path, """{ "compounds": { "o2": { "formula": "O2" }, "o2": { "formula": "O3" } } }""");
        try
        {
            var (code, _, stderr) = Run(path, ["o2=-1"]);
            Assert.Equal(2, code);
            Assert.Contains("compounds.o2: duplicate key", stderr, StringComparison.Ordinal);
        }
        finally
        {
            File.Delete(path);
        }

        var missing = Run("/nonexistent/model.json", ["o2=-1"]);
        Assert.Equal(2, missing.Code);
        Assert.Contains("--model is '/nonexistent/model.json': no such file", missing.Err, StringComparison.Ordinal);
    }

    [Fact]
    public void Shipped_balance_models_all_parse()
    {
        var files = Directory.GetFiles(ModelsDir, "balance-*.json");
        Assert.NotEmpty(files);
        foreach (string f in files)
        {
            Assert.True(ModelReader.TryParse(File.ReadAllText(f), out var model, out string? error), $"{f}: {error}");
            Assert.True(model!.TryGet("biomass", out _), f);
        }
    }

    [Fact]
    public void Root_command_parses_the_balance_options()
    {
        var parse = VerbCatalog.BuildRoot().Parse(["balance", "--model", "m.json", "--measure", "o2=-1", "--measure", "co2=1:5%", "--specify", "rq=1", "--alpha", "0.01", "--json"]);
        Assert.Empty(parse.Errors);
    }
}
