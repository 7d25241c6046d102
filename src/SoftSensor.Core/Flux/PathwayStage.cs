using MathNet.Numerics.Distributions;

namespace SoftSensor.Core.Flux;

/// <summary>
/// The pathway model as a second estimator in every cycle (docs/pathway.md). From the measured
/// substrate uptake (or, without one, from OUR) and the ATP balance it predicts growth, OUR, CER and
/// the overflow product; the gas rates not used as basis are its residual. A Kalman filter on the
/// slowly drifting energy parameter (a random walk: θ_k = θ_(k-1) + w, var(w) = q² Δt; Jazwinski
/// 1970, Stochastic Processes and Filtering Theory) updates the tracked parameter from that
/// residual; the normalised innovation squared e^T S^-1 e, χ² with one or two degrees of freedom
/// when model and data agree (Bar-Shalom, Li &amp; Kirubarajan 2001, Estimation with Applications to
/// Tracking and Navigation, §5.4), is the consistency between the two estimators. With one
/// informative residual the P/O ratio and m_ATP are not separately identifiable (both only move the
/// ATP balance): one is tracked, the other held (<see cref="PathwaySettings.Tracked"/>).
/// Allocation-free per cycle; not thread-safe (one per reactor).
/// </summary>
public sealed class PathwayStage
{
    private readonly PathwaySettings _s;
    private readonly double[] _critical;
    private readonly double _gate2;
    private readonly double[] _u = new double[PathwayResponse.BasisCount];
    private readonly double[] _rates;

    /// <summary>Compiles <paramref name="model"/> for the cycle.</summary>
    public PathwayStage(FluxModel model, PathwaySettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var errors = settings.Validate();
        if (errors.Count > 0)
        {
            throw new ArgumentException("pathway settings: " + string.Join("; ", errors), nameof(settings));
        }

        _s = settings;
        Response = new PathwayResponse(model, settings.OverflowReaction);
        _gate2 = ChiSquared.InvCDF(2, 1 - settings.GateAlpha);
        _rates = new double[Response.CompoundCount];
        _critical = new double[(2 * settings.Window) + 1];
        for (int d = 1; d < _critical.Length; d++)
        {
            _critical[d] = ChiSquared.InvCDF(d, 1 - settings.Alpha);
        }
    }

    /// <summary>The compiled network.</summary>
    public PathwayResponse Response { get; }

    /// <summary>The settings.</summary>
    public PathwaySettings Settings => _s;

    /// <summary>Predicted exchange rates of the last cycle, model compound order (rate units).</summary>
    public ReadOnlySpan<double> PredictedRates => _rates;

