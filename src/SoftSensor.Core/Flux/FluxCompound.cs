using SoftSensor.Core.Chemistry;

namespace SoftSensor.Core.Flux;

/// <summary>
/// An exchange compound of a flux model (the model file's "compounds", shared with the elemental
/// balance): its rate leaves or enters the cells and is not balanced inside them. Rates are per
/// C-mol for organic compounds, per mol otherwise (METHODS.md conventions).
/// </summary>
/// <param name="Id">Lower-case compound id.</param>
/// <param name="Formula">Formula as written in the model file; reaction coefficients count these formula units.</param>
/// <param name="Role">Role name as in the model file (substrate, product, biomass, oxygen, carbonDioxide, water, nitrogenSource, candidate).</param>
/// <param name="MolarMassGPerMol">Molar mass of one formula unit as written, g/mol.</param>
/// <param name="AshFraction">Ash as a fraction of dry weight (biomass only).</param>
public sealed record FluxCompound(string Id, Formula Formula, string Role, double MolarMassGPerMol, double AshFraction)
{
    /// <summary>Rate units (C-mol or mol) per formula unit as written: the carbon number for organics, else 1.</summary>
    public double RateUnitsPerFormulaUnit => Formula.IsOrganic ? Formula.Carbon : 1.0;

    /// <summary>Rate unit of this compound: "C-mmol/(L·h)" for organics, "mmol/(L·h)" otherwise.</summary>
    public string RateUnit => Formula.IsOrganic ? "C-mmol/(L·h)" : "mmol/(L·h)";

    /// <summary>Weighed mass per rate unit in g (biomass: dry weight with ash, M / (1 - ash)).</summary>
    public double WeighedMassGPerRateUnit => MolarMassGPerMol / RateUnitsPerFormulaUnit / (1.0 - AshFraction);
}
