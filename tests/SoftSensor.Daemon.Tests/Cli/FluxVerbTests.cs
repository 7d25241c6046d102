using System.Text.Json;
using SoftSensor.Daemon.Cli;
using SoftSensor.Daemon.Cli.Flux;

namespace SoftSensor.Daemon.Tests.Cli;

/// <summary>The flux verb end to end on the shipped example networks (files in config/models).</summary>
public sealed class FluxVerbTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("flux-verb-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static string ModelPath(string file)
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "SoftSensor.sln")))
        {
            dir = dir.Parent;
        }

        return Path.Combine(dir!.FullName, "config", "models", file);
    }

    private static (int Code, string Out, string Err) Run(string model, bool json, double? biomass, params string[] basis)
    {
        using var o = new StringWriter();
        using var e = new StringWriter();
        int code = FluxCommand.Run(new FluxArguments(model, basis, biomass, json), o, e);
        return (code, o.ToString(), e.ToString());
    }

    [Fact]
    public void Run_json_on_glycerol_bacterium_prints_every_field_and_closes_the_balance()
    {
        var (code, output, err) = Run(ModelPath("glycerol-bacterium.json"), true, 10.0, "biomass=114");
        Assert.Equal(0, code);
        Assert.Equal(string.Empty, err);
        using var doc = JsonDocument.Parse(output);
        var root = doc.RootElement;
        Assert.Equal("determined", root.GetProperty("status").GetString());
        Assert.Equal(1, root.GetProperty("extraEquations").GetInt32());
        Assert.Equal(0, root.GetProperty("undetermined").GetArrayLength());
        Assert.Equal("C3H8O3", root.GetProperty("formulas").GetProperty("glycerol").GetString());
        Assert.Equal(114.0, root.GetProperty("exchange").GetProperty("biomass").GetDouble(), 9);
        Assert.True(root.GetProperty("exchange").GetProperty("o2").GetDouble() < 0);
        Assert.Equal(114.0, root.GetProperty("fluxes").GetProperty("biomassSynthesis").GetDouble(), 9);
        foreach (var c in root.GetProperty("consistency").EnumerateObject())
        {
            Assert.InRange(c.Value.GetDouble(), -1e-9, 1e-9);
        }

        // Through the elemental-balance engine with the file's balances (C, gamma, N): 3 dof, h about 0.
        var test = root.GetProperty("balanceTest");
        Assert.True(test.GetProperty("consistent").GetBoolean());
        Assert.Equal(3, test.GetProperty("dof").GetInt32());
        Assert.True(test.GetProperty("h").GetDouble() < 1e-12);
    }

    [Fact]
    public void Run_text_on_yeast_prints_tables_with_two_extra_equations()
    {
        var (code, output, _) = Run(ModelPath("sucrose-yeast-anaerobic.json"), false, 5.0, "sucrose=-500");
        Assert.Equal(0, code);
        Assert.Contains("extra equations over the black-box balance: 2", output, StringComparison.Ordinal);
        Assert.Contains("ethanol", output, StringComparison.Ordinal);
        Assert.Contains("undetermined: none", output, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("biomass", "--basis 'biomass': expected ID=VALUE")]
    [InlineData("mu=0.2", "'mu' is neither a compound")]
    [InlineData("biomass=fast", "'fast' is not a finite number")]
    public void Run_with_bad_basis_writes_one_line_and_exits_2(string basis, string expected)
    {
        var (code, output, err) = Run(ModelPath("glycerol-bacterium.json"), true, 10.0, basis);
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Equal(string.Empty, output);
        Assert.Single(err.TrimEnd('\n').Split('\n'));
        Assert.Contains(expected, err, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_without_biomass_for_a_model_with_maintenance_exits_2_naming_the_option()
    {
        var (code, _, err) = Run(ModelPath("glycerol-bacterium.json"), true, null, "biomass=114");
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.StartsWith("error: --biomass-g-per-l: missing", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_with_reaction_parse_error_exits_2_naming_side_term_and_column()
    {
        string file = Path.Combine(_dir, "bad.json");
        File.WriteAllText(file, """
            { "compounds": { "glucose": { "formula": "C6H12O6", "role": "substrate" }, "co2": { "formula": "CO2", "role": "carbonDioxide" } },
              "reactions": { "r1": "glucose -> 6 co2 + 2 ethanol" } }
            """);
        var (code, _, err) = Run(file, false, null, "r1=1");
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("reactions.r1: right side, term 2 at column 22: unknown species 'ethanol'", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_on_unbalanced_network_exits_1_and_names_the_reaction()
    {
        string file = Path.Combine(_dir, "unbalanced.json");
        File.WriteAllText(file, """
            { "compounds": { "glucose": { "formula": "C6H12O6", "role": "substrate" }, "ethanol": { "formula": "C2H6O", "role": "product" },
                             "co2": { "formula": "CO2", "role": "carbonDioxide" } },
              "reactions": { "fermentation": "glucose -> 2 ethanol + co2" } }
            """);
        var (code, output, _) = Run(file, true, null, "glucose=-6");
        Assert.Equal(ExitCodes.Failure, code);
        using var doc = JsonDocument.Parse(output);
        var imbalance = doc.RootElement.GetProperty("imbalances")[0];
        Assert.Equal("fermentation", imbalance.GetProperty("reaction").GetString());
        Assert.Equal("C", imbalance.GetProperty("element").GetString());
        Assert.Equal(-1.0, imbalance.GetProperty("excess").GetDouble(), 12);
    }

    [Fact]
    public void Root_command_knows_the_flux_verb()
    {
        var parse = VerbCatalog.BuildRoot().Parse(["flux", "--model", "m.json", "--basis", "biomass=1", "--json"]);
        Assert.Empty(parse.Errors);
    }
}
