using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Daemon.Cli.Balance;

/// <summary>Names and sentences of the balance output.</summary>
internal static class ReportNames
{
    public static string Camel(string s) => char.ToLowerInvariant(s[0]) + s[1..];

    public static string Verdict(DiagnosisVerdict v) => v switch
    {
        DiagnosisVerdict.NotTestable => "no redundancy: the measurements cannot be tested",
        DiagnosisVerdict.NotNeeded => "consistent: no gross error detected",
        DiagnosisVerdict.DetectedNotIsolable => "inconsistent: a gross error is detected but cannot be isolated (one redundant relation)",
        DiagnosisVerdict.Isolated => "inconsistent: one hypothesis explains the error",
        DiagnosisVerdict.Ambiguous => "inconsistent: several hypotheses explain the error; they cannot be told apart",
        DiagnosisVerdict.Unexplained => "inconsistent: no single hypothesis explains the error (several errors, or one not covered)",
        _ => "the solve failed",
    };
}
