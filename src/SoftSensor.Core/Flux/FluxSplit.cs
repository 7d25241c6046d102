namespace SoftSensor.Core.Flux;

/// <summary>
/// A carbon split between branches: either fixed, v[Flux] = Ratio * sum(v[Per]), one more linear
/// constraint, or free (Ratio null), in which case the branch flux is left to the balances or to a basis.
/// </summary>
/// <param name="Name">Split name.</param>
/// <param name="Flux">The branch reaction.</param>
/// <param name="Per">The reactions whose summed flux the ratio refers to.</param>
/// <param name="Ratio">Fixed ratio, or null for a free split.</param>
/// <param name="Source">Where the ratio comes from.</param>
public sealed record FluxSplit(string Name, string Flux, IReadOnlyList<string> Per, double? Ratio, string Source)
{
    /// <summary>True when the ratio is fixed (the split adds a constraint).</summary>
    public bool IsFixed => Ratio is not null;
}
