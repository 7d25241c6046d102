using System.Text;
using System.Text.RegularExpressions;

namespace SoftSensor.Daemon.Tests.Documentation;

/// <summary>
/// Reads the links of a Markdown file and the anchors its headings make. Anchors follow the rule
/// GitHub applies to headings (common practice, from memory): lower case; letters, digits, spaces,
/// '-' and '_' kept, everything else dropped; each space becomes '-'; a repeated slug gets "-1", "-2".
/// </summary>
internal static partial class MarkdownLinks
{
    /// <summary>Targets of the inline links <c>[text](target)</c> and images outside code blocks, with their line numbers.</summary>
    public static IEnumerable<(int Line, string Target)> Links(string markdown)
    {
        int line = 0;
        foreach (var text in ProseLines(markdown))
        {
            line++;
            if (text is null)
            {
                continue;
            }

            foreach (Match m in LinkPattern().Matches(StripCodeSpans(text)))
            {
                yield return (line, m.Groups[1].Value);
            }
        }
    }

    /// <summary>Repository paths written as code spans (<c>`config/demo.json`</c>), with their line numbers, code blocks included.</summary>
    public static IEnumerable<(int Line, string Path)> CodePaths(string markdown)
    {
        int line = 0;
        foreach (var text in markdown.Split('\n'))
        {
            line++;
            foreach (Match m in CodePathPattern().Matches(text))
            {
                yield return (line, m.Groups[1].Value);
            }
        }
    }

    /// <summary>The anchors of every heading outside code blocks.</summary>
    public static HashSet<string> Anchors(string markdown)
    {
        var anchors = new HashSet<string>(StringComparer.Ordinal);
        var seen = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var text in ProseLines(markdown))
        {
            if (text is null || HeadingPattern().Match(text) is not { Success: true } h)
            {
                continue;
            }

            string slug = Slug(h.Groups[1].Value);
            if (seen.TryGetValue(slug, out int n))
            {
                seen[slug] = n + 1;
                slug = $"{slug}-{n + 1}";
            }
            else
            {
                seen[slug] = 0;
            }

            anchors.Add(slug);
        }

        return anchors;
    }

    public static string Slug(string heading)
    {
        var b = new StringBuilder();
        foreach (char c in heading.Trim().ToLowerInvariant())
        {
            if (char.IsLetterOrDigit(c) || c is '-' or '_')
            {
                b.Append(c);
            }
            else if (c == ' ')
            {
                b.Append('-');
            }
        }

        return b.ToString();
    }

    /// <summary>Each line, or null for a line inside (or fencing) a code block.</summary>
    private static IEnumerable<string?> ProseLines(string markdown)
    {
        bool inFence = false;
        foreach (var raw in markdown.Split('\n'))
        {
            string text = raw.TrimEnd('\r');
            if (text.TrimStart().StartsWith("```", StringComparison.Ordinal))
            {
                inFence = !inFence;
                yield return null;
                continue;
            }

            yield return inFence || text.StartsWith("    ", StringComparison.Ordinal) ? null : text;
        }
    }

    private static string StripCodeSpans(string text) => CodeSpanPattern().Replace(text, "");

    [GeneratedRegex(@"!?\[[^\]]*\]\(([^)\s]+)(?:\s+""[^""]*"")?\)")]
    private static partial Regex LinkPattern();

    [GeneratedRegex(@"`[^`]*`")]
    private static partial Regex CodeSpanPattern();

    [GeneratedRegex(@"^#{1,6}\s+(.+?)\s*#*\s*$")]
    private static partial Regex HeadingPattern();

    [GeneratedRegex(@"`((?:config|src|tests|deploy|docs)/[A-Za-z0-9_./-]+)`")]
    private static partial Regex CodePathPattern();
}
