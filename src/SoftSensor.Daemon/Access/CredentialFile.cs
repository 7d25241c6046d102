using System.Text;
using System.Text.RegularExpressions;

namespace SoftSensor.Daemon.Access;

/// <summary>One entry of the credentials file: a user with a password hash, or a bearer token's hash.</summary>
internal sealed record Credential(CredentialKind Kind, string Name, Role Role, string Hash);

/// <summary>What a credential is.</summary>
internal enum CredentialKind
{
    /// <summary>A person: logs in on the page with a password.</summary>
    User,

    /// <summary>An API client or the CLI: sends <c>Authorization: Bearer TOKEN</c>.</summary>
    Token,
}

/// <summary>
/// The credentials file, the project's own text format: a first line <c>softsensor-credentials 1</c>,
/// then one entry per line, <c>user NAME ROLE HASH</c> or <c>token NAME ROLE HASH</c> (single spaces;
/// <c>#</c> starts a comment line). Names are 1 to 64 of <c>A-Z a-z 0-9 . _ @ -</c>; a name is used
/// once. Written with mode 0600 through a temporary file and a rename, so a reader never sees half a file.
/// </summary>
internal static partial class CredentialFile
{
    public const string Header = "softsensor-credentials 1";

    [GeneratedRegex("^[A-Za-z0-9._@-]{1,64}$")]
    public static partial Regex NamePattern();

    /// <summary>Parses a file's text; every problem names the line.</summary>
    public static (IReadOnlyList<Credential> Entries, IReadOnlyList<string> Problems) Parse(string text, string path)
    {
        var entries = new List<Credential>();
        var problems = new List<string>();
        var lines = text.Replace("\r\n", "\n", StringComparison.Ordinal).Split('\n');
        if (lines.Length == 0 || lines[0].Trim() != Header)
        {
            problems.Add($"{path}:1: first line is '{Clip(lines.FirstOrDefault() ?? "")}' (expected '{Header}')");
            return (entries, problems);
        }

        var seen = new HashSet<string>(StringComparer.Ordinal);
        for (int i = 1; i < lines.Length; i++)
        {
            string line = lines[i].Trim();
            if (line.Length == 0 || line.StartsWith('#'))
            {
                continue;
            }

            var f = line.Split(' ');
            string where = $"{path}:{i + 1}";
            if (f.Length != 4 || (f[0] != "user" && f[0] != "token"))
            {
                problems.Add($"{where}: expected 'user NAME ROLE HASH' or 'token NAME ROLE HASH'");
                continue;
            }

            var kind = f[0] == "user" ? CredentialKind.User : CredentialKind.Token;
            if (!NamePattern().IsMatch(f[1]))
            {
                problems.Add($"{where}: name is '{Clip(f[1])}' (expected 1 to 64 of A-Z a-z 0-9 . _ @ -)");
            }
            else if (!seen.Add(f[1]))
            {
                problems.Add($"{where}: name '{f[1]}' is used twice (expected each name once)");
            }

            if (!Roles.TryParse(f[2], out var role))
            {
                problems.Add($"{where}: role is '{Clip(f[2])}' (expected {Roles.Ids})");
            }

            bool hashOk = kind == CredentialKind.User ? PasswordHash.IsPasswordHash(f[3]) : PasswordHash.IsTokenHash(f[3]);
            if (!hashOk)
            {
                problems.Add($"{where}: hash is not a {(kind == CredentialKind.User ? "pbkdf2-sha256$ITERATIONS$SALT$KEY" : "sha256$HASH")} hash");
            }

            if (problems.Count == 0)
            {
                entries.Add(new Credential(kind, f[1], role, f[3]));
            }
        }

        return (entries, problems);
    }

    /// <summary>The file's text for <paramref name="entries"/>.</summary>
    public static string Format(IEnumerable<Credential> entries)
    {
        var b = new StringBuilder(Header).Append('\n');
        b.Append("# user NAME ROLE HASH | token NAME ROLE HASH; managed with `softsensor user`\n");
        foreach (var e in entries)
        {
            b.Append(e.Kind == CredentialKind.User ? "user " : "token ").Append(e.Name).Append(' ').Append(Roles.Id(e.Role)).Append(' ').Append(e.Hash).Append('\n');
        }

        return b.ToString();
    }

    /// <summary>Reads a file; a missing file is an empty list.</summary>
    public static (IReadOnlyList<Credential> Entries, IReadOnlyList<string> Problems) Read(string path) =>
        File.Exists(path) ? Parse(File.ReadAllText(path), path) : ([], []);

    /// <summary>Writes <paramref name="entries"/> (mode 0600 on Unix) atomically.</summary>
    public static void Write(string path, IEnumerable<Credential> entries)
    {
        string full = Path.GetFullPath(path);
        Directory.CreateDirectory(Path.GetDirectoryName(full)!);
        string temp = full + ".new";
        var options = new FileStreamOptions { Mode = FileMode.Create, Access = FileAccess.Write, Share = FileShare.None };
        if (!OperatingSystem.IsWindows())
        {
            options.UnixCreateMode = UnixFileMode.UserRead | UnixFileMode.UserWrite;
        }

        using (var s = new FileStream(temp, options))
        using (var w = new StreamWriter(s, new UTF8Encoding(false)))
        {
            w.Write(Format(entries));
        }

        File.Move(temp, full, overwrite: true);
    }

    private static string Clip(string s) => s.Length <= 40 ? s : s[..40] + "…";
}
