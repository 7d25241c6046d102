using SoftSensor.Core.Estimation;
using SoftSensor.Core.Gas;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Daemon.Configuration;

/// <summary>
/// What the live daemon and the replay share to build the one <see cref="Cycle"/>: the cycle
/// settings from the estimator and balance sections, and the model file.
/// </summary>
internal static class EstimatorSetup
{
    /// <summary>The cycle settings of a gas balance, the estimator section and the balance section.</summary>
    public static CycleSettings Settings(AlignedGasBalanceSettings gas, EstimatorSettings estimator, BalanceConfig balance) => new()
    {
        Gas = gas,
        Estimator = estimator,
        SubstrateFromFeed = balance.SubstrateFromFeed,
        SubstrateRelativeSigma = balance.SubstrateRelativeSigma,
        BaseAmmoniaMolPerL = balance.BaseAmmoniaMolPerL ?? double.NaN,
        AmmoniaRelativeSigma = balance.AmmoniaRelativeSigma,
        Alpha = balance.Alpha,
        CerCorrection = CerCorrectionOf(balance.CerCorrection),
        Pk1MediumShift = balance.Pk1MediumShift,
        PhSigma = balance.PhSigma,
        TicFilterTimeConstantH = balance.TicFilterMinutes / 60.0,
    };

    /// <summary>The faults of the estimator and balance sections, prefixed with <paramref name="key"/>.</summary>
    public static IEnumerable<string> Validate(string key, EstimatorSettings estimator, BalanceConfig balance)
    {
        var faults = Settings(AlignedGasBalanceSettings.Default, estimator, balance).Validate().Select(e => $"{key}: {e}");
        return balance.CerCorrection is "none" or "dissolvedInorganicCarbon"
            ? faults
            : faults.Append($"{key}: balance.cerCorrection is '{balance.CerCorrection}'; expected none or dissolvedInorganicCarbon");
    }

    private static CerCorrection CerCorrectionOf(string text) =>
        text == "dissolvedInorganicCarbon" ? CerCorrection.DissolvedInorganicCarbon : CerCorrection.None;

    /// <summary>Reads a stoichiometric model file; false with a message naming the file.</summary>
    public static bool TryLoadModel(string path, out StoichiometricModel? model, out string? error)
    {
        model = null;
        if (!File.Exists(path))
        {
            error = $"model file '{path}' does not exist";
            return false;
        }

        if (!ModelReader.TryParse(File.ReadAllText(path), out model, out var modelError))
        {
            error = $"{path}: {modelError}";
            return false;
        }

        error = null;
        return true;
    }
}
