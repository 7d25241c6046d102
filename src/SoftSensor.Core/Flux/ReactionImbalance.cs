namespace SoftSensor.Core.Flux;

/// <summary>
/// A reaction that does not conserve an element: <see cref="Excess"/> atoms (or charges) of
/// <see cref="Element"/> appear per unit of flux (negative: disappear). Carriers without elements
/// (ATP) are not counted.
/// </summary>
/// <param name="Reaction">Reaction id.</param>
/// <param name="Element">Element symbol (C, H, O, N, S, P) or "charge".</param>
/// <param name="Excess">Right side minus left side, atoms per unit flux.</param>
public readonly record struct ReactionImbalance(string Reaction, string Element, double Excess);
