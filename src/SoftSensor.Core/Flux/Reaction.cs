namespace SoftSensor.Core.Flux;

/// <summary>
/// One reaction of a network: an id, its equation text, its net terms, and whether it may run
/// backwards (<c>&lt;=&gt;</c>) or only forwards (<c>-&gt;</c>).
/// </summary>
/// <param name="Id">Reaction id as in the model file.</param>
/// <param name="Equation">The equation text as written.</param>
/// <param name="Terms">Net coefficients per species (species on both sides are netted).</param>
/// <param name="Reversible">True for <c>&lt;=&gt;</c>.</param>
public sealed record Reaction(string Id, string Equation, IReadOnlyList<ReactionTerm> Terms, bool Reversible)
{
    /// <summary>The net coefficient of <paramref name="species"/> (0 when it does not take part).</summary>
    public double CoefficientOf(string species)
    {
        foreach (var t in Terms)
        {
            if (t.Species == species)
            {
                return t.Coefficient;
            }
        }

        return 0;
    }
}
