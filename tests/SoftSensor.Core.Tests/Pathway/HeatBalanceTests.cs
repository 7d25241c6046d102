using SoftSensor.Core.Estimation;
using SoftSensor.Core.Flux;
using SoftSensor.Simulation.Scenarios;
using Xunit.Abstractions;

namespace SoftSensor.Core.Tests.Pathway;

/// <summary>
/// The jacket heat balance on the virtual glycerol reactor (invented demo data) whose culture's heat
/// follows its own enthalpy balance: tabulated heats of combustion of glycerol (1655 kJ/mol, i.e.
/// 551.8 kJ/C-mol) and acetic acid (874 kJ/mol, 437 kJ/C-mol; CRC Handbook of Chemistry and Physics,
/// from memory) and biomass at 111 kJ per mol of electrons (Patel &amp; Erickson 1981, from memory), not
/// the estimator's 460 kJ/mol O2 (Thornton's rule, von Stockar &amp; Marison 1989).
/// </summary>
public sealed class HeatBalanceTests(ITestOutputHelper output)
{
    // A well-instrumented pilot jacket (invented): 150 L/h of coolant (about 1.5 K rise), a matched
    // Pt100 pair read to 0.01 K, a torque-meter stirrer power to 1 W.
    private static readonly JacketSpec Jacket = new()
    {
        SubstrateKjPerCmol = 551.8, ByproductKjPerCmol = 437.0, CoolantFlowLPerH = 150, TemperatureNoiseC = 0.01, PowerNoiseW = 1,
    };

    // The estimator's view of the same instruments, and the loss calibrated before inoculation
    // (the simulated vessel loses 3 W/K x 17 K = 51 W; the calibration reads 50 W).
    private static readonly HeatBalanceSettings Heat = new()
    {
        HeatLossW = 50,
        HeatLossSigmaW = 2,
        StirrerPowerRelativeSigma = 1.0 / 150,
        CoolantTemperatureSigmaK = 0.01,
    };

    private static PathwayRig Rig(HeatBalanceSettings heat, IReadOnlyList<FaultSpec>? faults = null) =>
        new(PathwayRig.Glycerol(null, 2.0, Jacket, faults), "estimator-glycerol-model.json", "glycerol-bacterium.json", new PathwaySettings(), heat, 42, ammoniaMeasured: false);

    /// <summary>Mean ratio of heat-based to gas-based OUR over the fed phase (9-12 h).</summary>
    private static double Ratio(HeatBalanceSettings heat)
    {
        var rig = Rig(heat);
        double sumHeat = 0, sumGas = 0;
        for (int i = 1; i <= 12 * 60; i++)
        {
            var t = rig.Step(TimeSpan.FromMinutes(1));
            if (t.ElapsedH >= 9 && double.IsFinite(rig.Outputs.Heat.OurMmolPerLh))
            {
                sumHeat += rig.Outputs.Heat.OurMmolPerLh;
                sumGas += rig.Outputs.Rates.OurMmolPerLh;
            }
        }

        return sumHeat / sumGas;
    }

    [Fact]
    public void HeatBasedOurBesideTheGasBasedOne()
    {
        double ratio = Ratio(Heat);
        output.WriteLine($"heat-based / gas-based OUR, 9-12 h, with 460 kJ/mol O2: {ratio:F3}");
        // The simulated culture releases more than 460 kJ per mol O2 (glycerol's heat of combustion
        // is 118 kJ per mol of electrons, above Thornton's 115), so the ratio is above 1: the issue's
        // 5 % is NOT met with the default value (measured figure in docs/pathway.md); within 12 %.
        Assert.InRange(ratio, 0.95, 1.12);
    }

    [Fact]
    public void FivePercentO2OffsetDetectedOnlyWithoutHeatBecomesIsolable()
    {
        // Calibration of the oxycaloric equivalent on the run itself while the analyser is sound
        // (9-12 h), as a plant would before trusting the heat row; then its uncertainty is 1 %.
        double calibrated = 460 * Ratio(Heat);
        var heat = Heat with { OxycaloricKjPerMolO2 = calibrated, OxycaloricRelativeSigma = 0.01 };
        // An O2 analyser reading 0.05 %-abs low from 12.5 h: OUR about 5 % high at this depletion.
        var rig = Rig(heat, [new FaultSpec { Kind = "analyser_offset", Gas = "o2", FromH = 12.5, ToH = 14, AbsolutePercent = -0.05 }]);
        int detected = 0, detectionOnly = 0, isolatedO2 = 0, isolatedOther = 0;
        double offset = 0;
        int n = 0;
        for (int i = 1; i <= 14 * 60; i++)
        {
            var t = rig.Step(TimeSpan.FromMinutes(1));
            if (t.ElapsedH < 12.75)
            {
                continue;
            }

            var r = rig.Outputs.Rates;
            var h = rig.Outputs.Heat;
            offset += (r.OurMmolPerLh / t.OurMmolPerLh) - 1;
            n++;
            Assert.Equal(2, h.Redundancy);
            if (r.Inconsistent)
            {
                detected++;
                detectionOnly += r.Suspect is null ? 1 : 0;
                isolatedO2 += h.Isolated == "o2" ? 1 : 0;
                isolatedOther += h.Isolated is { } s && s != "o2" ? 1 : 0;
            }
        }

        output.WriteLine($"oxycaloric calibrated {calibrated:F0} kJ/mol; OUR offset {offset / n:P1}; cycles {n}, elemental test failed {detected}, of which isolated by it {detected - detectionOnly}, isolated as o2 with the heat row {isolatedO2}, as another {isolatedOther}");
        Assert.InRange(offset / n, 0.035, 0.07);
        Assert.True(detected >= n / 2, "the elemental test (redundancy 1) detects the offset");
        Assert.Equal(detected, detectionOnly);
        Assert.True(isolatedO2 >= detected / 2, $"the heat row isolates o2 in {isolatedO2} of {detected} cycles");
        Assert.Equal(0, isolatedOther);
    }
}
