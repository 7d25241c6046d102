namespace SoftSensor.Core.Stoichiometry;

/// <summary>What a diagnosis hypothesis assumes (van der Heijden et al. 1994b, Biotechnol. Bioeng. 44).</summary>
public enum HypothesisKind
{
    /// <summary>One measurement is in error: it is moved to the unknowns.</summary>
    MeasurementInError,

    /// <summary>A candidate product is made but missing from the model: it is added as an unknown.</summary>
    MissingProduct,
}

/// <summary>One hypothesis of the gross-error diagnosis.</summary>
/// <param name="Kind">What it assumes.</param>
/// <param name="CompoundId">The suspect measurement or the missing product.</param>
public readonly record struct Hypothesis(HypothesisKind Kind, string CompoundId)
{
    /// <summary>Text used in outputs, e.g. <c>o2 measurement in error</c>, <c>acetate missing</c>.</summary>
    public string Description => Kind == HypothesisKind.MeasurementInError
        ? $"{CompoundId} measurement in error"
        : $"{CompoundId} missing from the model";
}

/// <summary>The test of one hypothesis.</summary>
/// <param name="H">h with the hypothesis applied (NaN when it could not be computed).</param>
/// <param name="Dof">Redundancy left under the hypothesis.</param>
/// <param name="Critical">χ² critical value for <see cref="Dof"/> (NaN when Dof = 0).</param>
/// <param name="SuspectRate">The rate of the suspect compound the other measurements imply (NaN when not determined).</param>
public readonly record struct HypothesisOutcome(double H, int Dof, double Critical, double SuspectRate)
{
    /// <summary>True when redundancy is left to test the hypothesis.</summary>
    public bool Testable => Dof > 0 && double.IsFinite(H);

    /// <summary>True when the hypothesis is testable and passes the test.</summary>
    public bool Consistent => Testable && H <= Critical;
}

/// <summary>What the diagnosis concludes.</summary>
public enum DiagnosisVerdict
{
    /// <summary>No redundancy: nothing can be tested.</summary>
    NotTestable,

    /// <summary>The measurements pass the test; no error to diagnose.</summary>
    NotNeeded,

    /// <summary>One redundant relation: the error is detected but cannot be isolated.</summary>
    DetectedNotIsolable,

    /// <summary>Exactly one hypothesis passes: it names the suspect.</summary>
    Isolated,

    /// <summary>Several hypotheses pass: the suspects cannot be told apart.</summary>
    Ambiguous,

    /// <summary>No single hypothesis passes: several errors, or an error the hypotheses do not cover.</summary>
    Unexplained,

    /// <summary>The base solve failed (invalid measurement or covariance).</summary>
    Failed,
}

/// <summary>The diagnosis' conclusion.</summary>
/// <param name="Verdict">What it concludes.</param>
/// <param name="Base">The test without any hypothesis.</param>
/// <param name="IsolatedIndex">Index into the solver's hypotheses when <see cref="Verdict"/> is Isolated, else -1.</param>
public readonly record struct DiagnosisSummary(DiagnosisVerdict Verdict, BalanceOutcome Base, int IsolatedIndex);
