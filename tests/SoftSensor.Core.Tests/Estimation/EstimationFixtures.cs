using SoftSensor.Core.Estimation;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Estimation;

/// <summary>Drives <see cref="EstimationStep"/> with rates from an exponentially growing culture (invented data for the checks).</summary>
internal static class EstimationFixtures
{
    public static readonly DateTimeOffset Start = new(2026, 3, 2, 6, 0, 0, TimeSpan.Zero);

    public static EstimatorSettings Settings(ObserverKind observer = ObserverKind.BalanceIntegrator) => new()
    {
        InitialBiomassGPerL = 1.0,
        InitialBiomassSigmaGPerL = 0.2,
        InitialVolumeL = 100,
        Observer = observer,
        HistoryCapacity = 4096,
    };

    /// <summary>Rates of a culture at X g/L growing at mu with Pirt oxygen demand.</summary>
    public static BalanceRates Rates(double muPerH, double biomassGPerL, EstimatorSettings s)
    {
        double growthGPerLh = muPerH * biomassGPerL;
        double our = ((muPerH / s.YieldXOGPerMmol) + s.MaintenanceOMmolPerGh) * biomassGPerL;
        return new BalanceRates
        {
            OurMmolPerLh = our,
            OurSigmaMmolPerLh = 0.02 * our,
            CerMmolPerLh = our,
            GrowthCmmolPerLh = growthGPerLh / (s.BiomassWithAshGPerCMol / 1000.0),
            GrowthSigmaCmmolPerLh = 0.02 * growthGPerLh / (s.BiomassWithAshGPerCMol / 1000.0),
            SubstrateCmmolPerLh = double.NaN,
            H = double.NaN,
            HCritical = double.NaN,
            GrowthSource = GrowthSource.ElementalBalance,
            GrowthQuality = SampleQuality.Good,
            GasQuality = SampleQuality.Good,
        };
    }

    public static AlignedInputs Inputs(DateTimeOffset t, double volumeL)
    {
        var a = new AlignedInputs { Time = t };
        a.Set(SignalRole.LiquidVolumeL, volumeL, SampleQuality.Good, t);
        return a;
    }
}
