using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Flux;

/// <summary>How reaction coefficients (formula units as written) map onto balance rates (C-mol for organics, mol otherwise).</summary>
public static class CompoundRates
{
    /// <summary>Rate units (C-mol or mol) per formula unit as written: the carbon number for organics, else 1.</summary>
    public static double RateUnitsPerFormulaUnit(this Compound compound) => 1.0 / compound.Formula.FormulaUnitsPerRateUnit;

    /// <summary>Rate unit of the compound: "C-mmol/(L·h)" for organics, "mmol/(L·h)" otherwise.</summary>
    public static string RateUnit(this Compound compound) => compound.IsOrganic ? "C-mmol/(L·h)" : "mmol/(L·h)";
}
