using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Simulation.Kinetics;

/// <summary>
/// The simulated culture: Monod uptake limited by substrate and dissolved O2, Pirt's linear
/// substrate-consumption law (Pirt 1965, Proc. R. Soc. Lond. B 163: qS = mu/Y + m), a small
/// by-product on the respiratory route and, optionally, overflow above a critical specific uptake
/// rate (the respiratory bottleneck of Sonnleitner &amp; Käppeli 1986, Biotechnol. Bioeng. 28).
/// O2 and CO2 follow from the carbon and degree-of-reduction balances (Roels 1983), so every rate
/// vector closes the elemental balances by construction.
/// </summary>
public sealed class CultureModel
{
    private readonly CultureSpec _spec;
    private readonly double _qsMax;
    private double _yield;
    private double _maintenance;

    public CultureModel(CultureSpec spec)
    {
        _spec = spec;
        Substrate = CompoundInfo.Of(spec.Substrate.Name, spec.Substrate.Formula);
        Biomass = CompoundInfo.Of("biomass", spec.Biomass.Formula, spec.Biomass.AshFraction);
        (_yield, _maintenance) = (spec.YieldGPerG, spec.MaintenanceGPerGH);
        At(0);
        spec = spec with { YieldGPerG = _yield, MaintenanceGPerGH = _maintenance };
        Byproduct = spec.Byproduct is { } b ? CompoundInfo.Of(b.Name, b.Formula) : null;
        Overflow = spec.Overflow is { } o ? CompoundInfo.Of(o.Name, o.Formula) : null;
        _qsMax = spec.Overflow is { } ov
            ? ov.CriticalQsGPerGH + Math.Max(0, spec.MuMaxPerH - MuAt(ov.CriticalQsGPerGH)) / Math.Max(ov.FermentativeYieldGPerG, 1e-9)
            : spec.MuMaxPerH / spec.YieldGPerG + spec.MaintenanceGPerGH;
        if (spec.Overflow is { FermentativeYieldGPerG: 0 } ov0)
        {
            _qsMax = Math.Max(ov0.CriticalQsGPerGH, spec.MuMaxPerH / spec.YieldGPerG + spec.MaintenanceGPerGH);
        }
    }

    internal CompoundInfo Substrate { get; }
    internal CompoundInfo Biomass { get; }
    internal CompoundInfo? Byproduct { get; }
    internal CompoundInfo? Overflow { get; }

    /// <summary>With an energy budget (<see cref="CultureSpec.Energetics"/>): sets the yield and maintenance of hour <paramref name="tH"/> (its P/O ratio may step).</summary>
    internal void At(double tH)
    {
        if (_spec.Energetics is { } e)
        {
            PoRatio = CultureEnergetics.PoAt(e, tH);
            (_yield, _maintenance) = CultureEnergetics.Pirt(e, PoRatio, Substrate, Biomass);
        }
    }

    /// <summary>The culture's P/O ratio now (NaN without an energy budget).</summary>
    public double PoRatio { get; private set; } = double.NaN;

    /// <summary>The yield (g/g) and maintenance (g/(g·h)) in force now.</summary>
    public double YieldGPerG => _yield;

    /// <inheritdoc cref="YieldGPerG"/>
    public double MaintenanceGPerGH => _maintenance;

    /// <summary>The largest specific substrate uptake rate, g/(g·h).</summary>
    public double QsMaxGPerGH => _qsMax;

    /// <summary>Grams of dry biomass (ash included) per C-mol of organic biomass.</summary>
    public double BiomassGPerCmol => Biomass.GramsPerCmol;

    /// <summary>Grams of substrate per C-mol.</summary>
    public double SubstrateGPerCmol => Substrate.GramsPerCmol;

    /// <summary>Grams per C-mol of the by-product (NaN without one).</summary>
    public double ByproductGPerCmol => Byproduct?.GramsPerCmol ?? double.NaN;

    /// <summary>Grams per C-mol of the overflow product (NaN without one).</summary>
    public double OverflowGPerCmol => Overflow?.GramsPerCmol ?? double.NaN;

    /// <summary>Growth rate of the respiratory route at a specific uptake rate (Pirt).</summary>
    private double MuAt(double qsGPerGH) => Math.Max(0, _yield * (qsGPerGH - _maintenance));

    /// <summary>Rates at biomass x, substrate s, overflow product p (g/L) and dissolved O2 c (mmol/L).</summary>
    public CultureRates Evaluate(double xGPerL, double sGPerL, double pGPerL, double o2MmolPerL)
    {
        double s = Math.Max(0, sGPerL);
        double c = Math.Max(0, o2MmolPerL);
        double x = Math.Max(0, xGPerL);
        double fO2 = c / (_spec.OxygenKsMmolPerL + c);
        // Without an overflow route O2 limits the whole uptake; with one it limits the respiratory
        // capacity only, and the rest of the uptake ferments (as Crabtree-positive yeasts do).
        double qs = _qsMax * s / (_spec.KsGPerL + s) * (_spec.Overflow is null ? fO2 : 1.0);
        return EvaluateAtUptake(x, qs, Math.Max(0, pGPerL), fO2);
    }

