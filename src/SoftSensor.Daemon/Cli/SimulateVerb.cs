using System.CommandLine;
using System.Globalization;
using SoftSensor.Simulation.Output;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Cli;

/// <summary><c>softsensor simulate</c>: runs a virtual fed-batch scenario and writes history.csv, truth.csv and offline.csv.</summary>
internal sealed class SimulateVerb : IVerb
{
    public Command Build()
    {
        var scenario = new Option<string>("--scenario") { Description = "scenario file (JSON, see docs/simulator.md)", Required = true };
        var outDir = new Option<string>("--out") { Description = "output folder for history.csv, truth.csv, offline.csv", Required = true };
        var seed = new Option<int?>("--seed") { Description = "seed of instrument errors and noise (default: the scenario's seed)" };
        var hours = new Option<double?>("--hours") { Description = "hours to simulate (default: the scenario's duration_h)" };
        var json = new Option<bool>("--json") { Description = "print one JSON document instead of text" };
        var cmd = new Command("simulate", "Run the virtual fed-batch reactor and write what a historian would record, plus the truth.")
        {
            scenario, outDir, seed, hours, json,
        };
        cmd.SetAction(parse => Run(
            parse.GetValue(scenario)!, parse.GetValue(outDir)!, parse.GetValue(seed), parse.GetValue(hours), parse.GetValue(json),
            Console.Out, Console.Error));
        return cmd;
    }

    internal static int Run(string scenarioPath, string outDir, int? seed, double? hours, bool json, TextWriter output, TextWriter error)
    {
        if (hours is { } h && !(h > 0 && h <= 1000))
        {
            return CliOutput.BadInput(error, $"--hours is {h.ToString(CultureInfo.InvariantCulture)}: expected a number of hours above 0 and at most 1000");
        }

        if (!File.Exists(scenarioPath))
        {
            return CliOutput.BadInput(error, $"--scenario is '{scenarioPath}': no such file");
        }

        Scenario scenario;
        try
        {
            scenario = ScenarioLoader.Load(scenarioPath);
        }
        catch (ScenarioException e)
        {
            return CliOutput.BadInput(error, e.Message);
        }

        SimulationSummary summary;
        try
        {
            summary = SimulationRun.Run(scenario, seed ?? scenario.Seed, hours, outDir);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            error.WriteLine($"error: --out is '{outDir}': cannot write ({e.Message})");
            return ExitCodes.Failure;
        }

        if (json)
        {
            CliOutput.WriteJson(output, summary);
        }
        else
        {
            var c = CultureInfo.InvariantCulture;
            output.WriteLine(string.Create(c, $"scenario {summary.Scenario}, seed {summary.Seed}: {summary.HoursSimulated:0.##} h, {summary.Rows} rows"));
            output.WriteLine(string.Create(c, $"  final biomass  {summary.FinalBiomassGPerL:0.00} g/L"));
            output.WriteLine(string.Create(c, $"  final volume   {summary.FinalVolumeL:0.00} L"));
            output.WriteLine(string.Create(c, $"  max OUR        {summary.MaxOurMmolPerLh:0.0} mmol/(L·h)   max CER {summary.MaxCerMmolPerLh:0.0} mmol/(L·h)"));
            output.WriteLine(string.Create(c, $"  carbon recovery {summary.FinalCarbonRecovery:0.0000}, offline samples {summary.OfflineSamples}"));
            output.WriteLine($"  wrote {summary.HistoryPath}, {summary.TruthPath}, {summary.OfflinePath}");
        }

        return ExitCodes.Ok;
    }
}
