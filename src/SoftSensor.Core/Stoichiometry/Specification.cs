using System.Globalization;

namespace SoftSensor.Core.Stoichiometry;

/// <summary>How a specification ties two rates together.</summary>
public enum SpecificationKind
{
    /// <summary>
    /// A yield in rate units (C-mol/C-mol for organics): q_numerator = -Y q_denominator, the usual
    /// positive yield of a product on a consumed substrate (Y_XS = r_X / -r_S).
    /// </summary>
    Yield,

    /// <summary>A ratio of signed rates: q_numerator = R q_denominator (RQ is the ratio co2/o2 = -RQ).</summary>
    Ratio,
}

/// <summary>
/// A known relation between two rates, added to the balances as one more linear equation
/// (docs/methods.md §2.3), e.g. a biomass yield or the RQ. Exact: it carries no uncertainty.
/// </summary>
/// <param name="Kind">Yield or ratio.</param>
/// <param name="Numerator">Compound id on top.</param>
/// <param name="Denominator">Compound id below.</param>
/// <param name="Value">The yield in rate units, or the signed ratio.</param>
public readonly record struct Specification(SpecificationKind Kind, string Numerator, string Denominator, double Value)
{
    /// <summary>A yield in rate units (C-mol/C-mol for organics, mol/mol otherwise).</summary>
    public static Specification Yield(string numerator, string denominator, double value) =>
        new(SpecificationKind.Yield, numerator, denominator, value);

    /// <summary>A ratio of signed rates.</summary>
    public static Specification Ratio(string numerator, string denominator, double value) =>
        new(SpecificationKind.Ratio, numerator, denominator, value);

    /// <summary>
    /// A mass yield (g/g; for biomass grams of dry weight with ash) converted to rate units with the
    /// masses per rate unit of both compounds: Y_rate = Y_mass * (g per rate unit of denominator) / (g per rate unit of numerator).
    /// </summary>
    public static Specification MassYield(StoichiometricModel model, string numerator, string denominator, double gramsPerGram)
    {
        ArgumentNullException.ThrowIfNull(model);
        double y = gramsPerGram * model[denominator].WeighedMassGPerRateUnit / model[numerator].WeighedMassGPerRateUnit;
        return Yield(numerator, denominator, y);
    }

    /// <summary>Coefficient of the numerator in the equation c_num q_num + c_den q_den = 0.</summary>
    internal double NumeratorCoefficient => 1.0;

    /// <summary>Coefficient of the denominator in the equation c_num q_num + c_den q_den = 0.</summary>
    internal double DenominatorCoefficient => Kind == SpecificationKind.Yield ? Value : -Value;

    /// <inheritdoc />
    public override string ToString() =>
        $"{(Kind == SpecificationKind.Yield ? "yield" : "ratio")}:{Numerator}/{Denominator}={Value.ToString("R", CultureInfo.InvariantCulture)}";
}
