using BenchmarkDotNet.Attributes;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Benchmarks.Stoichiometry;

/// <summary>
/// One balance cycle of the demo model (bacterium on glycerol: glycerol, O2, CO2, NH3, H2O, biomass;
/// C, gamma and N balances; acetate as candidate), five rates measured, so three redundant relations.
/// Target (issue 3): at least 1e6 reconcile-and-test cycles per second; the diagnosis runs only when
/// the test fails. Rates are invented demo values.
/// </summary>
[MemoryDiagnoser]
public class BalanceCycleBenchmarks
{
    private const string ModelJson = """
        {
          "name": "aerobic bacterium on glycerol",
          "compounds": {
            "glycerol": { "formula": "C3H8O3", "role": "substrate" },
            "o2":       { "formula": "O2",     "role": "oxygen" },
            "co2":      { "formula": "CO2",    "role": "carbonDioxide" },
            "nh3":      { "formula": "NH3",    "role": "nitrogenSource" },
            "h2o":      { "formula": "H2O",    "role": "water" },
            "biomass":  { "formula": "CH1.8O0.5N0.2", "role": "biomass", "ashFraction": 0.06 },
            "acetate":  { "formula": "C2H4O2", "role": "candidate" }
          },
          "balances": ["C", "gamma", "N"]
        }
        """;

    private static readonly double[] Consistent = [-40, -25.667, 20, -4, 20];
    private static readonly double[] WrongOxygen = [-40, -33.4, 20, -4, 20];

    private BalanceSolver _solver = null!;
    private double[] _psi = null!;
    private double[] _psiWrong = null!;
    private readonly double[] _rates = new double[6];
    private readonly double[] _sigmas = new double[6];
    private HypothesisOutcome[] _outcomes = null!;

    [GlobalSetup]
    public void Setup()
    {
        _solver = BuildSolver();
        _psi = Diagonal(Consistent);
        _psiWrong = Diagonal(WrongOxygen);
        _outcomes = new HypothesisOutcome[_solver.Hypotheses.Count];
    }

    /// <summary>Reconcile, calculate the unknowns with their sigmas, and test (χ²): the every-cycle path.</summary>
    [Benchmark(Baseline = true)]
    public double ReconcileAndTest()
    {
        var outcome = _solver.Solve(Consistent, _psi, _rates, _sigmas);
        return outcome.H;
    }

    /// <summary>A cycle whose test fails: reconcile, test, then diagnose every hypothesis (5 measurements + 1 candidate).</summary>
    [Benchmark]
    public int ReconcileTestAndDiagnose()
    {
        var outcome = _solver.Solve(WrongOxygen, _psiWrong, _rates, _sigmas);
        return outcome.Consistent ? -1 : _solver.Diagnose(WrongOxygen, _psiWrong, _outcomes).IsolatedIndex;
    }

    /// <summary>Loading the model and factoring the base system and the hypotheses: once per model and measured set.</summary>
    [Benchmark]
    public int BuildAndFactor() => BuildSolver().Hypotheses.Count;

    private static BalanceSolver BuildSolver() =>
        BalanceSolver.Create(ModelReader.Parse(ModelJson), ["glycerol", "o2", "co2", "nh3", "biomass"]);

    private static double[] Diagonal(double[] q)
    {
        var psi = new double[q.Length * q.Length];
        for (int i = 0; i < q.Length; i++)
        {
            psi[(i * q.Length) + i] = Math.Pow(0.02 * q[i], 2);
        }

        return psi;
    }
}
