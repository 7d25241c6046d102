using System.Text.Json;
using System.Text.Json.Serialization;
using SoftSensor.Core.Estimation;
using SoftSensor.Core.Gas;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Replay;

/// <summary>Reads and validates a replay configuration, its model, and builds the cycle; every fault names the key.</summary>
internal static class ReplayConfigLoader
{
    private static readonly JsonSerializerOptions Options = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        PropertyNameCaseInsensitive = false,
        ReadCommentHandling = JsonCommentHandling.Skip,
        AllowTrailingCommas = true,
        UnmappedMemberHandling = JsonUnmappedMemberHandling.Disallow,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.CamelCase, allowIntegerValues: false) },
    };

    /// <summary>Parses the configuration text; false with a message naming the key and the value at fault.</summary>
    public static bool TryParse(string json, out ReplayConfig? config, out string? error)
    {
        config = null;
        try
        {
            config = JsonSerializer.Deserialize<ReplayConfig>(json, Options);
        }
        catch (JsonException e)
        {
            error = $"replay configuration at {e.Path ?? "$"}: {e.Message.Split(" Path:")[0]}";
            return false;
        }

        if (config is null)
        {
            error = "replay configuration is null; expected an object";
            return false;
        }

        var errors = new List<string>();
        if (config.History.Columns.Count == 0)
        {
            errors.Add("history.columns is empty; expected at least the gas flows and the analyser readings");
        }

        if (string.IsNullOrWhiteSpace(config.Model))
        {
            errors.Add("model is empty; expected the path of a stoichiometric model file");
        }

        if (config.Gas.Inlet is not ("measured" or "gasLines"))
        {
            errors.Add($"gas.inlet is '{config.Gas.Inlet}'; expected measured or gasLines");
        }

        if (!(config.Gas.MaxInputAgeS > 0))
        {
            errors.Add($"gas.maxInputAgeS is {config.Gas.MaxInputAgeS}; expected a number of seconds > 0");
        }

        if (config.ReportPoints is < 10 or > 100_000)
        {
            errors.Add($"reportPoints is {config.ReportPoints}; expected 10 to 100000");
        }

        errors.AddRange(CycleSettingsOf(config).Validate().Select(e => e.StartsWith("Feed.", StringComparison.Ordinal) || char.IsUpper(e[0]) ? "estimator/balance: " + e : e));
        error = errors.Count > 0 ? string.Join("; ", errors) : null;
        return errors.Count == 0;
    }

    /// <summary>The cycle settings a configuration implies.</summary>
    public static CycleSettings CycleSettingsOf(ReplayConfig c)
    {
        var g = c.Gas;
        var balance = GasBalanceSettings.Default with
        {
            Reference = ReferenceConditions.FromCelsius(g.ReferenceTemperatureC, g.ReferencePressureKPa),
            Accuracy = new MeasurementAccuracy(g.O2AccuracyPercentAbs, g.Co2AccuracyPercentAbs, g.FlowAccuracyPercentOfReading),
            MinAerationNlPerMin = g.MinimumFlowNlPerMin,
        };
        var lines = InstalledGasLines.None;
        foreach (var col in c.History.Columns)
        {
            lines |= col.Role switch
            {
                "AirFlowNlPerMin" => InstalledGasLines.Air,
                "OxygenFlowNlPerMin" => InstalledGasLines.Oxygen,
                "NitrogenFlowNlPerMin" => InstalledGasLines.Nitrogen,
                "CarbonDioxideFlowNlPerMin" => InstalledGasLines.CarbonDioxide,
                _ => InstalledGasLines.None,
            };
        }

        var inlet = g.Inlet == "measured" ? InletSource.Measured : InletSource.GasLines;
        var gas = new AlignedGasBalanceSettings(balance, lines, inlet, g.AirCo2Fraction, AnalyserBasis.Dry, double.NaN, TimeSpan.FromSeconds(g.MaxInputAgeS));
        return EstimatorSetup.Settings(gas, c.Estimator, c.Balance);
    }

    /// <summary>Reads the configuration file and its model and builds the cycle; false with a message naming the file and the key.</summary>
    public static bool TryLoad(string path, out ReplayConfig? config, out Cycle? cycle, out string? error)
    {
        cycle = null;
        if (!TryParse(File.ReadAllText(path), out config, out error))
        {
            error = $"{path}: {error}";
            return false;
        }

        string modelPath = Path.IsPathRooted(config!.Model) ? config.Model : Path.Combine(Path.GetDirectoryName(Path.GetFullPath(path))!, config.Model);
        if (!File.Exists(modelPath))
        {
            error = $"{path}: model '{config.Model}' does not exist (looked for {modelPath})";
            return false;
        }

        if (!EstimatorSetup.TryLoadModel(modelPath, out var model, out error))
        {
            return false;
        }

        try
        {
            cycle = new Cycle(model!, CycleSettingsOf(config));
        }
        catch (ArgumentException e)
        {
            error = $"{path}: {e.Message}";
            return false;
        }

        error = null;
        return true;
    }
}
