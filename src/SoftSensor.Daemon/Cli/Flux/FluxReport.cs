using SoftSensor.Core.Flux;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Daemon.Cli.Flux;

/// <summary>One imbalanced reaction in the report.</summary>
internal sealed record FluxImbalanceRow(string Reaction, string Element, double Excess);

/// <summary>The predicted rates through the elemental-balance engine: its χ² test over the model's balances.</summary>
internal sealed record FluxBalanceTest(IReadOnlyList<string> Balances, string Status, double? H, int Dof, double? Critical, bool Consistent);

/// <summary>What the flux verb prints (the JSON document; the text output shows the same).</summary>
internal sealed record FluxReport(
    string Model,
    string Status,
    IReadOnlyDictionary<string, double> Basis,
    double? BiomassGPerL,
    IReadOnlyDictionary<string, string> Units,
    IReadOnlyDictionary<string, double?> Exchange,
    IReadOnlyDictionary<string, string> Formulas,
    IReadOnlyDictionary<string, double?> Fluxes,
    int ExtraEquations,
    IReadOnlyList<string> Undetermined,
    IReadOnlyDictionary<string, double?> Consistency,
    IReadOnlyList<FluxImbalanceRow> Imbalances,
    FluxBalanceTest BalanceTest,
    double? Rq,
    int DirectionViolations,
    double? ConstraintResidual)
{
    public static FluxReport From(FluxNetwork network, FluxSolver solver, FluxSolution s, IReadOnlyList<double> basisValues, double? biomassGPerL)
    {
        var model = network.Model;
        var basis = new Dictionary<string, double>(StringComparer.Ordinal);
        for (int i = 0; i < solver.Basis.Count; i++)
        {
            basis[solver.Basis[i]] = basisValues[i];
        }

        var exchange = new Dictionary<string, double?>(StringComparer.Ordinal);
        var formulas = new Dictionary<string, string>(StringComparer.Ordinal);
        var units = new Dictionary<string, string>(StringComparer.Ordinal);
        for (int j = 0; j < model.Compounds.Count; j++)
        {
            var c = model.Compounds[j];
            exchange[c.Id] = CliOutput.Finite(s.Exchange[j]);
            formulas[c.Id] = c.Formula.Text;
            units[c.Id] = c.RateUnit();
        }

        var fluxes = new Dictionary<string, double?>(StringComparer.Ordinal);
        for (int k = 0; k < model.Reactions.Count; k++)
        {
            fluxes[model.Reactions[k].Id] = CliOutput.Finite(s.Fluxes[k]);
        }

        var consistency = new Dictionary<string, double?>(StringComparer.Ordinal);
        var labels = network.ClosureLabels;
        for (int e = 0; e < labels.Count; e++)
        {
            consistency[labels[e]] = CliOutput.Finite(s.Closure[e]);
        }

        double? rq = null;
        var o2 = model.Compounds.FirstOrDefault(c => c.Role == CompoundRole.Oxygen);
        var co2 = model.Compounds.FirstOrDefault(c => c.Role == CompoundRole.CarbonDioxide);
        if (o2 is not null && co2 is not null)
        {
            rq = CliOutput.Finite(s.Exchange[model.CompoundIndex(co2.Id)] / -s.Exchange[model.CompoundIndex(o2.Id)]);
        }

        return new FluxReport(
            model.Name,
            StatusName(s.Status),
            basis,
            biomassGPerL,
            units,
            exchange,
            formulas,
            fluxes,
            network.ExtraEquations,
            solver.Undetermined,
            consistency,
            [.. network.Imbalances.Select(i => new FluxImbalanceRow(i.Reaction, i.Element, i.Excess))],
            BalanceTestOf(network, s),
            rq,
            s.DirectionViolations,
            CliOutput.Finite(s.ConstraintResidual));
    }

    private static FluxBalanceTest BalanceTestOf(FluxNetwork network, FluxSolution s)
    {
        var check = new BalanceCrossCheck(network);
        var o = check.Check(s);
        return new FluxBalanceTest(check.Balances, Camel(o.Status.ToString()), CliOutput.Finite(o.H), o.Dof, CliOutput.Finite(o.Critical), o.HasRates && o.Consistent);
    }

    private static string StatusName(FluxSolveStatus status) => Camel(status.ToString());

    private static string Camel(string t)
    {
        return char.ToLowerInvariant(t[0]) + t[1..];
    }
}