    /// <summary>Runs one cycle: predict the parameters forward, solve, test, update.</summary>
    public void Run(in PathwayInputs x, PathwayState state, ref PathwayOutputs o)
    {
        o = PathwayOutputs.Empty;
        var r = Response;
        if (!state.Initialised)
        {
            state.PoRatio = r.ModelPoRatio;
            state.PoVariance = _s.PoSigma * _s.PoSigma;
            state.MaintenanceAtp = r.ModelMaintenanceAtpPerCmmolH;
            double ms = _s.MaintenanceRelativeSigma * r.ModelMaintenanceAtpPerCmmolH;
            state.MaintenanceVariance = ms * ms;
            state.Initialised = true;
        }

        // Random walk: only the tracked parameter drifts; the held one keeps its prior.
        double dt = double.IsFinite(x.DtH) && x.DtH > 0 ? x.DtH : 0;
        bool trackPo = _s.Tracked == TrackedEnergyParameter.PoRatio;
        if (trackPo)
        {
            state.PoVariance += _s.PoRandomWalkPerSqrtH * _s.PoRandomWalkPerSqrtH * dt;
        }
        else
        {
            double q = _s.MaintenanceRandomWalkRelativePerSqrtH * r.ModelMaintenanceAtpPerCmmolH;
            state.MaintenanceVariance += q * q * dt;
        }

        Publish(state, ref o);
        double xg = x.BiomassGPerL;
        if (!(double.IsFinite(xg) && xg > 0))
        {
            return;
        }

        double xc = xg / r.BiomassWeighedGPerCmol * 1000.0;
        double xSigma = Math.Max(double.IsFinite(x.BiomassSigmaGPerL) ? x.BiomassSigmaGPerL : 0, _s.BiomassRelativeSigmaFloor * xg) / r.BiomassWeighedGPerCmol * 1000.0;
        bool gas = double.IsFinite(x.OurMmolPerLh) && double.IsFinite(x.CerMmolPerLh) && x.OurSigmaMmolPerLh > 0 && x.CerSigmaMmolPerLh > 0;
        bool substrate = double.IsFinite(x.SubstrateCmmolPerLh) && x.SubstrateCmmolPerLh < 0 && x.SubstrateSigmaCmmolPerLh > 0;
        var basis = substrate ? PathwayBasis.Substrate : gas ? PathwayBasis.Oxygen : PathwayBasis.None;
        if (basis == PathwayBasis.None)
        {
            return;
        }

        double po = state.PoRatio, m = state.MaintenanceAtp, sub = x.SubstrateCmmolPerLh, our = x.OurMmolPerLh;
        if (substrate && gas && our - (2 * x.OurSigmaMmolPerLh) > r.SubstrateGamma * -sub / 4.0)
        {
            // More O2 than burning all the fed substrate could take (electron balance, gamma(O2) = -4):
            // the culture eats something besides the feed (residual substrate, a by-product), so the
            // feed is not its uptake; OUR is the basis this cycle.
            basis = PathwayBasis.Oxygen;
            substrate = false;
        }

        if (substrate && double.IsFinite(_s.RespiratoryCapacityO2MmolPerGh))
        {
            double cap = _s.RespiratoryCapacityO2MmolPerGh * xg;
            o.CriticalUptakeCmmolPerLh = CriticalUptake(po, m, xc, cap);
            // Overflow: the model's split puts the uptake above the capacity, and the measured OUR
            // confirms that respiration is capped (below what the respiratory regime would need).
            if (r.HasOverflow && -sub > o.CriticalUptakeCmmolPerLh
                && (!gas || (Predict(PathwayBasis.Substrate, po, m, xc, sub, our, out double ourResp, out _, out _) && our < ourResp - (2 * x.OurSigmaMmolPerLh))))
            {
                o.Overflow = true;
                basis = PathwayBasis.SubstrateAndOxygen;
                our = gas ? our : cap;
            }
        }

        if (!Predict(basis, po, m, xc, sub, our, out double ourHat, out double cerHat, out double rx))
        {
            return;
        }

        r.Rates(_u, _rates);
        o.Basis = basis;
        o.OverflowProductCmmolPerLh = r.OverflowProductIndex >= 0 ? _rates[r.OverflowProductIndex] : double.NaN;

        // Sensitivities (central differences; each a 3x3 solve): parameters, the basis rate, the biomass.
        double dPo = 1e-4, dM = 1e-4 * Math.Max(m, 1e-6), dX = 1e-4 * xc;
        double dS = 1e-4 * Math.Max(Math.Abs(sub), 1e-6), dO = 1e-4 * Math.Max(Math.Abs(our), 1e-6);
        var jPo = Diff(basis, po, m, xc, sub, our, dPo, 0, 0, 0, 0);
        var jM = Diff(basis, po, m, xc, sub, our, 0, dM, 0, 0, 0);
        var jX = Diff(basis, po, m, xc, sub, our, 0, 0, dX, 0, 0);
        var jS = basis != PathwayBasis.Oxygen ? Diff(basis, po, m, xc, sub, our, 0, 0, 0, dS, 0) : default;
        var jO = basis != PathwayBasis.Substrate ? Diff(basis, po, m, xc, sub, our, 0, 0, 0, 0, dO) : default;
        double vPo = state.PoVariance, vM = state.MaintenanceVariance, vX = xSigma * xSigma;
        double vS = x.SubstrateSigmaCmmolPerLh * x.SubstrateSigmaCmmolPerLh;
        double vO = gas ? x.OurSigmaMmolPerLh * x.OurSigmaMmolPerLh : Math.Pow(_s.ModelRelativeSigma * our, 2);
        double rel = _s.ModelRelativeSigma;

        // Prediction covariance of (OUR, CER, r_X) from everything but the tracked parameter.
        double Cov(in Sens a, in Sens b, int i, int k) => (Get(a, i) * Get(b, k));
        double NuisanceCov(int i, int k)
        {
            double c = (trackPo ? Cov(jM, jM, i, k) * vM : Cov(jPo, jPo, i, k) * vPo) + (Cov(jX, jX, i, k) * vX);
            c += basis != PathwayBasis.Oxygen ? Cov(jS, jS, i, k) * vS : 0;
            c += basis != PathwayBasis.Substrate ? Cov(jO, jO, i, k) * vO : 0;
            return c;
        }

        var jT = trackPo ? jPo : jM;
        double vT = trackPo ? vPo : vM;
        double ourVar = NuisanceCov(0, 0) + (jT.Our * jT.Our * vT) + Math.Pow(rel * ourHat, 2);
        double cerVar = NuisanceCov(1, 1) + (jT.Cer * jT.Cer * vT) + Math.Pow(rel * cerHat, 2);
        double muVar = (NuisanceCov(2, 2) + (jT.Rx * jT.Rx * vT) + Math.Pow(rel * rx, 2)) / (xc * xc) + (rx * rx / Math.Pow(xc, 4) * vX);
        o.MuPerH = rx / xc;
        o.MuSigmaPerH = Math.Sqrt(muVar);
        o.PredictedOurMmolPerLh = ourHat;
        o.PredictedCerMmolPerLh = cerHat;
        o.PredictedOurSigmaMmolPerLh = basis == PathwayBasis.Substrate ? Math.Sqrt(ourVar) : x.OurSigmaMmolPerLh;
        o.PredictedCerSigmaMmolPerLh = Math.Sqrt(cerVar);
        if (!gas)
        {
            return;
        }

        // Innovation of the gas rates not used as basis, and its covariance S.
        if (basis == PathwayBasis.Substrate)
        {
            double e0 = x.OurMmolPerLh - ourHat, e1 = x.CerMmolPerLh - cerHat;
            double s00 = (x.OurSigmaMmolPerLh * x.OurSigmaMmolPerLh) + NuisanceCov(0, 0) + Math.Pow(rel * ourHat, 2) + (jT.Our * jT.Our * vT);
            double s11 = (x.CerSigmaMmolPerLh * x.CerSigmaMmolPerLh) + NuisanceCov(1, 1) + Math.Pow(rel * cerHat, 2) + (jT.Cer * jT.Cer * vT);
            double s01 = (double.IsFinite(x.OurCerCovariance) ? x.OurCerCovariance : 0) + NuisanceCov(0, 1) + (jT.Our * jT.Cer * vT);
            double det = (s00 * s11) - (s01 * s01);
            if (!(det > 0))
            {
                return;
            }

            double i00 = s11 / det, i11 = s00 / det, i01 = -s01 / det;
            double nis = (e0 * e0 * i00) + (2 * e0 * e1 * i01) + (e1 * e1 * i11);
            Window(state, nis, 2, ref o);
            if (nis > _gate2 && ++state.GatedCycles < _s.GatePersistence)
            {
                Publish(state, ref o);
                return;
            }

            if (state.GatedCycles >= _s.GatePersistence)
            {
                // A persistent change: restart the tracked parameter from its prior variance (the filter forgets).
                double prior = trackPo ? _s.PoSigma * _s.PoSigma : Math.Pow(_s.MaintenanceRelativeSigma * r.ModelMaintenanceAtpPerCmmolH, 2);
                double add = Math.Max(0, prior - vT);
                vT += add;
                s00 += jT.Our * jT.Our * add;
                s11 += jT.Cer * jT.Cer * add;
                s01 += jT.Our * jT.Cer * add;
                det = (s00 * s11) - (s01 * s01);
                (i00, i11, i01) = (s11 / det, s00 / det, -s01 / det);
                if (trackPo)
                {
                    state.PoVariance = vT;
                }
                else
                {
                    state.MaintenanceVariance = vT;
                }
            }

            state.GatedCycles = 0;
            // K = P H^T S^-1 (a row of two); θ += K e; P -= K H P.
            double k0 = vT * ((jT.Our * i00) + (jT.Cer * i01));
            double k1 = vT * ((jT.Our * i01) + (jT.Cer * i11));
            Update(state, trackPo, (k0 * e0) + (k1 * e1), vT * ((k0 * jT.Our) + (k1 * jT.Cer)));
        }
        else
        {
            // One residual: CER (OUR is the basis, so its noise enters the prediction and correlates with the measured CER).
            double e = x.CerMmolPerLh - cerHat;
            double cov = double.IsFinite(x.OurCerCovariance) ? x.OurCerCovariance : 0;
            double s = (x.CerSigmaMmolPerLh * x.CerSigmaMmolPerLh) + NuisanceCov(1, 1) + Math.Pow(rel * cerHat, 2) + (jT.Cer * jT.Cer * vT) - (2 * jO.Cer * cov);
            if (!(s > 0))
            {
                return;
            }

            // No update here: with OUR as the basis the CER residual hardly moves with P/O or m_ATP
            // (the RQ of growth and of respiration are close), so the model's own error would drive them.
            Window(state, e * e / s, 1, ref o);
        }

        Publish(state, ref o);
    }

