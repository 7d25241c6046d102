using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Flux;

/// <summary>
/// Feeds the flux model's predicted exchange rates into the elemental-balance engine
/// (<see cref="BalanceSolver"/>, the model's own balances, e.g. C, gamma, N) as if every rate were
/// measured, and returns its χ² consistency test (docs/methods.md §3: the flux-model results must close
/// the elemental balance). Each rate gets a standard deviation of 1 % of its size plus
/// <see cref="SigmaFloorRateUnits"/>, so a balanced network gives h ≈ 0 and an unbalanced one fails.
/// Set up once; <see cref="Check"/> allocates nothing. Not thread-safe (it owns its scratch vectors).
/// </summary>
public sealed class BalanceCrossCheck
{
    /// <summary>Relative standard deviation given to each predicted rate.</summary>
    public const double RelativeSigma = 0.01;

    /// <summary>Absolute floor of the standard deviation, in rate units (C-mmol or mmol per L and h).</summary>
    public const double SigmaFloorRateUnits = 1e-3;

    private readonly BalanceSolver _solver;
    private readonly int[] _fromExchange;
    private readonly double[] _measured, _covariance, _rates;

    /// <summary>Builds the balance solver over the network's compounds (candidates that the network makes are included).</summary>
    public BalanceCrossCheck(FluxNetwork network)
    {
        var model = network.Model;
        var ids = new List<int>();
        for (int j = 0; j < model.Compounds.Count; j++)
        {
            if (model.Compounds[j].Role != CompoundRole.Candidate || network.InNetwork[j])
            {
                ids.Add(j);
            }
        }

        _fromExchange = [.. ids];
        _solver = BalanceSolver.Create(model.Stoichiometry, [.. ids.Select(j => model.Compounds[j].Id)]);
        _measured = new double[ids.Count];
        _covariance = new double[ids.Count * ids.Count];
        _rates = new double[_solver.Compounds.Count];
    }

    /// <summary>Names of the balances tested (from the model file's "balances").</summary>
    public IReadOnlyList<string> Balances => [.. _solver.Model.Balances.Select(b => b.Name)];

    /// <summary>Tests the exchange rates of <paramref name="solution"/>; status InvalidMeasurement when a rate is undetermined (NaN).</summary>
    public BalanceOutcome Check(FluxSolution solution)
    {
        int m = _measured.Length;
        Array.Clear(_covariance);
        for (int i = 0; i < m; i++)
        {
            double q = solution.Exchange[_fromExchange[i]];
            _measured[i] = q;
            double sigma = (RelativeSigma * Math.Abs(q)) + SigmaFloorRateUnits;
            _covariance[(i * m) + i] = sigma * sigma;
        }

        return _solver.Solve(_measured, _covariance, _rates, []);
    }
}
