using System.Text.Json;
using System.Text.Json.Serialization;

namespace SoftSensor.Simulation.Scenarios;

/// <summary>Reads a scenario file (snake_case JSON, unknown keys rejected) and validates it.</summary>
public static class ScenarioLoader
{
    private static readonly JsonSerializerOptions Options = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        UnmappedMemberHandling = JsonUnmappedMemberHandling.Disallow,
        ReadCommentHandling = JsonCommentHandling.Skip,
        AllowTrailingCommas = true,
    };

    /// <summary>Reads and validates the file; throws <see cref="ScenarioException"/> naming the key.</summary>
    public static Scenario Load(string path)
    {
        string text;
        try
        {
            text = File.ReadAllText(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new ScenarioException($"scenario '{path}': cannot be read ({e.Message})", e);
        }

        return Parse(text, path);
    }

    /// <summary>Parses and validates scenario JSON; <paramref name="origin"/> names it in messages.</summary>
    public static Scenario Parse(string json, string origin = "scenario")
    {
        Scenario? s;
        try
        {
            s = JsonSerializer.Deserialize<Scenario>(json, Options);
        }
        catch (JsonException e)
        {
            string key = string.IsNullOrEmpty(e.Path) ? "(document)" : e.Path;
            throw new ScenarioException($"{origin}: key '{key}': {FirstSentence(e.Message)}", e);
        }

        if (s is null)
        {
            throw new ScenarioException($"{origin}: the document is empty (expected a JSON object)");
        }

        var errors = ScenarioValidator.Validate(s);
        if (errors.Count > 0)
        {
            throw new ScenarioException($"{origin}: " + string.Join("; ", errors));
        }

        return s;
    }

    private static string FirstSentence(string message)
    {
        int cut = message.IndexOf(" Path:", StringComparison.Ordinal);
        return cut > 0 ? message[..cut] : message;
    }
}
