using SoftSensor.Core.Estimation;

namespace SoftSensor.Core.Tests.Estimation;

public class PirtEkfTests
{
    [Fact]
    public void Run_ekf_on_consistent_pirt_data_converges_from_a_wrong_start()
    {
        // Synthetic culture that obeys Pirt's law exactly (Pirt 1965): mu = 0.20 1/h, X0 = 1 g/L,
        // OUR = (mu / Y_XO + m_O) X. The filter starts at X0 = 1.3 g/L and mu = 0.10 1/h; after 12 h
        // it must be within 3 % on X and 0.01 1/h on mu (the figures this test asserts).
        var s = EstimationFixtures.Settings(ObserverKind.PirtEkf) with { InitialBiomassGPerL = 1.3, EkfInitialMuPerH = 0.10 };
        var state = new EstimatorState(s.HistoryCapacity);
        var o = new CycleOutputs();
        const double mu = 0.20;
        for (int k = 0; k <= 720; k++)
        {
            var t = EstimationFixtures.Start.AddMinutes(k);
            var rates = EstimationFixtures.Rates(mu, Math.Exp(mu * k / 60.0), s);
            rates.GrowthCmmolPerLh = double.NaN; // the filter must not lean on the balance
            rates.GrowthSource = GrowthSource.None;
            EstimationStep.Run(EstimationFixtures.Inputs(t, 100), rates, state, s, o);
        }

        double truth = Math.Exp(mu * 12);
        Assert.True(Math.Abs(o.EkfBiomassGPerL - truth) / truth < 0.03, $"X = {o.EkfBiomassGPerL}, truth {truth}");
        Assert.True(Math.Abs(o.EkfMuPerH - mu) < 0.01, $"mu = {o.EkfMuPerH}");
        Assert.Equal(o.EkfBiomassGPerL, o.BiomassGPerL);
    }
}
