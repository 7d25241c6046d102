using System.CommandLine;
using System.Globalization;
using SoftSensor.Core.Stoichiometry;
using SoftSensor.Daemon.Cli.Balance;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor balance</c>: elemental balances of a model file for one set of measured rates and
/// specifications; reconciles redundant measurements, tests them (χ²), diagnoses a failed test and
/// reports carbon and electron recovery (docs/methods.md §2; docs/balance.md).
/// </summary>
internal sealed class BalanceVerb : IVerb
{
    public Command Build()
    {
        var model = new Option<string>("--model") { Description = "model file (JSON: compounds with formulas and roles, optional balances)", Required = true };
        var measure = new Option<string[]>("--measure")
        {
            Description = "measured rate ID=VALUE[:SIGMA] in mmol/(L·h) (C-mmol for organics), production > 0; SIGMA absolute, or N% relative; repeat per compound",
            Required = true,
        };
        var specify = new Option<string[]>("--specify") { Description = "known relation: " + SpecificationArgument.Forms + "; repeatable" };
        var alpha = new Option<double?>("--alpha") { Description = "significance level of the consistency test (default 0.05)" };
        var json = new Option<bool>("--json") { Description = "print one JSON document instead of tables" };
        var cmd = new Command("balance", "Solve, reconcile and test the elemental balances of a model for measured rates.")
        {
            model, measure, specify, alpha, json,
        };
        cmd.SetAction(parse => Run(
            parse.GetValue(model)!, parse.GetValue(measure) ?? [], parse.GetValue(specify) ?? [], parse.GetValue(alpha), parse.GetValue(json),
            Console.Out, Console.Error));
        return cmd;
    }

    internal static int Run(string modelPath, string[] measures, string[] specifies, double? alpha, bool json, TextWriter output, TextWriter error)
    {
        double a = alpha ?? 0.05;
        if (!(a > 0 && a < 1))
        {
            return CliOutput.BadInput(error, $"--alpha is {a.ToString(CultureInfo.InvariantCulture)}: expected a significance level above 0 and below 1, e.g. 0.05");
        }

        if (!File.Exists(modelPath))
        {
            return CliOutput.BadInput(error, $"--model is '{modelPath}': no such file");
        }

        if (!ModelReader.TryParse(File.ReadAllText(modelPath), out var model, out string? modelError))
        {
            return CliOutput.BadInput(error, $"--model '{modelPath}': {modelError}");
        }

        if (!TryReadArguments(model!, measures, specifies, out var measurements, out var specifications, out string? argError))
        {
            return CliOutput.BadInput(error, argError!);
        }

        if (!BalanceSolver.TryCreate(model!, measurements.Select(m => m.Id).ToArray(), specifications, new BalanceSolverOptions { Alpha = a }, out var solver, out string? setupError))
        {
            return CliOutput.BadInput(error, setupError!);
        }

        int n = solver!.CompoundIds.Count, count = measurements.Count;
        var q = measurements.Select(m => m.Value).ToArray();
        var psi = new double[count * count];
        for (int i = 0; i < count; i++)
        {
            psi[(i * count) + i] = measurements[i].Sigma * measurements[i].Sigma;
        }

        var rates = new double[n];
        var sigmas = new double[n];
        var outcome = solver.Solve(q, psi, rates, sigmas);
        if (!outcome.HasRates)
        {
            error.WriteLine("error: the residual covariance is singular: give the redundant measurements sigmas above 0 (--measure ID=VALUE:SIGMA)");
            return ExitCodes.Failure;
        }

        var hypotheses = new HypothesisOutcome[solver.Hypotheses.Count];
        DiagnosisSummary? diagnosis = outcome.Consistent ? null : solver.Diagnose(q, psi, hypotheses);
        var report = BalanceReport.Build(solver, measurements, outcome, rates, sigmas, diagnosis, hypotheses);
        if (json)
        {
            CliOutput.WriteJson(output, report);
        }
        else
        {
            BalanceText.Write(output, report);
        }

        return ExitCodes.Ok;
    }

    private static bool TryReadArguments(
        StoichiometricModel model,
        string[] measures,
        string[] specifies,
        out List<MeasurementArgument> measurements,
        out List<Specification> specifications,
        out string? error)
    {
        measurements = [];
        specifications = [];
        string known = string.Join(", ", model.Compounds.Select(c => c.Id));
        foreach (string text in measures)
        {
            if (!MeasurementArgument.TryParse(text, out var m, out error))
            {
                return false;
            }

            if (!model.TryGet(m.Id, out _))
            {
                error = $"--measure '{text}': '{m.Id}' names no compound of model '{model.Name}' (compounds: {known})";
                return false;
            }

            if (measurements.Any(x => x.Id == m.Id))
            {
                error = $"--measure '{text}': '{m.Id}' is measured twice";
                return false;
            }

            measurements.Add(m);
        }

        foreach (string text in specifies)
        {
            if (!SpecificationArgument.TryParse(text, model, out var s, out error))
            {
                return false;
            }

            specifications.Add(s);
        }

        error = null;
        return true;
    }
}
