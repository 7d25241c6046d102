using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Flux;

/// <summary>
/// Live use of a flux model in the cycle (docs/methods.md §3): with the biomass formation rate r_X as
/// basis, every exchange rate is affine in r_X, q = a r_X + b m_ATP X (the maintenance term b from
/// Pirt's law). Given measured rates y_i (e.g. O2 = -OUR, CO2 = CER, substrate = -feed) with
/// standard deviations sigma_i, the weighted least-squares estimate is
///   r_X = sum(a_i (y_i - b_i m X) / sigma_i^2) / sum(a_i^2 / sigma_i^2),  var(r_X) = 1 / sum(a_i^2 / sigma_i^2),
/// and the gaps y_i - q_i show a drift of P/O or maintenance, or a change of metabolism.
/// Set up once; <see cref="Estimate"/> allocates nothing and is safe to call from several threads.
/// </summary>
public sealed class FluxEstimator
{
    private readonly double[] _perBiomass;
    private readonly double[] _perMaintenance;
    private readonly int[] _measured;
    private readonly double _maintenance;

    /// <summary>Builds the estimator for the compounds <paramref name="measuredCompounds"/> (ids, in the order values will come).</summary>
    /// <exception cref="ArgumentException">The model has no biomass compound, a measured id is unknown, or biomass growth does not determine every exchange rate.</exception>
    public FluxEstimator(FluxNetwork network, IReadOnlyList<string> measuredCompounds)
    {
        Network = network;
        var model = network.Model;
        var biomass = model.Biomass ?? throw new ArgumentException($"model '{model.Name}' has no compound with role biomass", nameof(network));
        var solver = new FluxSolver(network, [biomass.Id]);
        var undetermined = Enumerable.Range(0, model.Compounds.Count)
            .Where(j => network.InNetwork[j] && !solver.IsExchangeDetermined(j)).Select(j => model.Compounds[j].Id).ToList();
        if (undetermined.Count > 0)
        {
            throw new ArgumentException($"model '{model.Name}': the biomass rate does not determine the rates of {string.Join(", ", undetermined)}; fix splits or add reactions", nameof(network));
        }

        _measured = new int[measuredCompounds.Count];
        for (int i = 0; i < _measured.Length; i++)
        {
            _measured[i] = model.CompoundIndex(measuredCompounds[i]);
            if (_measured[i] < 0)
            {
                throw new ArgumentException($"measured '{measuredCompounds[i]}' is not a compound of model '{model.Name}'", nameof(measuredCompounds));
            }
        }

        MeasuredCompounds = measuredCompounds;
        _maintenance = model.Maintenance?.AtpMmolPerCmmolBiomassPerH ?? 0;

        // Unit responses: r_X = 1 with no maintenance, then maintenance flux = 1 with no growth.
        var s = solver.CreateSolution();
        _perBiomass = new double[model.Compounds.Count];
        _perMaintenance = new double[model.Compounds.Count];
        solver.Solve([1.0], 0.0, s);
        Array.Copy(s.Exchange, _perBiomass, _perBiomass.Length);
        if (_maintenance > 0)
        {
            solver.Solve([0.0], 1.0 / _maintenance, s);
            Array.Copy(s.Exchange, _perMaintenance, _perMaintenance.Length);
        }

        ZeroUnused(network, _perBiomass);
        ZeroUnused(network, _perMaintenance);
    }

    /// <summary>The compiled network.</summary>
    public FluxNetwork Network { get; }

    /// <summary>Ids of the measured compounds, in the order of the values passed to <see cref="Estimate"/>.</summary>
    public IReadOnlyList<string> MeasuredCompounds { get; }

