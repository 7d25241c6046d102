namespace SoftSensor.Core.Flux;

/// <summary>One species of a reaction with its net stoichiometric coefficient (negative: consumed, positive: made), in formula units as written.</summary>
/// <param name="Species">A compound id or a metabolite id.</param>
/// <param name="Coefficient">Net coefficient; never zero.</param>
public readonly record struct ReactionTerm(string Species, double Coefficient);
