using SoftSensor.Core.Stoichiometry;
using Xunit;
using Xunit.Abstractions;

namespace SoftSensor.Core.Tests.Stoichiometry;

/// <summary>
/// Model uncertainty (docs/model-uncertainty.md): the biomass composition's σ enters the residual
/// covariance and the rates' σ. The culture is a perturbed composition inside the published range
/// (γX 3.9–4.3, N 0.15–0.25 per C: Roels 1983; Villadsen, Nielsen &amp; Lidén 2011 ch. 3, from memory);
/// the estimator keeps the standard CH1.8O0.5N0.2 (γ 4.2).
/// </summary>
public sealed class ModelUncertaintyTests(ITestOutputHelper output)
{
    private const string Json = """
        { "name": "glycerol", "compounds": {
            "glycerol": { "formula": "C3H8O3", "role": "substrate" },
            "o2": { "formula": "O2", "role": "oxygen" },
            "co2": { "formula": "CO2", "role": "carbonDioxide" },
            "nh3": { "formula": "NH3", "role": "nitrogenSource" },
            "h2o": { "formula": "H2O", "role": "water" },
            "biomass": { "formula": "CH1.8O0.5N0.2", "role": "biomass", "ashFraction": 0.06, "uncertainty": "publishedSpread" } },
          "balances": ["C", "gamma", "N"] }
        """;

    [Fact]
    public void ReaderTakesThePublishedSpread()
    {
        var model = ModelReader.Parse(Json);
        Assert.Equal(0.4 / Math.Sqrt(12), model["biomass"].Uncertainty.DegreeOfReduction, 12);
        Assert.Throws<ModelFormatException>(() => ModelReader.Parse(Json.Replace("\"publishedSpread\"", "{ \"gama\": 0.1 }", StringComparison.Ordinal)));
    }

    /// <summary>
    /// True culture γX = 4.05 (N 0.2): rates from the exact balances of that culture; measured glycerol,
    /// O2, CO2 (redundancy 1) with 0.5 % σ (invented for the check). Without the model's uncertainty the test flags the exact rates at high
    /// rate; with it, the statistic stays below the χ²(1) 95 % quantile and the biomass σ covers the error.
    /// </summary>
    [Fact]
    public void CompositionErrorIsCoveredByItsUncertainty()
    {
        var uncertain = ModelReader.Parse(Json);
        var exact = ModelReader.Parse(Json.Replace(", \"uncertainty\": \"publishedSpread\"", "", StringComparison.Ordinal));
        // True culture: per C-mol glycerol (γ 14/3) -> Y biomass 0.55 C-mol, γX 4.05; C: co2 = 1 - 0.55;
        // γ: 4 o2 = γS - Y γX.
        double qs = -30, y = 0.55, gx = 4.05, gs = 14.0 / 3;
        double qx = -qs * y, qc = -qs * (1 - y), qo = qs * (gs - (y * gx)) / 4;
        double[] q = [qs, qo, qc];
        double[] psi = [0.005 * 0.005 * qs * qs, 0, 0, 0, 0.005 * 0.005 * qo * qo, 0, 0, 0, 0.005 * 0.005 * qc * qc];
        string[] measured = ["glycerol", "o2", "co2"];

        var withU = BalanceSolver.Create(uncertain, measured);
        var without = BalanceSolver.Create(exact, measured);
        int n = withU.Compounds.Count, ix = withU.CompoundIds.ToList().IndexOf("biomass");
        var r1 = new double[n];
        var s1 = new double[n];
        var r0 = new double[n];
        var s0 = new double[n];
        var o1 = withU.Solve(q, psi, r1, s1);
        var o0 = without.Solve(q, psi, r0, s0);

        Assert.False(o0.Consistent);  // the exact model flags a composition within the published range
        Assert.True(o1.Consistent);
        Assert.True(o1.H < o0.H);
        Assert.True(s1[ix] > s0[ix]);
        Assert.True(Math.Abs(r1[ix] - qx) <= 2 * s1[ix], $"error {r1[ix] - qx} σ {s1[ix]}");
    }

    /// <summary>
    /// Monte Carlo check of the first-order equations: cultures drawn with γX ~ N(4.2, σγ),
    /// N ~ N(0.2, σN) (the published spread, read as normal here), 1 % measurement noise (invented for
    /// the check). The χ²(1) test at α = 0.05 flags about 5 % and the biomass error / σ has unit spread.
    /// </summary>
    [Fact]
    public void FlagRateAndSigmaMatchMonteCarlo()
    {
        var solver = BalanceSolver.Create(ModelReader.Parse(Json), ["glycerol", "o2", "co2"]);
        var u = FormulaUncertainty.PublishedBiomassSpread;
        var rng = new Random(15);
        double Normal() => Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
        int n = solver.Compounds.Count, ix = solver.CompoundIds.ToList().IndexOf("biomass");
        var rates = new double[n];
        var sigmas = new double[n];
        int flagged = 0, runs = 4000;
        double sumZ2 = 0;
        for (int k = 0; k < runs; k++)
        {
            double gx = 4.2 + (u.DegreeOfReduction * Normal());
            double qs = -30, qx = 16.5, qc = -qs - qx, qo = ((14.0 / 3 * qs) + (gx * qx)) / 4;
            double[] truth = [qs, qo, qc];
            double[] q = new double[3];
            double[] psi = new double[9];
            for (int i = 0; i < 3; i++)
            {
                double sd = 0.01 * Math.Abs(truth[i]);
                q[i] = truth[i] + (sd * Normal());
                psi[(i * 3) + i] = sd * sd;
            }

            var o = solver.Solve(q, psi, rates, sigmas);
            flagged += o.Consistent ? 0 : 1;
            double z = (rates[ix] - qx) / sigmas[ix];
            sumZ2 += z * z;
        }

        double rate = (double)flagged / runs, spread = Math.Sqrt(sumZ2 / runs);
        output.WriteLine($"flagged {rate:P2}, biomass error/σ rms {spread:F3} over {runs} cultures");
        Assert.InRange(rate, 0.03, 0.08);
        Assert.InRange(spread, 0.85, 1.15);
    }

    [Fact]
    public void UncertainModelSolvesWithoutAllocating()
    {
        var solver = BalanceSolver.Create(ModelReader.Parse(Json), ["glycerol", "o2", "co2"]);
        double[] q = [-30, -20, 13];
        double[] psi = [0.09, 0, 0, 0, 0.04, 0, 0, 0, 0.02];
        AllocationTests.AssertSolveAndDiagnoseAllocateNothing(solver, q, psi);
    }
}
