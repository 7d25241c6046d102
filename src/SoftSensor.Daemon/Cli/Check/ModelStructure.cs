using SoftSensor.Core.Signals;
using SoftSensor.Core.Stoichiometry;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Cli.Check;

/// <summary>
/// Structure of a reactor's black-box model with the rates its tag map measures (docs/methods.md §2.3-2.4:
/// rank of the element matrix, degrees of freedom, calculability and redundancy after van der Heijden
/// et al. 1994, Biotechnol. Bioeng. 43). Measured: oxygen from OUR and carbon dioxide from CER (the
/// off-gas analyser tags), the substrate from the feed (a feed-rate tag).
/// </summary>
internal static class ModelStructure
{
    public static ModelCheck? Run(string key, string path, ReactorOptions reactor, List<string> problems)
    {
        if (!File.Exists(path))
        {
            problems.Add($"{key} is '{path}': no such file (expected a model file, e.g. config/models/balance-bacterium-glycerol.json)");
            return null;
        }

        if (!ModelReader.TryParse(File.ReadAllText(path), out var model, out string? error))
        {
            problems.Add($"{key} '{path}': {error}");
            return null;
        }

        var measured = Measured(model!, reactor);
        var ids = measured.Select(m => m.Compound).ToList();
        if (!BalanceSolver.TryCreate(model!, ids, [], null, out var solver, out error))
        {
            problems.Add($"{key} '{path}': {error}");
            return null;
        }

        var a = solver!.Analysis;
        var compounds = solver.Compounds;
        var e = model!.ElementMatrix(compounds);
        var rows = Enumerable.Range(0, e.GetLength(0))
            .Select(i => (IReadOnlyList<double>)[.. Enumerable.Range(0, e.GetLength(1)).Select(j => e[i, j])]).ToList();

        // Water drops out of the C, degree-of-reduction and N balances (docs/methods.md §2.2): its rate is never needed.
        var open = a.NotCalculable.Where(id => model[id].Role != CompoundRole.Water).ToList();
        if (open.Count > 0)
        {
            string from = ids.Count == 0 ? "no measured rate" : "measured " + string.Join(", ", measured.Select(m => $"{m.Compound} (from {m.From})"));
            problems.Add($"{key} '{path}': model '{model.Name}' is under-determined with {from}: rates of {string.Join(", ", open)} are not calculable (expected every rate but water calculable; {a.Advice})");
        }

        var redundant = ids.Where(id => IsRedundant(model, ids, id)).ToList();
        return new ModelCheck(path, model.Name, [.. model.Balances.Select(b => b.Name)], [.. solver.CompoundIds], rows,
            a.ElementMatrixRank, a.DegreesOfFreedom, measured, a.Calculable, a.NotCalculable, a.Redundancy, redundant);
    }

    /// <summary>The compounds whose rate the tag map provides.</summary>
    public static IReadOnlyList<MeasuredRate> Measured(StoichiometricModel model, ReactorOptions reactor)
    {
        var roles = reactor.Tags.Values
            .Select(t => Enum.TryParse<SignalRole>(t.Role, ignoreCase: true, out var r) ? r : (SignalRole?)null)
            .Where(r => r is not null).Select(r => r!.Value).ToHashSet();
        var result = new List<MeasuredRate>();
        void Add(CompoundRole role, SignalRole needs, string from)
        {
            if (roles.Contains(needs) && model.Compounds.FirstOrDefault(c => c.Role == role) is { } c)
            {
                result.Add(new MeasuredRate(c.Id, from));
            }
        }

        Add(CompoundRole.Oxygen, SignalRole.OutletO2Percent, "OUR");
        Add(CompoundRole.CarbonDioxide, SignalRole.OutletCo2Percent, "CER");
        Add(CompoundRole.Substrate, SignalRole.FeedRateLPerH, "feed");
        return result;
    }

    /// <summary>A measurement is redundant when the balances calculate its rate from the other measurements.</summary>
    private static bool IsRedundant(StoichiometricModel model, List<string> ids, string id) =>
        BalanceSolver.TryCreate(model, [.. ids.Where(x => x != id)], [], null, out var without, out _)
        && without!.Analysis.Calculable.Contains(id);
}
