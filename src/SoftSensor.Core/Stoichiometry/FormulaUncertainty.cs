namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// Standard uncertainties of a compound's composition, per rate unit (docs/model-uncertainty.md):
/// the degree of reduction (enters the gamma row, or the H row when H is balanced instead), the
/// N content (the N row) and the ash fraction (the weighed mass only, not the balances).
/// First order: each uncertain entry of the balance matrix is an independent error whose effect on
/// the balance grows with the compound's rate.
/// </summary>
/// <param name="DegreeOfReduction">σ of γ per C-mol (dimensionless).</param>
/// <param name="NitrogenPerCMol">σ of the N atoms per C-mol.</param>
/// <param name="AshFraction">σ of the ash as a fraction of dry weight.</param>
public readonly record struct FormulaUncertainty(double DegreeOfReduction, double NitrogenPerCMol, double AshFraction)
{
    /// <summary>
    /// Defaults for biomass from the spread of compositions published across organisms (Roels 1983,
    /// "Energetics and Kinetics in Biotechnology", table of elemental compositions; Villadsen, Nielsen
    /// &amp; Lidén 2011, "Bioreaction Engineering Principles" 3rd ed., ch. 3, table 3.1; ranges from
    /// memory): γX 3.9–4.3, N 0.15–0.25 per C, ash 5–9 %. Each range is read as a uniform
    /// distribution, σ = width / √12: σγ = 0.4/√12 ≈ 0.115, σN = 0.10/√12 ≈ 0.029, σash = 0.04/√12 ≈ 0.012.
    /// </summary>
    public static FormulaUncertainty PublishedBiomassSpread { get; } = new(0.4 / Math.Sqrt(12), 0.10 / Math.Sqrt(12), 0.04 / Math.Sqrt(12));

    /// <summary>None: the formula is taken as exact.</summary>
    public static FormulaUncertainty None { get; } = default;

    /// <summary>True when every σ is zero.</summary>
    public bool IsNone => DegreeOfReduction == 0 && NitrogenPerCMol == 0 && AshFraction == 0;

    /// <summary>σ of this compound's coefficient in <paramref name="balance"/> per rate unit (0 for C and the others).</summary>
    public double OfBalance(Balance balance) => balance.Name switch
    {
        "gamma" or "H" => DegreeOfReduction,
        "N" => NitrogenPerCMol,
        _ => 0,
    };
}
