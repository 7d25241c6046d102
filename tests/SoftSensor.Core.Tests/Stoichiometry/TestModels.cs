using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Tests.Stoichiometry;

/// <summary>Models shared by the stoichiometry tests (formulas from docs/methods.md §2.1; roles as in config/models).</summary>
internal static class TestModels
{
    /// <summary>The four-compound case of docs/methods.md §6 with the carbon and degree-of-reduction balances.</summary>
    public const string FourCompoundJson = """
        {
          "name": "hand-worked reconciliation case",
          "compounds": {
            "substrate": { "formula": "C6H12O6", "role": "substrate" },
            "o2":        { "formula": "O2", "role": "oxygen" },
            "co2":       { "formula": "CO2", "role": "carbonDioxide" },
            "biomass":   { "formula": "CH1.8O0.5N0.2", "role": "biomass" },
          },
          "balances": ["C", "gamma"]
        }
        """;

    /// <summary>Aerobic growth on glucose with all elements balanced (docs/methods.md §2.3 and 6); biomass without ash.</summary>
    public const string AerobicGlucoseJson = """
        {
          "name": "aerobic growth on glucose",
          "compounds": {
            "glucose": { "formula": "C6H12O6", "role": "substrate" },
            "o2":      { "formula": "O2", "role": "oxygen" },
            "nh3":     { "formula": "NH3", "role": "nitrogenSource" },
            "biomass": { "formula": "CH1.8O0.5N0.2", "role": "biomass" },
            "co2":     { "formula": "CO2", "role": "carbonDioxide" },
            "h2o":     { "formula": "H2O", "role": "water" }
          }
        }
        """;

    /// <summary>The six-compound demo model (bacterium on glycerol) plus acetate as a candidate product.</summary>
    public const string GlycerolJson = """
        {
          // demo scenario of our own: a bacterium on glycerol
          "name": "aerobic bacterium on glycerol",
          "compounds": {
            "glycerol": { "formula": "C3H8O3", "role": "substrate" },
            "o2":       { "formula": "O2",     "role": "oxygen" },
            "co2":      { "formula": "CO2",    "role": "carbonDioxide" },
            "nh3":      { "formula": "NH3",    "role": "nitrogenSource" },
            "h2o":      { "formula": "H2O",    "role": "water" },
            "biomass":  { "formula": "CH1.8O0.5N0.2", "role": "biomass", "ashFraction": 0.06 },
            "acetate":  { "formula": "C2H4O2", "role": "candidate" },
          },
        }
        """;

    public static StoichiometricModel FourCompound => ModelReader.Parse(FourCompoundJson);

    public static StoichiometricModel AerobicGlucose => ModelReader.Parse(AerobicGlucoseJson);

    public static StoichiometricModel Glycerol => ModelReader.Parse(GlycerolJson);

    /// <summary>Diagonal covariance from standard deviations, row-major.</summary>
    public static double[] Diagonal(params double[] sigmas)
    {
        int m = sigmas.Length;
        var psi = new double[m * m];
        for (int i = 0; i < m; i++)
        {
            psi[(i * m) + i] = sigmas[i] * sigmas[i];
        }

        return psi;
    }

    /// <summary>Diagonal covariance with a relative standard deviation of every value.</summary>
    public static double[] Relative(double fraction, params double[] values) =>
        Diagonal(values.Select(v => Math.Abs(v) * fraction).ToArray());
}
