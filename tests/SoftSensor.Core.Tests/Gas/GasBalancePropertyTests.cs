using CsCheck;
using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Gas;

/// <summary>Invariants of the inert balance (docs/methods.md §1.3) over seeded random valid inputs.</summary>
public class GasBalancePropertyTests
{
    private const string Seed = "0N0XIzNsQ0O2";

    // Any valid plant: air 0.5-50 NL/min plus optional O2, N2, CO2 lines, 1-1000 L; the outlet
    // takes up a share (0-30 %) of the inlet O2 and adds CO2 (0-10 % of the inert fraction), so
    // every outlet is a valid composition.
    private static readonly Gen<(GasLineFlows Flows, double VolumeL, double O2Share, double Co2Share)> Plants =
        Gen.Select(
            Gen.Double[0.5, 50], Gen.Double[0, 5], Gen.Double[0, 5], Gen.Double[0, 1],
            Gen.Double[1, 1000], Gen.Double[0, 0.3], Gen.Double[0, 0.1])
        .Select((air, o2, n2, co2, v, kO2, kCo2) => (new GasLineFlows(air, o2, n2, co2), v, kO2, kCo2));

    private static (double O2, double Co2) Outlet(in GasBalanceResult inlet, double o2Share, double co2Share) =>
        (inlet.InletO2Fraction * (1 - o2Share),
         inlet.InletCo2Fraction + ((1 - inlet.InletO2Fraction - inlet.InletCo2Fraction) * co2Share));

    [Fact]
    public void Compute_any_valid_input_conserves_inert_gas()
    {
        Plants.Sample(p =>
        {
            var inlet = InletComposition.FromGasLines();
            var mix = GasBalance.Compute(p.Flows, inlet, AnalyserReading.Dry(0.2, 0.01), p.VolumeL, GasBalanceSettings.Default);
            var (yo, yc) = Outlet(mix, p.O2Share, p.Co2Share);
            var r = GasBalance.Compute(p.Flows, inlet, AnalyserReading.Dry(yo, yc), p.VolumeL, GasBalanceSettings.Default);

            // Inert (N2 + Ar + ...) in = inert out, in molar flow at the same reference conditions.
            double inertIn = r.InletFlowNlPerMin * (1 - r.InletO2Fraction - r.InletCo2Fraction);
            double inertOut = r.OutletFlowNlPerMin * (1 - r.OutletO2DryFraction - r.OutletCo2DryFraction);
            Assert.Equal(GasBalanceFlags.None, r.Flags & (GasBalanceFlags.FractionOutOfRange | GasBalanceFlags.FlowOutOfRange));
            Assert.Equal(inertIn, inertOut, inertIn * 1e-12);

            // And the O2 and CO2 balances close with the reported rates: in - out = rate * V.
            double molPerNl = 60.0 / ReferenceConditions.Normal.MolarVolumeLPerMol;
            double o2Gap = ((r.InletFlowNlPerMin * r.InletO2Fraction) - (r.OutletFlowNlPerMin * yo)) * molPerNl * 1000 / p.VolumeL;
            Assert.Equal(o2Gap, r.OurMmolPerLh, Math.Max(1e-9, Math.Abs(o2Gap) * 1e-9));
        }, seed: Seed, iter: 2000);
    }

    [Fact]
    public void Compute_zero_uptake_gives_zero_OTR_and_CTR_for_any_valid_input()
    {
        Plants.Sample(p =>
        {
            var inlet = InletComposition.FromGasLines();
            var probe = GasBalance.Compute(p.Flows, inlet, AnalyserReading.Dry(0.2, 0.01), p.VolumeL, GasBalanceSettings.Default);

            // The outlet reads exactly the inlet composition: nothing taken up, nothing made.
            var r = GasBalance.Compute(p.Flows, inlet, AnalyserReading.Dry(probe.InletO2Fraction, probe.InletCo2Fraction), p.VolumeL, GasBalanceSettings.Default);
            Assert.Equal(0.0, r.OurMmolPerLh, 1e-9);
            Assert.Equal(0.0, r.CerMmolPerLh, 1e-9);
            Assert.True(double.IsNaN(r.Rq));
            Assert.Equal(GasBalanceFlags.RqUndefined, r.Flags & ~GasBalanceFlags.InertFractionImplausible);
            Assert.Equal(r.InletFlowNlPerMin, r.OutletFlowNlPerMin, r.InletFlowNlPerMin * 1e-12);
        }, seed: Seed, iter: 2000);
    }

    [Fact]
    public void Compute_uncertainty_scales_linearly_with_accuracy()
    {
        var accuracies = Gen.Select(Gen.Double[0.001, 0.5], Gen.Double[0.001, 0.5], Gen.Double[0.01, 5], Gen.Double[0.1, 10]);
        Gen.Select(Plants, accuracies).Sample((p, a) =>
        {
            var inlet = InletComposition.Measured(0.20946, 0.00042);
            var reading = AnalyserReading.Dry(0.20946 * (1 - p.O2Share), 0.00042 + (0.79012 * p.Co2Share));
            var baseAccuracy = new MeasurementAccuracy(a.Item1, a.Item2, a.Item3);
            var scaled = new MeasurementAccuracy(a.Item1 * a.Item4, a.Item2 * a.Item4, a.Item3 * a.Item4);
            var r1 = GasBalance.Compute(p.Flows, inlet, reading, p.VolumeL, GasBalanceSettings.Default.WithAccuracy(baseAccuracy));
            var rk = GasBalance.Compute(p.Flows, inlet, reading, p.VolumeL, GasBalanceSettings.Default.WithAccuracy(scaled));

            // First-order propagation is linear in the input uncertainties (GUM, JCGM 100:2008, eq. 10).
            Assert.Equal(r1.OurSigmaMmolPerLh * a.Item4, rk.OurSigmaMmolPerLh, r1.OurSigmaMmolPerLh * a.Item4 * 1e-12);
            Assert.Equal(r1.CerSigmaMmolPerLh * a.Item4, rk.CerSigmaMmolPerLh, r1.CerSigmaMmolPerLh * a.Item4 * 1e-12);
            Assert.Equal(r1.Covariance.OurCer * a.Item4 * a.Item4, rk.Covariance.OurCer, Math.Abs(r1.Covariance.OurCer) * a.Item4 * a.Item4 * 1e-12);
        }, seed: Seed, iter: 1000);
    }
}
