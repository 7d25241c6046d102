using System.Globalization;
using SoftSensor.Core.Flux;

namespace SoftSensor.Daemon.Cli.Flux;

/// <summary>
/// Runs the flux verb: reads the model, checks the options, solves, prints. Exit codes: 0 solved
/// (possibly with undetermined fluxes, listed); 1 the network is not elementally balanced, its
/// rates fail the elemental-balance test, or the basis values contradict it (the output says which); 2 bad input (one line on stderr).
/// </summary>
internal static class FluxCommand
{
    public static int Run(FluxArguments args, TextWriter output, TextWriter error)
    {
        if (!File.Exists(args.ModelFile))
        {
            return CliOutput.BadInput(error, $"--model: file '{args.ModelFile}' does not exist (expected a JSON model file)");
        }

        FluxNetwork network;
        try
        {
            network = FluxNetwork.Load(File.ReadAllText(args.ModelFile));
        }
        catch (FluxModelException ex)
        {
            return CliOutput.BadInput(error, $"--model '{args.ModelFile}': {ex.Message}");
        }

        var ids = new List<string>();
        var values = new List<double>();
        foreach (string token in args.Basis)
        {
            if (!TryParseBasis(token, network.Model, out string? id, out double value, out string? problem))
            {
                return CliOutput.BadInput(error, $"--basis '{token}': {problem}");
            }

            if (ids.Contains(id!))
            {
                return CliOutput.BadInput(error, $"--basis '{token}': '{id}' is given twice");
            }

            ids.Add(id!);
            values.Add(value);
        }

        double x = double.NaN;
        if (args.BiomassGPerL is { } g)
        {
            if (!(double.IsFinite(g) && g >= 0) || network.Model.Biomass is null)
            {
                return CliOutput.BadInput(error, network.Model.Biomass is null
                    ? "--biomass-g-per-l: the model has no compound with role biomass"
                    : $"--biomass-g-per-l '{g.ToString(CultureInfo.InvariantCulture)}': expected a finite dry weight >= 0 in g/L");
            }

            x = network.Model.BiomassCmmolPerL(g);
        }
        else if (network.Model.Maintenance is { AtpMmolPerCmmolBiomassPerH: > 0 })
        {
            return CliOutput.BadInput(error, "--biomass-g-per-l: missing; the model has a maintenance demand (m_ATP * X), give the biomass dry weight in g/L");
        }

        var solver = new FluxSolver(network, ids);
        var solution = solver.Solve([.. values], x);
        var report = FluxReport.From(network, solver, solution, values, args.BiomassGPerL);
        if (args.Json)
        {
            CliOutput.WriteJson(output, report);
        }
        else
        {
            FluxText.Write(output, report);
        }

        bool failed = report.Imbalances.Count > 0 || solution.Status == FluxSolveStatus.Inconsistent
            || (solution.Status == FluxSolveStatus.Determined && !report.BalanceTest.Consistent);
        return failed ? ExitCodes.Failure : ExitCodes.Ok;
    }

    private static bool TryParseBasis(string token, FluxModel model, out string? id, out double value, out string? problem)
    {
        id = null;
        value = double.NaN;
        int eq = token.IndexOf('=', StringComparison.Ordinal);
        if (eq <= 0)
        {
            problem = "expected ID=VALUE, e.g. biomass=50";
            return false;
        }

        id = token[..eq].Trim();
        string text = token[(eq + 1)..].Trim();
        if (model.CompoundIndex(id) < 0 && model.ReactionIndex(id) < 0)
        {
            problem = $"'{id}' is neither a compound ({string.Join(", ", model.Compounds.Select(c => c.Id))}) nor a reaction of the model";
            return false;
        }

        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out value) || !double.IsFinite(value))
        {
            problem = $"'{text}' is not a finite number (use '.' as decimal point)";
            return false;
        }

        problem = null;
        return true;
    }
}
