using SoftSensor.Core.Chemistry;

namespace SoftSensor.Simulation.Kinetics;

/// <summary>An organic compound per C-mol: molar mass of one C-mol and its degree of reduction.</summary>
internal readonly record struct CompoundInfo(string Name, double GramsPerCmol, double Gamma, double CarbonAtoms, double NitrogenPerCmol)
{
    /// <summary>From a formula; <paramref name="ashFraction"/> adds ash to the mass of a C-mol (biomass).</summary>
    public static CompoundInfo Of(string name, string formula, double ashFraction = 0)
    {
        var whole = Formula.Parse(formula);
        var perC = whole.PerCMol();
        return new CompoundInfo(name, perC.MolarMassGPerMol / (1 - ashFraction), perC.DegreeOfReduction, whole.Carbon, perC[Element.N]);
    }

    /// <summary>C-mmol per gram.</summary>
    public double CmmolPerG => 1000.0 / GramsPerCmol;
}
