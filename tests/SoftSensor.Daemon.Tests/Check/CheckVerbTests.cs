using System.Text.Json;
using SoftSensor.Daemon.Cli;
using SoftSensor.Daemon.Hosting;

namespace SoftSensor.Daemon.Tests.Check;

/// <summary>
/// <c>softsensor check</c> on the shipped daemon configurations and on deliberately broken ones.
/// Structure figures: element matrix of CH1.8O0.5N0.2 biomass, glycerol, O2, CO2, NH3, H2O in C,
/// degree-of-reduction and N balances (Roels 1983, Energetics and Kinetics in Biotechnology, ch. 3;
/// degrees of reduction C 4, H 1, O −2, N −3 with NH3 as reference: glycerol 14/3 per C-mol, biomass 4.2; from memory).
/// </summary>
public class CheckVerbTests
{
    private static readonly string Root = FindRoot();
    private static readonly string CheckFolder = Path.Combine(Root, "tests", "SoftSensor.Daemon.Tests", "Check");

    [Fact]
    public void Check_each_shipped_daemon_configuration_exits_zero()
    {
        var daemonConfigs = Directory.GetFiles(Path.Combine(Root, "config"), "*.json")
            .Where(IsDaemonConfiguration).ToList();
        foreach (var file in daemonConfigs)
        {
            var (code, output, error) = Run(file, json: false);
            Assert.True(code == ExitCodes.Ok, $"{file}: exit {code}: {error}");
            Assert.Contains("verdict  usable", output, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Check_valid_reactor_with_model_and_alarms_prints_structure_and_exits_zero()
    {
        var (code, output, error) = Run(Path.Combine(CheckFolder, "valid", "glycerol-reactor.json"), json: true);

        Assert.True(code == ExitCodes.Ok, error);
        using var doc = JsonDocument.Parse(output);
        var reactor = doc.RootElement.GetProperty("reactors")[0];
        var model = reactor.GetProperty("model");
        // 5 compounds in the balances (water is in none of C, gamma, N), rank 3: 2 degrees of freedom (Roels 1983).
        Assert.Equal(3, model.GetProperty("rank").GetInt32());
        Assert.Equal(2, model.GetProperty("degreesOfFreedom").GetInt32());
        var compounds = model.GetProperty("compounds").EnumerateArray().Select(c => c.GetString()).ToList();
        var gamma = model.GetProperty("elementMatrix")[1].EnumerateArray().Select(v => v.GetDouble()).ToList();
        Assert.Equal(14.0 / 3.0, gamma[compounds.IndexOf("glycerol")], 1e-9);
        Assert.Equal(-4.0, gamma[compounds.IndexOf("o2")], 1e-12);
        Assert.Equal(4.2, gamma[compounds.IndexOf("biomass")], 1e-12);
        var measured = model.GetProperty("measured").EnumerateArray().Select(m => m.GetProperty("compound").GetString()).ToList();
        Assert.Equal(["o2", "co2", "glycerol"], measured);
        var calculable = model.GetProperty("calculable").EnumerateArray().Select(c => c.GetString()).ToList();
        Assert.Equal(["nh3", "biomass"], calculable);
        // Redundancy = measured − degrees of freedom = 3 − 2 = 1
        // (van der Heijden et al. 1994, Biotechnol. Bioeng. 43); with one relation all three measurements take part in it.
        Assert.Equal(1, model.GetProperty("redundancy").GetInt32());
        Assert.Equal(3, model.GetProperty("redundantMeasurements").GetArrayLength());
        Assert.Equal(7, reactor.GetProperty("tags").GetArrayLength());
        Assert.True(doc.RootElement.GetProperty("alarmRules").GetArrayLength() > 0);
    }

    [Fact]
    public void Check_broken_configuration_lists_every_problem_and_exits_two()
    {
        var (code, output, error) = Run(Path.Combine(CheckFolder, "broken", "unusable.json"), json: true);

        Assert.Equal(ExitCodes.BadInput, code);
        using var doc = JsonDocument.Parse(output);
        Assert.False(doc.RootElement.GetProperty("usable").GetBoolean());
        var problems = doc.RootElement.GetProperty("problems").EnumerateArray().Select(p => p.GetString()!).ToList();
        void Has(string a, string b) => Assert.Contains(problems, p => p.Contains(a, StringComparison.Ordinal) && p.Contains(b, StringComparison.Ordinal));

        Has("reactors:0:tags:R1.OFFGAS.O2:role", "'OffgasOxygen'");                // unknown role
        Has("reactors:0:tags:R1.TEMP:unit", "a unit of pressure");               // unit mismatch
        Has("reactors:0:tags:R1.PRESSURE:unit", "'furlong'");                     // unit that is no unit of pressure
        Has("reactors:0:modelFile", "under-determined");                          // under-determined model
        Has("reactors:1:modelFile", "no such file");                              // missing model file
        Has("alarm rule 'biomass_high'", "unknown estimate");                     // alarm on an unknown estimate
        Has("alarm rule 'level_high'", "'tag:R9.LEVEL', a tag no reactor maps"); // alarm on an unknown tag
        Has("reactors:0:tags", "no tag with role OutletO2Percent");               // the daemon's own validator
        Assert.Equal(8, problems.Count);
        Assert.Equal(problems.Count, error.Trim().Split('\n').Length); // one line per problem on stderr
        Assert.DoesNotContain(problems, p => p.Contains("rq_high", StringComparison.Ordinal));
    }

    [Fact]
    public void Check_missing_configuration_file_exits_two_with_one_line()
    {
        var (code, _, error) = Run(Path.Combine(CheckFolder, "broken", "absent.json"), json: false);

        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("does not exist", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_configuration_that_is_no_json_exits_two_naming_the_file()
    {
        string file = Path.Combine(Path.GetTempPath(), $"check-{Guid.NewGuid():N}.json");
        File.WriteAllText(file, "{ \"site\": ");
        try
        {
            var (code, _, error) = Run(file, json: false);
            Assert.Equal(ExitCodes.BadInput, code);
            Assert.Contains(file + ": line 1, position", error, StringComparison.Ordinal);
        }
        finally
        {
            File.Delete(file);
        }
    }

    private static (int Code, string Output, string Error) Run(string file, bool json)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        var settings = new DaemonHostSettings { ConfigFile = file, SystemFolder = Path.Combine(Path.GetTempPath(), "softsensor-check-no-system-folder") };
        int code = CheckVerb.Run(settings, json, output, error);
        return (code, output.ToString(), error.ToString());
    }

    private static bool IsDaemonConfiguration(string file)
    {
        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllText(file), new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
            return doc.RootElement.ValueKind == JsonValueKind.Object && doc.RootElement.TryGetProperty("reactors", out _);
        }
        catch (JsonException)
        {
            return false;
        }
    }

    private static string FindRoot()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "SoftSensor.sln")))
        {
            d = d.Parent;
        }

        return d?.FullName ?? throw new DirectoryNotFoundException("SoftSensor.sln not found above " + AppContext.BaseDirectory);
    }
}
