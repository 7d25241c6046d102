using SoftSensor.Core.Chemistry;

namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// One compound of a model. Its rate is counted per C-mol when it contains carbon (glucose as CH2O),
/// otherwise per mol (docs/methods.md, conventions).
/// </summary>
/// <param name="Id">Lower-case id used in model files, measurements and outputs.</param>
/// <param name="Formula">The formula as written in the model file.</param>
/// <param name="Role">What the compound is.</param>
/// <param name="MolarMassGPerMol">Molar mass of one formula unit as written, in g/mol (an override or from IUPAC atomic weights).</param>
/// <param name="AshFraction">Ash as a fraction of dry weight (biomass only; 0 otherwise).</param>
public sealed record Compound(string Id, Formula Formula, CompoundRole Role, double MolarMassGPerMol, double AshFraction)
{
    /// <summary>Standard uncertainties of the composition (docs/model-uncertainty.md); none by default.</summary>
    public FormulaUncertainty Uncertainty { get; init; }

    /// <summary>
    /// σ of <see cref="WeighedMassGPerRateUnit"/> from the ash's σ, first order:
    /// d(M/(1-a))/da = M/(1-a)² (docs/model-uncertainty.md).
    /// </summary>
    public double WeighedMassSigmaGPerRateUnit => MassGPerRateUnit / ((1.0 - AshFraction) * (1.0 - AshFraction)) * Uncertainty.AshFraction;

    /// <summary>True when the compound contains carbon and its rate is per C-mol.</summary>
    public bool IsOrganic => Formula.IsOrganic;

    /// <summary>The formula per rate unit (per C-mol for organics, as written otherwise).</summary>
    public Formula PerRateUnit => Formula.PerCMol();

    /// <summary>Mass of one rate unit (C-mol or mol) of the compound itself, in g.</summary>
    public double MassGPerRateUnit => MolarMassGPerMol * Formula.FormulaUnitsPerRateUnit;

    /// <summary>
    /// Weighed mass per rate unit in g: for biomass the dry weight including ash,
    /// M / (1 - ash) (Villadsen, Nielsen &amp; Lidén 2011, ch. 3); the plain mass otherwise.
    /// </summary>
    public double WeighedMassGPerRateUnit => MassGPerRateUnit / (1.0 - AshFraction);

    /// <summary>Degree of reduction per rate unit (Roels 1983; NH3, H2O, CO2 as references).</summary>
    public double DegreeOfReductionPerRateUnit => PerRateUnit.DegreeOfReduction;

    /// <summary>Atoms of <paramref name="element"/> per rate unit.</summary>
    public double AtomsPerRateUnit(Element element) => PerRateUnit[element];
}