    /// <summary>
    /// Rates when the specific substrate uptake is imposed (a chemostat or a check of the kinetics);
    /// <paramref name="fO2"/> is the O2 saturation term c/(K_O2 + c), 1 without O2 limitation.
    /// </summary>
    public CultureRates EvaluateAtUptake(double xGPerL, double qsGPerGH, double pGPerL, double fO2)
    {
        var o = _spec.Overflow;
        double capacity = o is null ? double.PositiveInfinity : o.CriticalQsGPerGH * fO2;
        double qsOx = Math.Min(qsGPerGH, capacity);
        double excess = qsGPerGH - qsOx;

        // Per gram of biomass and hour, in C-mol: substrate consumed (negative), biomass made.
        double sCmol = -qsGPerGH / Substrate.GramsPerCmol;
        double mu = MuAt(qsOx);
        double bCmol = _spec.Byproduct is { } bp ? bp.CarbonFraction * qsOx / Substrate.GramsPerCmol : 0;
        double pCmol = 0;
        if (o is not null && Overflow is { } ov)
        {
            // Fermentative route: no O2, so its product follows from the degree-of-reduction balance
            // over substrate, biomass and product; the rest of its carbon leaves as CO2.
            double muF = o.FermentativeYieldGPerG * excess;
            double sf = excess / Substrate.GramsPerCmol;
            double xf = muF / Biomass.GramsPerCmol;
            pCmol += (Substrate.Gamma * sf - Biomass.Gamma * xf) / ov.Gamma;
            mu += muF;

            // Re-uptake of the product with the respiratory capacity left over (in electrons).
            if (o.ReuptakeMaxGPerGH > 0 && pGPerL > 0)
            {
                double spareElectrons = Math.Max(0, capacity - qsOx) / Substrate.GramsPerCmol * Substrate.Gamma;
                double want = o.ReuptakeMaxGPerGH * pGPerL / (o.ReuptakeKsGPerL + pGPerL) * fO2 / ov.GramsPerCmol;
                double up = Math.Min(want, spareElectrons / ov.Gamma);
                pCmol -= up;
                mu += o.ReuptakeYieldGPerG * up * ov.GramsPerCmol;
            }
        }

        double xCmol = mu / Biomass.GramsPerCmol;
        double gammaSum = Substrate.Gamma * sCmol + Biomass.Gamma * xCmol
            + (Byproduct?.Gamma ?? 0) * bCmol + (Overflow?.Gamma ?? 0) * pCmol;
        double our = -gammaSum / 4.0;               // sum(gamma_i r_i) - 4 r_O2 = 0, gamma(O2) = -4
        double cer = -(sCmol + xCmol + bCmol + pCmol); // carbon balance
        double k = xGPerL * 1000.0;                   // per g biomass -> per L, mol -> mmol
        double acid = _spec.Byproduct is { IsAcid: true } && Byproduct is { } bpi ? bCmol / bpi.CarbonAtoms : 0;
        return new CultureRates(
            mu, qsGPerGH, xCmol * k, sCmol * k, bCmol * k, pCmol * k, our * k, cer * k,
            Biomass.NitrogenPerCmol * xCmol * k, acid * k);
    }

    /// <summary>Checks that the culture's routes need no negative O2 or CO2 (a mis-specified yield).</summary>
    internal static IEnumerable<string> CheckStoichiometry(CultureSpec spec)
    {
        var m = new CultureModel(spec);
        double qsCrit = spec.Overflow?.CriticalQsGPerGH ?? m.QsMaxGPerGH;
        var r = m.EvaluateAtUptake(1, qsCrit, 0, 1);
        if (r.OurMmolPerLh < 0 || r.CerMmolPerLh < 0)
        {
            yield return $"key 'culture.yield_g_per_g' is {spec.YieldGPerG}: the respiratory route would release O2 or take up CO2 with this substrate and biomass composition (expected a smaller yield)";
        }

        if (spec.Overflow is { } o)
        {
            var f = m.EvaluateAtUptake(1, qsCrit + 1, 0, 1);
            if (f.CerMmolPerLh - r.CerMmolPerLh < 0 || f.OverflowCmmolPerLh < 0)
            {
                yield return $"key 'culture.overflow.fermentative_yield_g_per_g' is {o.FermentativeYieldGPerG}: the fermentative route would take up CO2 (expected a smaller yield)";
            }
        }
    }
}
