using SoftSensor.Daemon.Tests.Fixtures;

namespace SoftSensor.Daemon.Tests.Documentation;

/// <summary>
/// The README and docs/ cite only what the repository holds: every relative link resolves to a file
/// or folder of the repository (and its #anchor to a heading of that file), every repository path
/// written as code exists, and nothing points at notes outside the repository.
/// </summary>
public sealed class DocumentationLinkTests
{
    private static IEnumerable<string> DocumentFiles()
    {
        string root = RepositoryRoot.Path;
        yield return Path.Combine(root, "README.md");
        yield return Path.Combine(root, "DEVELOPERS.md");
        foreach (var f in Directory.EnumerateFiles(Path.Combine(root, "docs"), "*.md", SearchOption.AllDirectories).Order(StringComparer.Ordinal))
        {
            yield return f;
        }
    }

    private static string Rel(string path) => Path.GetRelativePath(RepositoryRoot.Path, path).Replace('\\', '/');

    /// <summary>Every problem of one file's links; empty when all resolve.</summary>
    internal static List<string> LinkProblems(string file, string markdown)
    {
        var problems = new List<string>();
        string root = Path.GetFullPath(RepositoryRoot.Path);
        foreach (var (line, target) in MarkdownLinks.Links(markdown))
        {
            if (target.Contains("://", StringComparison.Ordinal) || target.StartsWith("mailto:", StringComparison.Ordinal))
            {
                continue;
            }

            int hash = target.IndexOf('#', StringComparison.Ordinal);
            string pathPart = hash < 0 ? target : target[..hash];
            string? anchor = hash < 0 ? null : target[(hash + 1)..];
            string resolved = pathPart.Length == 0 ? file : Path.GetFullPath(Path.Combine(Path.GetDirectoryName(file)!, Uri.UnescapeDataString(pathPart)));
            string at = $"{Rel(file)}:{line}: link '{target}'";
            if (!resolved.StartsWith(root + Path.DirectorySeparatorChar, StringComparison.Ordinal))
            {
                problems.Add($"{at} leaves the repository");
            }
            else if (!File.Exists(resolved) && !Directory.Exists(resolved))
            {
                problems.Add($"{at}: {Rel(resolved)} does not exist");
            }
            else if (anchor is not null && resolved.EndsWith(".md", StringComparison.Ordinal)
                && !MarkdownLinks.Anchors(File.ReadAllText(resolved)).Contains(anchor))
            {
                problems.Add($"{at}: no heading of {Rel(resolved)} makes the anchor #{anchor}");
            }
        }

        return problems;
    }

    [Fact]
    public void Every_relative_link_of_the_README_and_docs_resolves_to_a_file_and_heading_of_the_repository()
    {
        var problems = new List<string>();
        int links = 0;
        foreach (var file in DocumentFiles())
        {
            string text = File.ReadAllText(file);
            links += MarkdownLinks.Links(text).Count();
            problems.AddRange(LinkProblems(file, text));
        }

        Assert.True(links >= 40, $"only {links} links found: the reader missed them");
        Assert.True(problems.Count == 0, string.Join("\n", problems));
    }

    [Fact]
    public void Every_repository_path_written_as_code_in_the_README_and_docs_exists()
    {
        var problems = new List<string>();
        int paths = 0;
        foreach (var file in DocumentFiles())
        {
            foreach (var (line, path) in MarkdownLinks.CodePaths(File.ReadAllText(file)))
            {
                // Build output (bin/, obj/) exists only after a build.
                if (path.Contains("/bin/", StringComparison.Ordinal) || path.Contains("/obj/", StringComparison.Ordinal))
                {
                    continue;
                }

                paths++;
                string full = Path.Combine(RepositoryRoot.Path, path.TrimEnd('/'));
                if (!File.Exists(full) && !Directory.Exists(full))
                {
                    problems.Add($"{Rel(file)}:{line}: `{path}` is not in the repository");
                }
            }
        }

        Assert.True(paths >= 20, $"only {paths} paths found: the reader missed them");
        Assert.True(problems.Count == 0, string.Join("\n", problems));
    }

    [Fact]
    public void The_README_and_docs_cite_no_notes_outside_the_repository()
    {
        var problems = new List<string>();
        foreach (var file in DocumentFiles())
        {
            int line = 0;
            foreach (var text in File.ReadAllLines(file))
            {
                line++;
                if (text.Contains("METHODS.md", StringComparison.Ordinal) || text.Contains("../shared", StringComparison.Ordinal)
                    || text.Contains("/work/", StringComparison.Ordinal) || text.Contains("design notes", StringComparison.OrdinalIgnoreCase))
                {
                    problems.Add($"{Rel(file)}:{line}: {text.Trim()}");
                }
            }
        }

        Assert.True(problems.Count == 0, string.Join("\n", problems));
    }

    [Fact]
    public void The_link_check_reports_a_missing_file_a_missing_anchor_and_a_link_out_of_the_repository()
    {
        string file = Path.Combine(RepositoryRoot.Path, "docs", "probe.md");
        const string Markdown = "See [methods](methods.md#1-gas-balance-our-cer-and-rq), [gone](nowhere.md),\n"
            + "[bad anchor](methods.md#no-such-heading), [out](../../outside.md), [web](https://example.org/x.md),\n"
            + "`[not a link](code.md)` and\n\n    [indented code](code.md)\n";

        var problems = LinkProblems(file, Markdown);

        Assert.Equal(3, problems.Count);
        Assert.Contains(problems, p => p.Contains("docs/nowhere.md does not exist", StringComparison.Ordinal));
        Assert.Contains(problems, p => p.Contains("#no-such-heading", StringComparison.Ordinal));
        Assert.Contains(problems, p => p.Contains("leaves the repository", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("1.5 Dissolved CO2: CER and CTR", "15-dissolved-co2-cer-and-ctr")]
    [InlineData("`softsensor opcua browse`: list a server's nodes", "softsensor-opcua-browse-list-a-servers-nodes")]
    [InlineData("Offline samples and removals", "offline-samples-and-removals")]
    public void Slug_follows_the_heading_anchor_rule(string heading, string slug) =>
        Assert.Equal(slug, MarkdownLinks.Slug(heading));
}