    /// <summary>An estimator for the off-gas rates: the compounds with roles oxygen and carbonDioxide, in that order.</summary>
    public static FluxEstimator ForGas(FluxNetwork network)
    {
        var o2 = network.Model.Compounds.FirstOrDefault(c => c.Role == CompoundRole.Oxygen) ?? throw new ArgumentException($"model '{network.Model.Name}' has no compound with role oxygen", nameof(network));
        var co2 = network.Model.Compounds.FirstOrDefault(c => c.Role == CompoundRole.CarbonDioxide) ?? throw new ArgumentException($"model '{network.Model.Name}' has no compound with role carbonDioxide", nameof(network));
        return new FluxEstimator(network, [o2.Id, co2.Id]);
    }

    /// <summary>Exchange rates per unit biomass rate (rate units per C-mmol biomass), model compound order.</summary>
    public ReadOnlySpan<double> RatesPerBiomass => _perBiomass;

    /// <summary>
    /// Estimates r_X from <paramref name="measured"/> (exchange convention: production &gt; 0, so O2 is -OUR)
    /// with <paramref name="sigma"/>; a NaN value or a sigma that is not finite and &gt; 0 leaves that
    /// measurement out. Writes every predicted exchange rate (model compound order) and each gap
    /// measured - predicted (NaN for one left out).
    /// </summary>
    public FluxEstimate Estimate(ReadOnlySpan<double> measured, ReadOnlySpan<double> sigma, double biomassCmmolPerL,
        Span<double> predictedExchange, Span<double> gap)
    {
        if (measured.Length != _measured.Length || sigma.Length != _measured.Length || gap.Length != _measured.Length || predictedExchange.Length != _perBiomass.Length)
        {
            throw new ArgumentException($"expected {_measured.Length} measurements, sigmas and gaps and {_perBiomass.Length} predicted rates");
        }

        predictedExchange.Fill(double.NaN);
        gap.Fill(double.NaN);
        bool hasX = double.IsFinite(biomassCmmolPerL) && biomassCmmolPerL >= 0;
        if (_maintenance > 0 && !hasX)
        {
            return new FluxEstimate(FluxEstimateStatus.BiomassConcentrationMissing, double.NaN, double.NaN, double.NaN, double.NaN, 0, 0);
        }

        double maintFlux = _maintenance > 0 ? _maintenance * biomassCmmolPerL : 0;
        double num = 0, den = 0;
        int used = 0;
        for (int i = 0; i < _measured.Length; i++)
        {
            double a = _perBiomass[_measured[i]];
            if (!Usable(measured[i], sigma[i]) || a == 0)
            {
                continue;
            }

            double w = 1.0 / (sigma[i] * sigma[i]);
            num += a * (measured[i] - _perMaintenance[_measured[i]] * maintFlux) * w;
            den += a * a * w;
            used++;
        }

        if (used == 0 || !(den > 0))
        {
            return new FluxEstimate(FluxEstimateStatus.NoInformation, double.NaN, double.NaN, double.NaN, double.NaN, 0, 0);
        }

        double rx = num / den;
        for (int j = 0; j < predictedExchange.Length; j++)
        {
            predictedExchange[j] = _perBiomass[j] * rx + _perMaintenance[j] * maintFlux;
        }

        double chi2 = 0;
        for (int i = 0; i < _measured.Length; i++)
        {
            if (Usable(measured[i], sigma[i]) && _perBiomass[_measured[i]] != 0)
            {
                gap[i] = measured[i] - predictedExchange[_measured[i]];
                chi2 += gap[i] * gap[i] / (sigma[i] * sigma[i]);
            }
        }

        double mu = hasX && biomassCmmolPerL > 0 ? rx / biomassCmmolPerL : double.NaN;
        return new FluxEstimate(FluxEstimateStatus.Estimated, rx, 1.0 / Math.Sqrt(den), mu, chi2, used - 1, used);
    }

    private static bool Usable(double value, double sigma) => double.IsFinite(value) && double.IsFinite(sigma) && sigma > 0;

    private static void ZeroUnused(FluxNetwork network, double[] rates)
    {
        for (int j = 0; j < rates.Length; j++)
        {
            if (!network.InNetwork[j] || double.IsNaN(rates[j]))
            {
                rates[j] = 0;
            }
        }
    }
}
