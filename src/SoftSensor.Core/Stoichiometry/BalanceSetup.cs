using System.Globalization;

namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// Checks a choice of measurements and specifications against a model and decides the columns of the
/// balance: every compound that is not a candidate, plus candidates that are measured or specified.
/// </summary>
internal sealed class BalanceSetup
{
    private BalanceSetup(StoichiometricModel model, BalanceSolverOptions options, IReadOnlyList<string> measured, IReadOnlyList<Specification> specifications)
    {
        Model = model;
        Options = options;
        MeasuredIds = measured;
        Specifications = specifications;
        var named = measured.Concat(specifications.SelectMany(s => new[] { s.Numerator, s.Denominator })).ToHashSet(StringComparer.Ordinal);
        // A compound that no balance contains (water under C, gamma, N) can never be calculated:
        // it stays out of the columns unless measured or specified, and is reported apart.
        bool InBalances(Compound c) => model.Balances.Any(b => b.CoefficientOf(c) != 0);
        Columns = model.Compounds.Where(c => named.Contains(c.Id) || (c.Role != CompoundRole.Candidate && InBalances(c))).ToArray();
        OutsideBalances = model.Compounds.Where(c => !named.Contains(c.Id) && c.Role != CompoundRole.Candidate && !InBalances(c)).ToArray();
        Candidates = model.Compounds.Where(c => c.Role == CompoundRole.Candidate && !named.Contains(c.Id)).ToArray();
        var ids = Columns.Select(c => c.Id).ToList();
        MeasuredColumns = measured.Select(id => ids.IndexOf(id)).ToArray();
    }

    public StoichiometricModel Model { get; }

    public BalanceSolverOptions Options { get; }

    public IReadOnlyList<string> MeasuredIds { get; }

    public IReadOnlyList<Specification> Specifications { get; }

    public Compound[] Columns { get; }

    public Compound[] Candidates { get; }

    public Compound[] OutsideBalances { get; }

    public int[] MeasuredColumns { get; }

    public static bool TryCreate(
        StoichiometricModel model,
        IReadOnlyList<string> measured,
        IReadOnlyList<Specification> specifications,
        BalanceSolverOptions options,
        out BalanceSetup? setup,
        out string? error)
    {
        setup = null;
        error = Validate(model, measured, specifications, options);
        if (error is not null)
        {
            return false;
        }

        setup = new BalanceSetup(model, options, [.. measured], [.. specifications]);
        return true;
    }

    /// <summary>Rows: the balances over <paramref name="columns"/>, then one row per specification.</summary>
    public double[,] ConstraintMatrix(IReadOnlyList<Compound> columns)
    {
        var e = Model.ElementMatrix(columns);
        int b = e.GetLength(0);
        var a = new double[b + Specifications.Count, columns.Count];
        for (int i = 0; i < b; i++)
        {
            for (int j = 0; j < columns.Count; j++)
            {
                a[i, j] = e[i, j];
            }
        }

        for (int s = 0; s < Specifications.Count; s++)
        {
            var spec = Specifications[s];
            for (int j = 0; j < columns.Count; j++)
            {
                if (columns[j].Id == spec.Numerator)
                {
                    a[b + s, j] += spec.NumeratorCoefficient;
                }

                if (columns[j].Id == spec.Denominator)
                {
                    a[b + s, j] += spec.DenominatorCoefficient;
                }
            }
        }

        return a;
    }

    /// <summary>
    /// Per column of <see cref="ConstraintMatrix"/> the σ of its entries from the compound's
    /// <see cref="Compound.Uncertainty"/> (null when exact); specification rows are exact (docs/model-uncertainty.md).
    /// </summary>
    public double[]?[] RowSigmas(IReadOnlyList<Compound> columns)
    {
        int rows = Model.Balances.Count + Specifications.Count;
        var result = new double[]?[columns.Count];
        for (int j = 0; j < columns.Count; j++)
        {
            var u = columns[j].Uncertainty;
            if (u.IsNone)
            {
                continue;
            }

            var sg = new double[rows];
            for (int i = 0; i < Model.Balances.Count; i++)
            {
                sg[i] = u.OfBalance(Model.Balances[i]);
            }

            result[j] = sg;
        }

        return result;
    }

    private static string? Validate(StoichiometricModel model, IReadOnlyList<string> measured, IReadOnlyList<Specification> specifications, BalanceSolverOptions options)
    {
        string known = string.Join(", ", model.Compounds.Select(c => c.Id));
        if (!(options.Alpha > 0 && options.Alpha < 1))
        {
            return $"alpha: {options.Alpha.ToString(CultureInfo.InvariantCulture)} is outside (0, 1); give the significance level, e.g. 0.05";
        }

        if (!(options.RankTolerance > 0 && options.RankTolerance < 1e-3))
        {
            return $"rankTolerance: {options.RankTolerance.ToString(CultureInfo.InvariantCulture)} is outside (0, 1e-3)";
        }

        if (measured.Count == 0)
        {
            return "measured: no measured rate given; at least one rate (e.g. the substrate uptake or the OUR) is the basis";
        }

        var seen = new HashSet<string>(StringComparer.Ordinal);
        for (int i = 0; i < measured.Count; i++)
        {
            if (!model.TryGet(measured[i], out _))
            {
                return $"measured[{i}]: '{measured[i]}' names no compound of model '{model.Name}' (compounds: {known})";
            }

            if (!seen.Add(measured[i]))
            {
                return $"measured[{i}]: '{measured[i]}' is measured twice";
            }
        }

        for (int i = 0; i < specifications.Count; i++)
        {
            var s = specifications[i];
            foreach (string id in new[] { s.Numerator, s.Denominator })
            {
                if (!model.TryGet(id, out _))
                {
                    return $"specifications[{i}] ({s}): '{id}' names no compound of model '{model.Name}' (compounds: {known})";
                }
            }

            if (s.Numerator == s.Denominator)
            {
                return $"specifications[{i}] ({s}): numerator and denominator are the same compound";
            }

            if (!double.IsFinite(s.Value))
            {
                return $"specifications[{i}] ({s}): the value must be a finite number";
            }
        }

        return null;
    }
}
