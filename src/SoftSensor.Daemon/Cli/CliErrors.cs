using System.CommandLine;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// The one stderr line of a command line that did not parse: the parser's own messages, plus the
/// list of verbs when none was given and the nearest verb or option for a mistyped one (edit
/// distance, Levenshtein 1966, at most a third of the word).
/// </summary>
internal static class CliErrors
{
    /// <summary>The message (without the leading "error: ") for a failed parse of <paramref name="args"/>.</summary>
    public static string Describe(RootCommand root, ParseResult parse, IReadOnlyList<string> args)
    {
        string verbs = string.Join(", ", root.Subcommands.Select(c => c.Name).Order(StringComparer.Ordinal));
        if (args.Count == 0 || args[0].StartsWith('-') && !parse.Errors.Any(e => e.Message.Contains(args[0], StringComparison.Ordinal)))
        {
            return $"no verb given (expected softsensor <verb> [options]; verbs: {verbs}; softsensor <verb> --help lists a verb's options)";
        }

        var parts = new List<string>();
        bool unrecognised = false, firstUnknownIsVerb = false;
        foreach (var e in parse.Errors)
        {
            string? unknown = Quoted(e.Message);
            bool isUnmatched = unknown is not null && parse.UnmatchedTokens.Contains(unknown);
            if (isUnmatched && (firstUnknownIsVerb || (unrecognised && !unknown!.StartsWith('-'))))
            {
                continue;   // after an unknown verb every word, after an unknown flag its value, only follows from it
            }

            if (isUnmatched && !unrecognised)
            {
                firstUnknownIsVerb = !unknown!.StartsWith('-') && parse.CommandResult.Command.Subcommands.Count > 0;
                unrecognised = true;
                parts.Add(e.Message.TrimEnd('.') + Hint(parse, unknown));
                continue;
            }

            string hint = isUnmatched ? Hint(parse, unknown!) : "";
            parts.Add(e.Message.TrimEnd('.') + hint);
        }

        if (unrecognised && parts.Count > 1)
        {
            // "Required command was not provided" only repeats that the first word was not a verb.
            parts.RemoveAll(p => p.StartsWith("Required command", StringComparison.Ordinal));
        }

        return string.Join("; ", parts);
    }

    private static string Hint(ParseResult parse, string unknown)
    {
        var command = parse.CommandResult.Command;
        bool isOption = unknown.StartsWith('-');
        var names = isOption ? command.Options.SelectMany(o => o.Aliases.Prepend(o.Name)) : command.Subcommands.Select(c => c.Name);
        string word = isOption ? unknown.Split('=')[0] : unknown;
        if (Nearest(word, names) is { } near)
        {
            return $" (did you mean '{near}'?)";
        }

        return !isOption && command.Subcommands.Count > 0
            ? $" (expected one of: {string.Join(", ", command.Subcommands.Select(c => c.Name).Order(StringComparer.Ordinal))})"
            : "";
    }

    /// <summary>The candidate nearest to <paramref name="word"/> within a third of its length (at least 1), or null.</summary>
    public static string? Nearest(string word, IEnumerable<string> candidates)
    {
        int limit = Math.Max(1, word.TrimStart('-').Length / 3);
        string? best = null;
        int bestDistance = int.MaxValue;
        foreach (var c in candidates.Distinct(StringComparer.Ordinal))
        {
            int d = Distance(word, c);
            if (d < bestDistance)
            {
                (best, bestDistance) = (c, d);
            }
        }

        return bestDistance <= limit ? best : null;
    }

    /// <summary>Levenshtein distance: insertions, deletions and substitutions (case-insensitive).</summary>
    public static int Distance(string a, string b)
    {
        a = a.ToLowerInvariant();
        b = b.ToLowerInvariant();
        var previous = new int[b.Length + 1];
        var current = new int[b.Length + 1];
        for (int j = 0; j <= b.Length; j++)
        {
            previous[j] = j;
        }

        for (int i = 1; i <= a.Length; i++)
        {
            current[0] = i;
            for (int j = 1; j <= b.Length; j++)
            {
                int cost = a[i - 1] == b[j - 1] ? 0 : 1;
                current[j] = Math.Min(Math.Min(current[j - 1] + 1, previous[j] + 1), previous[j - 1] + cost);
            }

            (previous, current) = (current, previous);
        }

        return previous[b.Length];
    }

    private static string? Quoted(string message)
    {
        int a = message.IndexOf('\'', StringComparison.Ordinal);
        int b = a < 0 ? -1 : message.IndexOf('\'', a + 1);
        return b > a + 1 ? message[(a + 1)..b] : null;
    }
}