    private void Window(PathwayState state, double nis, int dof, ref PathwayOutputs o)
    {
        if (!double.IsFinite(nis))
        {
            return;
        }

        state.Innovations[state.Next] = nis;
        state.InnovationDof[state.Next] = dof;
        state.Next = (state.Next + 1) % _s.Window;
        state.Filled = Math.Min(state.Filled + 1, _s.Window);
        double sum = 0;
        int d = 0;
        for (int i = 0; i < state.Filled; i++)
        {
            sum += state.Innovations[i];
            d += state.InnovationDof[i];
        }

        o.Statistic = sum;
        o.DegreesOfFreedom = d;
        o.Critical = _critical[d];
    }

    /// <summary>The largest substrate uptake (C-mmol/(L·h), positive) whose respiration stays within <paramref name="ourCap"/> at the parameters given; the model is affine in the uptake.</summary>
    public double CriticalUptake(double po, double m, double xc, double ourCap)
    {
        var r = Response;
        if (!PathwaySolve.Solve(r, PathwayBasis.Substrate, po, m, xc, 0, 0, _u))
        {
            return double.NaN;
        }

        double our0 = -r.Rate(r.OxygenIndex, _u);
        if (!PathwaySolve.Solve(r, PathwayBasis.Substrate, po, m, xc, -1, 0, _u))
        {
            return double.NaN;
        }

        double slope = -r.Rate(r.OxygenIndex, _u) - our0;
        return slope > 0 ? Math.Max(0, (ourCap - our0) / slope) : double.NaN;
    }

