namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// What a model and a choice of measurements and specifications allow, decided when the solver is
/// built (docs/methods.md §2.3-2.4): the rank of the element matrix, the degrees of freedom, which unknown
/// rates are calculable (Klamt, Schuster &amp; Gilles 2002; van der Heijden et al. 1994a), the
/// redundancy, and what would make an under-determined set determined.
/// </summary>
public sealed record BalanceAnalysis
{
    /// <summary>Compounds in the balance (candidates only when measured or specified).</summary>
    public required int CompoundCount { get; init; }

    /// <summary>Balances (rows of E).</summary>
    public required int BalanceCount { get; init; }

    /// <summary>Rank of the element matrix E.</summary>
    public required int ElementMatrixRank { get; init; }

    /// <summary>Degrees of freedom of the balances: compounds - rank(E).</summary>
    public int DegreesOfFreedom => CompoundCount - ElementMatrixRank;

    /// <summary>Independent specifications: rank([E; S]) - rank(E).</summary>
    public required int IndependentSpecifications { get; init; }

    /// <summary>Measured rates.</summary>
    public required int MeasuredCount { get; init; }

    /// <summary>Independent redundant relations rho among the measurements (χ² degrees of freedom).</summary>
    public required int Redundancy { get; init; }

    /// <summary>Unknown rates that the measurements and specifications determine.</summary>
    public required IReadOnlyList<string> Calculable { get; init; }

    /// <summary>Unknown rates they leave open.</summary>
    public required IReadOnlyList<string> NotCalculable { get; init; }

    /// <summary>
    /// Compounds of the model that no chosen balance contains (water when gamma replaces H and O):
    /// left out of the result; measure them, or balance H and O, to have them.
    /// </summary>
    public required IReadOnlyList<string> OutsideBalances { get; init; }

    /// <summary>Further independent measurements or specifications needed for every rate (0 when determined).</summary>
    public required int MissingInformation { get; init; }

    /// <summary>True when every unknown rate is calculable.</summary>
    public bool IsDetermined => MissingInformation == 0;

    /// <summary>What would fix an under-determined set (empty when determined).</summary>
    public string Advice => IsDetermined
        ? string.Empty
        : $"{MissingInformation} more independent measurement(s) or specification(s) needed: measure one of {string.Join(", ", NotCalculable)} " +
          "(each such measurement settles one open dimension), or specify a yield or ratio that involves them";
}
