using SoftSensor.Core.Chemistry;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Daemon.Cli.Balance;

/// <summary>The --json document of <c>softsensor balance</c> (docs/balance.md).</summary>
internal sealed record BalanceReport
{
    public required string Model { get; init; }

    public required IReadOnlyList<string> Balances { get; init; }

    public required IReadOnlyList<string> Specifications { get; init; }

    /// <summary>solved, partlyDetermined, covarianceNotPositiveDefinite.</summary>
    public required string Status { get; init; }

    /// <summary>Reconciled measured and calculated rates, keyed by compound id (null: not calculable).</summary>
    public required IReadOnlyDictionary<string, double?> Rates { get; init; }

    public required IReadOnlyDictionary<string, double?> Sigmas { get; init; }

    public required IReadOnlyDictionary<string, MeasuredEntry> Measured { get; init; }

    public required int Rank { get; init; }

    /// <summary>Degrees of freedom of the balances: compounds - rank(E).</summary>
    public required int Dof { get; init; }

    public required int Redundancy { get; init; }

    public required TestEntry? Test { get; init; }

    public required string Verdict { get; init; }

    public required IReadOnlyList<HypothesisEntry> Diagnosis { get; init; }

    public required IReadOnlyList<string> Calculable { get; init; }

    public required IReadOnlyList<string> NotCalculable { get; init; }

    public required string? Advice { get; init; }

    /// <summary>Compounds that no chosen balance contains (not calculable, not in <see cref="Rates"/>).</summary>
    public required IReadOnlyList<string> OutsideBalances { get; init; }

    public required RecoveryEntry Recovery { get; init; }

    internal sealed record MeasuredEntry(double Value, double Sigma, bool SigmaAssumed, double? Reconciled);

    internal sealed record TestEntry(double H, int Dof, double Critical, double Alpha, bool Consistent);

    internal sealed record HypothesisEntry(string Hypothesis, double? H, int Dof, double? Critical, bool? Consistent, double? SuspectRate);

    /// <summary>Carbon and electron recovery of the measured rates as given (1 = closed).</summary>
    internal sealed record RecoveryEntry(double? Carbon, double? Electrons);

    public static BalanceReport Build(
        BalanceSolver solver,
        IReadOnlyList<MeasurementArgument> measurements,
        BalanceOutcome outcome,
        double[] rates,
        double[] sigmas,
        DiagnosisSummary? diagnosis,
        HypothesisOutcome[] hypotheses)
    {
        var ids = solver.CompoundIds;
        var measured = new Dictionary<string, MeasuredEntry>(StringComparer.Ordinal);
        foreach (var m in measurements)
        {
            int j = IndexOf(ids, m.Id);
            measured[m.Id] = new MeasuredEntry(m.Value, m.Sigma, m.SigmaAssumed, outcome.HasRates ? CliOutput.Finite(rates[j]) : null);
        }

        var compounds = measurements.Select(m => solver.Model[m.Id]).ToArray();
        var raw = measurements.Select(m => m.Value).ToArray();
        return new BalanceReport
        {
            Model = solver.Model.Name,
            Balances = solver.Model.Balances.Select(b => b.Name).ToArray(),
            Specifications = solver.Specifications.Select(s => s.ToString()).ToArray(),
            Status = ReportNames.Camel(outcome.Status.ToString()),
            Rates = ids.Select((id, j) => (id, v: outcome.HasRates ? CliOutput.Finite(rates[j]) : null)).ToDictionary(t => t.id, t => t.v, StringComparer.Ordinal),
            Sigmas = ids.Select((id, j) => (id, v: outcome.HasRates ? CliOutput.Finite(sigmas[j]) : null)).ToDictionary(t => t.id, t => t.v, StringComparer.Ordinal),
            Measured = measured,
            Rank = solver.Analysis.ElementMatrixRank,
            Dof = solver.Analysis.DegreesOfFreedom,
            Redundancy = solver.Analysis.Redundancy,
            Test = outcome.HasTest ? new TestEntry(outcome.H, outcome.Dof, outcome.Critical, solver.Options.Alpha, outcome.Consistent) : null,
            Verdict = diagnosis is { Verdict: DiagnosisVerdict.Isolated, IsolatedIndex: int k }
                ? $"inconsistent: the hypothesis '{solver.Hypotheses[k].Description}' alone explains the error"
                : ReportNames.Verdict(diagnosis?.Verdict ?? (outcome.HasTest ? DiagnosisVerdict.NotNeeded : DiagnosisVerdict.NotTestable)),
            Diagnosis = diagnosis is null
                ? []
                : solver.Hypotheses.Select((h, i) => new HypothesisEntry(
                    h.Description,
                    hypotheses[i].Testable ? CliOutput.Finite(hypotheses[i].H) : null,
                    hypotheses[i].Dof,
                    CliOutput.Finite(hypotheses[i].Critical),
                    hypotheses[i].Testable ? hypotheses[i].Consistent : null,
                    CliOutput.Finite(hypotheses[i].SuspectRate))).ToArray(),
            Calculable = solver.Analysis.Calculable,
            NotCalculable = solver.Analysis.NotCalculable,
            Advice = solver.Analysis.IsDetermined ? null : solver.Analysis.Advice,
            OutsideBalances = solver.Analysis.OutsideBalances,
            Recovery = new RecoveryEntry(
                CliOutput.Finite(Core.Stoichiometry.Recovery.Of(Core.Stoichiometry.Balance.Of(Element.C), compounds, raw)),
                CliOutput.Finite(Core.Stoichiometry.Recovery.Of(Core.Stoichiometry.Balance.DegreeOfReduction, compounds, raw))),
        };
    }

    private static int IndexOf(IReadOnlyList<string> ids, string id)
    {
        for (int i = 0; i < ids.Count; i++)
        {
            if (ids[i] == id)
            {
                return i;
            }
        }

        return -1;
    }
}