    private void Update(PathwayState state, bool trackPo, double step, double reduction)
    {
        if (!double.IsFinite(step) || !double.IsFinite(reduction))
        {
            return;
        }

        if (trackPo)
        {
            state.PoRatio = Math.Clamp(state.PoRatio + step, _s.PoMinimum, _s.PoMaximum);
            state.PoVariance = Math.Max(state.PoVariance - reduction, 1e-12);
        }
        else
        {
            state.MaintenanceAtp = Math.Max(state.MaintenanceAtp + step, 0);
            state.MaintenanceVariance = Math.Max(state.MaintenanceVariance - reduction, 1e-18);
        }
    }

    private void Publish(PathwayState state, ref PathwayOutputs o)
    {
        // m_ATP per gram dry weight: per C-mmol × C-mmol per g.
        double perGram = 1000.0 / Response.BiomassWeighedGPerCmol;
        o.PoRatio = state.PoRatio;
        o.PoSigma = Math.Sqrt(state.PoVariance);
        o.MaintenanceAtpMmolPerGh = state.MaintenanceAtp * perGram;
        o.MaintenanceSigmaAtpMmolPerGh = Math.Sqrt(state.MaintenanceVariance) * perGram;
    }

    private bool Predict(PathwayBasis basis, double po, double m, double xc, double sub, double our, out double ourHat, out double cerHat, out double rx)
    {
        var r = Response;
        if (!PathwaySolve.Solve(r, basis, po, m, xc, sub, our, _u))
        {
            ourHat = cerHat = rx = double.NaN;
            return false;
        }

        ourHat = -r.Rate(r.OxygenIndex, _u);
        cerHat = r.CarbonDioxideIndex >= 0 ? r.Rate(r.CarbonDioxideIndex, _u) : double.NaN;
        rx = _u[PathwayResponse.Growth];
        return true;
    }

    private Sens Diff(PathwayBasis basis, double po, double m, double xc, double sub, double our, double dPo, double dM, double dX, double dS, double dO)
    {
        double d = dPo + dM + dX + dS + dO;
        Predict(basis, po + dPo, m + dM, xc + dX, sub + dS, our + dO, out double o1, out double c1, out double r1);
        Predict(basis, po - dPo, m - dM, xc - dX, sub - dS, our - dO, out double o0, out double c0, out double r0);
        Predict(basis, po, m, xc, sub, our, out _, out _, out _); // leaves _u at the nominal solution
        return new Sens((o1 - o0) / (2 * d), (c1 - c0) / (2 * d), (r1 - r0) / (2 * d));
    }

    private static double Get(in Sens s, int i) => i switch { 0 => s.Our, 1 => s.Cer, _ => s.Rx };

    private readonly record struct Sens(double Our, double Cer, double Rx);
}
