namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// A black-box model: compounds with formulas and roles, and the balances that hold over them
/// (docs/methods.md §2.1-2.2). Immutable. Read one with <see cref="ModelReader"/>.
/// </summary>
public sealed class StoichiometricModel
{
    private readonly Dictionary<string, int> _index;

    /// <summary>Creates a model; ids must be distinct and at least one balance given.</summary>
    public StoichiometricModel(string name, IReadOnlyList<Compound> compounds, IReadOnlyList<Balance> balances)
    {
        ArgumentNullException.ThrowIfNull(compounds);
        ArgumentNullException.ThrowIfNull(balances);
        if (balances.Count == 0)
        {
            throw new ArgumentException("a model needs at least one balance", nameof(balances));
        }

        _index = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int i = 0; i < compounds.Count; i++)
        {
            if (!_index.TryAdd(compounds[i].Id, i))
            {
                throw new ArgumentException($"compound id '{compounds[i].Id}' appears twice", nameof(compounds));
            }
        }

        Name = name;
        Compounds = compounds;
        Balances = balances;
    }

    /// <summary>Descriptive name of the model.</summary>
    public string Name { get; }

    /// <summary>All compounds, candidates included, in file order.</summary>
    public IReadOnlyList<Compound> Compounds { get; }

    /// <summary>The balances (rows of the element matrix).</summary>
    public IReadOnlyList<Balance> Balances { get; }

    /// <summary>Finds a compound by id.</summary>
    public bool TryGet(string id, out Compound compound)
    {
        if (_index.TryGetValue(id, out int i))
        {
            compound = Compounds[i];
            return true;
        }

        compound = null!;
        return false;
    }

    /// <summary>The compound with this id; throws <see cref="KeyNotFoundException"/> naming it and the ids present.</summary>
    public Compound this[string id] => TryGet(id, out var c)
        ? c
        : throw new KeyNotFoundException($"'{id}' names no compound of model '{Name}' (compounds: {string.Join(", ", Compounds.Select(x => x.Id))})");

    /// <summary>
    /// The element matrix E (balances x <paramref name="compounds"/>), per C-mol for organic compounds
    /// (docs/methods.md §2.2: E q = 0).
    /// </summary>
    public double[,] ElementMatrix(IReadOnlyList<Compound> compounds)
    {
        var e = new double[Balances.Count, compounds.Count];
        for (int i = 0; i < Balances.Count; i++)
        {
            for (int j = 0; j < compounds.Count; j++)
            {
                e[i, j] = Balances[i].CoefficientOf(compounds[j]);
            }
        }

        return e;
    }
}
