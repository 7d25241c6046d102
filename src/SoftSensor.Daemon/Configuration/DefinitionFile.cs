using System.Text.Json;

namespace SoftSensor.Daemon.Configuration;

/// <summary>The JSON syntax of one definition file, read as the configuration reader reads it (comments and trailing commas allowed).</summary>
internal static class DefinitionFile
{
    private static readonly JsonDocumentOptions Options = new() { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true };

    /// <summary>"FILE: line L, position P: ..." for a syntax error, or null when the file parses (or does not exist).</summary>
    public static string? SyntaxProblem(string path)
    {
        if (!File.Exists(path))
        {
            return null;
        }

        try
        {
            using var stream = File.OpenRead(path);
            using var _ = JsonDocument.Parse(stream, Options);
            return null;
        }
        catch (JsonException e)
        {
            string message = e.Message;
            int cut = message.IndexOf(" LineNumber:", StringComparison.Ordinal);
            if (cut < 0) cut = message.IndexOf(" Path:", StringComparison.Ordinal);
            message = (cut > 0 ? message[..cut] : message).TrimEnd('.', ' ');
            // The reader counts lines and bytes from 0; editors count both from 1.
            return $"{path}: line {(e.LineNumber ?? 0) + 1}, position {(e.BytePositionInLine ?? 0) + 1}: JSON syntax error ({message})";
        }
    }
}
