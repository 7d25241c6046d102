using SoftSensor.Core.Chemistry;

namespace SoftSensor.Core.Flux;

/// <summary>
/// A balanced intracellular metabolite or cofactor: pseudo-steady state holds for it (its net rate
/// is zero). With a <see cref="Formula"/> it takes part in the per-reaction elemental check; a
/// <em>carrier</em> (ATP as an energy unit) has no elements and is left out of that check.
/// Cofactor pairs are written as one species for the group that moves: NADH as <c>H2</c> (NADH + H+
/// minus NAD+), so its degree of reduction is 2, the electrons it carries (Villadsen, Nielsen &amp;
/// Lidén 2011, Bioreaction Engineering Principles, ch. 5, lumped redox equivalents).
/// </summary>
/// <param name="Id">Metabolite id as used in the reactions.</param>
/// <param name="Formula">Elemental formula of the moiety that moves, or null for a carrier.</param>
/// <param name="Note">Free text from the model file.</param>
public sealed record Metabolite(string Id, Formula? Formula, string Note)
{
    /// <summary>True when the metabolite carries no elements (energy carrier such as ATP).</summary>
    public bool IsCarrier => Formula is null;
}
