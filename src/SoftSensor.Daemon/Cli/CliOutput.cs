using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text.Json.Serialization;

namespace SoftSensor.Daemon.Cli;

/// <summary>Output conventions of every verb: human-readable text by default, exactly one JSON document with --json.</summary>
internal static class CliOutput
{
    /// <summary>JSON settings for --json output: camelCase, indented, NaN/Infinity as named literals never appear (they become null).</summary>
    public static JsonSerializerOptions Json { get; } = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        DictionaryKeyPolicy = null,
        WriteIndented = true,
        DefaultIgnoreCondition = JsonIgnoreCondition.Never,
        Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.CamelCase) },
    };

    /// <summary>Writes one JSON document to standard output.</summary>
    public static void WriteJson<T>(TextWriter output, T value) => output.WriteLine(JsonSerializer.Serialize(value, Json));

    /// <summary>A finite double or null, for JSON fields that may be undefined (RQ with zero OUR).</summary>
    public static double? Finite(double value) => double.IsFinite(value) ? value : null;

    /// <summary>Writes a one-line bad-input error to standard error and returns <see cref="ExitCodes.BadInput"/>.</summary>
    /// <summary>Writes one line per problem on stderr ("error: ..."); returns <see cref="ExitCodes.BadInput"/>.</summary>
    public static int Problems(TextWriter error, IEnumerable<string> problems)
    {
        foreach (var p in problems)
        {
            error.WriteLine("error: " + p.ReplaceLineEndings(" "));
        }

        return ExitCodes.BadInput;
    }

    public static int BadInput(TextWriter error, string message)
    {
        error.WriteLine("error: " + message.ReplaceLineEndings(" | "));
        return ExitCodes.BadInput;
    }
}
