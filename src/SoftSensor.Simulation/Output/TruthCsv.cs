using System.Text;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Simulation.Output;

/// <summary>Columns of truth.csv (docs/simulator.md lists them with units).</summary>
internal static class TruthCsv
{
    private static readonly string[] Fixed =
    [
        "time", "biomass_g_per_l", "mu_per_h", "volume_l", "our", "cer", "otr", "ctr", "rq", "substrate_g_per_l",
    ];

    private static readonly string[] Rest =
    [
        "q_s_g_per_g_h", "do_mmol_per_l", "do_percent", "dissolved_co2_mmol_per_l", "kla_per_h", "feed_l_per_h", "base_l_per_h",
        "evaporation_l_per_h", "inlet_flow_mol_per_h", "outlet_flow_mol_per_h", "headspace_o2_percent", "headspace_co2_percent",
        "biomass_g", "feed_total_l", "base_total_l", "evaporated_total_l", "sampled_total_l", "carbon_recovery", "fault_active",
    ];

    /// <summary>Header: fixed columns, then acetate_g_per_l and ethanol_g_per_l style columns named after the scenario's products.</summary>
    public static string Header(Scenario s)
    {
        string byproduct = (s.Culture.Byproduct?.Name ?? "byproduct") + "_g_per_l";
        string overflow = (s.Culture.Overflow?.Name ?? "overflow") + "_g_per_l";
        return string.Join(',', Fixed) + "," + byproduct + "," + overflow + "," + string.Join(',', Rest);
    }

    public static string Row(ReactorTruth t, StringBuilder sb)
    {
        sb.Append(CsvFormat.Time(t.Time));
        foreach (double v in new[]
                 {
                     t.BiomassGPerL, t.MuPerH, t.VolumeL, t.OurMmolPerLh, t.CerMmolPerLh, t.OtrMmolPerLh, t.CtrMmolPerLh, t.Rq,
                     t.SubstrateGPerL, t.ByproductGPerL, t.OverflowGPerL, t.QsGPerGH, t.DissolvedOxygenMmolPerL,
                     t.DissolvedOxygenPercent, t.DissolvedCo2MmolPerL, t.KlaPerH, t.FeedLPerH, t.BaseLPerH, t.EvaporationLPerH,
                     t.InletMolPerH, t.OutletMolPerH, t.HeadspaceO2Percent, t.HeadspaceCo2Percent, t.BiomassG, t.FeedTotalL,
                     t.BaseTotalL, t.EvaporatedTotalL, t.SampledTotalL, t.CarbonRecovery, t.FaultActive ? 1 : 0,
                 })
        {
            sb.Append(',').Append(CsvFormat.Truth(v));
        }

        return sb.ToString();
    }
}
