using S = SoftSensor.Simulation.Vessel.StateIndex;

namespace SoftSensor.Simulation.Vessel;

/// <summary>Assembles a <see cref="ReactorTruth"/> from the state and the model's snapshot.</summary>
internal static class TruthBuilder
{
    public static ReactorTruth Build(
        VirtualReactor r, ReactorSnapshot snap, ReadOnlySpan<double> y,
        double carbonRecovery, (double Imbalance, double In) inert, double sampledL, bool faultActive)
    {
        double v = y[S.VolumeL];
        var c = snap.Culture;
        return new ReactorTruth
        {
            Time = r.Time,
            ElapsedH = r.ElapsedH,
            BiomassGPerL = y[S.BiomassG] / v,
            BiomassG = y[S.BiomassG],
            MuPerH = c.MuPerH,
            VolumeL = v,
            OurMmolPerLh = c.OurMmolPerLh,
            CerMmolPerLh = c.CerMmolPerLh,
            OtrMmolPerLh = snap.OtrMmolPerLh,
            CtrMmolPerLh = snap.CtrMmolPerLh,
            Rq = c.Rq,
            SubstrateGPerL = y[S.SubstrateG] / v,
            ByproductGPerL = y[S.ByproductG] / v,
            OverflowGPerL = y[S.OverflowG] / v,
            QsGPerGH = c.QsGPerGH,
            DissolvedOxygenMmolPerL = y[S.OxygenMmolPerL],
            DissolvedOxygenPercent = y[S.OxygenMmolPerL] / r.DoCalibrationMmolPerL * 100.0,
            DissolvedCo2MmolPerL = snap.DissolvedCo2MmolPerL,
            KlaPerH = snap.KlaPerH,
            FeedLPerH = snap.FeedLPerH,
            BaseLPerH = snap.BaseLPerH,
            EvaporationLPerH = snap.EvaporationLPerH,
            InletMolPerH = snap.InletMolPerH,
            OutletMolPerH = snap.OutletMolPerH,
            HeadspaceO2Percent = y[S.HeadspaceO2] * 100.0,
            HeadspaceCo2Percent = y[S.HeadspaceCo2] * 100.0,
            CarbonRecovery = carbonRecovery,
            InertImbalanceMmol = inert.Imbalance,
            InertInMmol = inert.In,
            FeedTotalL = y[S.FeedL],
            BaseTotalL = y[S.BaseL],
            EvaporatedTotalL = y[S.EvaporatedL],
            SampledTotalL = sampledL,
            FaultActive = faultActive,
        };
    }
}
