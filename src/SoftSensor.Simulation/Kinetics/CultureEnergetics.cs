using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Simulation.Kinetics;

/// <summary>
/// The simulated culture's Pirt yield and maintenance from its own energy budget (docs/pathway.md §6).
/// Per C-mol biomass the anabolism takes (1 + β) C-mol substrate and frees n_a = (γ_S (1 + β) - γ_X) / 2
/// NADH; catabolism of a C-mol substrate to CO2 frees γ_S / 2 NADH and a ATP at substrate level. The
/// ATP balance, P/O (γ_S / 2 + n_a-respired) + a s_c = K x + m_ATP, then gives
///   1 / Y_X/S (C-mol/C-mol) = 1 + β + (K - P/O n_a) / (P/O γ_S / 2 + a),  m_S = m_ATP / (P/O γ_S / 2 + a)
/// (the linear law of Pirt 1965, Proc. R. Soc. Lond. B 163, with the energetics of Roels 1983,
/// Energetics and Kinetics in Biotechnology, ch. 4). One NADH = one O atom, so P/O is ATP per O.
/// </summary>
internal static class CultureEnergetics
{
    /// <summary>The P/O ratio at hour <paramref name="tH"/>.</summary>
    public static double PoAt(EnergeticsSpec e, double tH)
    {
        double po = e.PoRatio;
        foreach (var s in e.PoSteps)
        {
            if (tH >= s.AtH)
            {
                po = s.PoRatio;
            }
        }

        return po;
    }

    /// <summary>Yield (g dry weight per g substrate) and maintenance (g substrate per g dry weight and hour) at a P/O ratio.</summary>
    public static (double YieldGPerG, double MaintenanceGPerGH) Pirt(EnergeticsSpec e, double po, CompoundInfo substrate, CompoundInfo biomass)
    {
        double beta = e.AnabolicCo2PerBiomassCmol;
        double na = ((substrate.Gamma * (1 + beta)) - biomass.Gamma) / 2.0;
        double atpPerSubstrate = (po * substrate.Gamma / 2.0) + e.SubstrateLevelAtpPerCmol;
        double perYield = 1 + beta + ((e.AtpPerBiomassCmol - (po * na)) / atpPerSubstrate);
        double yieldCmol = 1.0 / perYield;
        double yield = yieldCmol * biomass.GramsPerCmol / substrate.GramsPerCmol;
        double mS = e.MaintenanceAtpMmolPerGH / 1000.0 / atpPerSubstrate * substrate.GramsPerCmol;
        return (yield, mS);
    }
}
