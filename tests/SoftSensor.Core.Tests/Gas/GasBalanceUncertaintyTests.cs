using SoftSensor.Core.Gas;

namespace SoftSensor.Core.Tests.Gas;

public class GasBalanceUncertaintyTests
{
    private static readonly GasLineFlows Flows = new(8.0, 1.0, 0.5, 0.2);

    [Theory]
    [InlineData(false, 0.0)]
    [InlineData(true, 0.0)]
    [InlineData(false, 0.041911)]
    [InlineData(true, 0.041911)]
    public void Propagate_analytic_covariance_matches_numerical_jacobian(bool measuredInlet, double water)
    {
        // First-order propagation (GUM, JCGM 100:2008, eq. 13): cov = J diag(u^2) J^T; here J is
        // taken by central differences of the balance itself and compared with the analytic J.
        var accuracy = new MeasurementAccuracy(0.05, 0.03, 1.0);
        var settings = GasBalanceSettings.Default.WithAccuracy(accuracy);
        double[] x = [Flows.AirNlPerMin, Flows.OxygenNlPerMin, Flows.NitrogenNlPerMin, Flows.CarbonDioxideNlPerMin, 0.26 * (1 - water), 0.03 * (1 - water), 0.28, 0.021];
        double[] u = [x[0] * 0.01, x[1] * 0.01, x[2] * 0.01, x[3] * 0.01, 0.0005, 0.0003, measuredInlet ? 0.0005 : 0, measuredInlet ? 0.0003 : 0];

        (double Otr, double Ctr) Eval(double[] v)
        {
            var inlet = measuredInlet ? InletComposition.Measured(v[6], v[7]) : InletComposition.FromGasLines();
            var r = GasBalance.Compute(new GasLineFlows(v[0], v[1], v[2], v[3]), inlet, AnalyserReading.WithHumidity(v[4], v[5], water), 5.0, GasBalanceSettings.Default);
            return (r.OurMmolPerLh, r.CerMmolPerLh);
        }

        double oo = 0, oc = 0, cc = 0;
        for (int i = 0; i < x.Length; i++)
        {
            if (u[i] == 0)
            {
                continue;
            }

            double h = 1e-6 * Math.Max(Math.Abs(x[i]), 1e-3);
            double[] up = (double[])x.Clone();
            double[] dn = (double[])x.Clone();
            up[i] += h;
            dn[i] -= h;
            var (o1, c1) = Eval(up);
            var (o0, c0) = Eval(dn);
            double jo = (o1 - o0) / (2 * h);
            double jc = (c1 - c0) / (2 * h);
            oo += jo * jo * u[i] * u[i];
            oc += jo * jc * u[i] * u[i];
            cc += jc * jc * u[i] * u[i];
        }

        var inletUsed = measuredInlet ? InletComposition.Measured(x[6], x[7]) : InletComposition.FromGasLines();
        var analytic = GasBalance.Compute(Flows, inletUsed, AnalyserReading.WithHumidity(x[4], x[5], water), 5.0, settings);
        Assert.Equal(oo, analytic.Covariance.OurOur, oo * 1e-6);
        Assert.Equal(cc, analytic.Covariance.CerCer, cc * 1e-6);
        Assert.Equal(oc, analytic.Covariance.OurCer, Math.Abs(oc) * 1e-6);
    }

    [Fact]
    public void Propagate_flow_accuracy_only_moves_OTR_and_CTR_together()
    {
        // Air line only, exact analyser: OTR and CTR are both proportional to the air flow, so
        // u(OTR)/OTR = u(CTR)/CTR = u(F)/F, their correlation is +1 and RQ carries no uncertainty.
        var settings = GasBalanceSettings.Default.WithAccuracy(new MeasurementAccuracy(0, 0, 2.0));
        var r = GasBalance.Compute(GasLineFlows.AirOnly(10), InletComposition.Measured(0.20946, 0.00042), AnalyserReading.Dry(0.195, 0.015), 10, settings);
        Assert.Equal(0.02 * r.OurMmolPerLh, r.OurSigmaMmolPerLh, 1e-12);
        Assert.Equal(0.02 * r.CerMmolPerLh, r.CerSigmaMmolPerLh, 1e-12);
        Assert.Equal(1.0, r.Covariance.Correlation, 12);
        Assert.Equal(0.0, r.RqSigma, 9);
    }

    [Fact]
    public void Propagate_outlet_O2_error_anticorrelates_OTR_and_CTR()
    {
        // A higher outlet O2 reading lowers OTR and (through a larger outlet flow) raises CTR:
        // d OTR V / d yO2 = -n_out (1 - yCO2)/d < 0 and d CTR V / d yO2 = n_out yCO2 / d > 0.
        var settings = GasBalanceSettings.Default.WithAccuracy(new MeasurementAccuracy(0.1, 0, 0));
        var r = GasBalance.Compute(GasLineFlows.AirOnly(10), InletComposition.FromGasLines(), AnalyserReading.Dry(0.195, 0.015), 10, settings);
        Assert.True(r.Covariance.OurCer < 0);
        Assert.True(r.RqSigma > 0);
    }

    [Fact]
    public void Propagate_without_stated_accuracy_gives_zero_sigmas()
    {
        var r = GasBalance.Compute(GasLineFlows.AirOnly(10), InletComposition.FromGasLines(), AnalyserReading.Dry(0.195, 0.015), 10, GasBalanceSettings.Default);
        Assert.Equal(0.0, r.OurSigmaMmolPerLh);
        Assert.Equal(0.0, r.CerSigmaMmolPerLh);
        Assert.Equal(0.0, r.RqSigma);
    }
}
