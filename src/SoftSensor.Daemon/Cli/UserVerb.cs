using System.CommandLine;
using System.Text;
using SoftSensor.Daemon.Access;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor user add|remove|list</c>: the status server's credentials file (<see cref="CredentialFile"/>).
/// <c>add NAME --role R</c> reads the password from the terminal without echo (twice) or the first line of
/// standard input, never from the command line; <c>add NAME --role R --token</c> makes a bearer token for an
/// API client or the CLI and prints it once (only its hash is stored). The daemon reads the file again when it changes.
/// </summary>
internal sealed class UserVerb : IVerb
{
    /// <summary>Shortest password accepted (NIST SP 800-63B §5.1.1.2 asks for at least 8; 12 is common practice).</summary>
    public const int MinPasswordLength = 12;

    public Command Build()
    {
        var file = new Option<string>("--file") { Description = "credentials file", DefaultValueFactory = _ => new Configuration.AccessOptions().CredentialsFile };
        var name = new Argument<string>("name") { Description = "user or token name (1 to 64 of A-Z a-z 0-9 . _ @ -)" };
        var role = new Option<string>("--role") { Description = $"role: {Roles.Ids}", Required = true };
        var token = new Option<bool>("--token") { Description = "make a bearer token (printed once) instead of a password user" };
        var add = new Command("add", "Add a user (password from the terminal or stdin) or a bearer token") { name, role, token, file };
        add.SetAction(p => Add(p.GetValue(file)!, p.GetValue(name)!, p.GetValue(role)!, p.GetValue(token), ReadPassword, p.InvocationConfiguration.Output, p.InvocationConfiguration.Error));
        var removeName = new Argument<string>("name") { Description = "user or token name" };
        var remove = new Command("remove", "Remove a user or token") { removeName, file };
        remove.SetAction(p => Remove(p.GetValue(file)!, p.GetValue(removeName)!, p.InvocationConfiguration.Output, p.InvocationConfiguration.Error));
        var list = new Command("list", "List users and tokens with their roles (never a hash)") { file };
        list.SetAction(p => List(p.GetValue(file)!, p.InvocationConfiguration.Output, p.InvocationConfiguration.Error));
        return new Command("user", "Manage who may use the status server: add, remove, list") { add, remove, list };
    }

    public static int Add(string path, string name, string roleId, bool token, Func<string?> password, TextWriter output, TextWriter error, int iterations = PasswordHash.DefaultIterations)
    {
        if (!CredentialFile.NamePattern().IsMatch(name))
        {
            return CliOutput.BadInput(error, $"name is '{name}' (expected 1 to 64 of A-Z a-z 0-9 . _ @ -)");
        }

        if (!Roles.TryParse(roleId, out var role))
        {
            return CliOutput.BadInput(error, $"--role is '{roleId}' (expected {Roles.Ids})");
        }

        var (entries, problems) = CredentialFile.Read(path);
        if (problems.Count > 0)
        {
            return CliOutput.BadInput(error, string.Join(" | ", problems));
        }

        if (entries.Any(e => e.Name == name))
        {
            return CliOutput.BadInput(error, $"name '{name}' is in {path} already (remove it first)");
        }

        Credential added;
        string? secret = null;
        if (token)
        {
            var (t, hash) = PasswordHash.NewToken();
            secret = t;
            added = new Credential(CredentialKind.Token, name, role, hash);
        }
        else
        {
            string? pw = password();
            if (pw is null || pw.Length < MinPasswordLength)
            {
                return CliOutput.BadInput(error, $"password has {pw?.Length ?? 0} characters (expected at least {MinPasswordLength}, read from the terminal or the first line of stdin)");
            }

            added = new Credential(CredentialKind.User, name, role, PasswordHash.Hash(pw, iterations));
        }

        CredentialFile.Write(path, [.. entries, added]);
        output.WriteLine($"{(token ? "token" : "user")} {name} ({Roles.Id(role)}) added to {path}");
        if (secret is not null)
        {
            output.WriteLine($"token (shown once; give it to the client as SOFTSENSOR_TOKEN or Authorization: Bearer): {secret}");
        }

        return ExitCodes.Ok;
    }

    public static int Remove(string path, string name, TextWriter output, TextWriter error)
    {
        var (entries, problems) = CredentialFile.Read(path);
        if (problems.Count > 0)
        {
            return CliOutput.BadInput(error, string.Join(" | ", problems));
        }

        if (entries.All(e => e.Name != name))
        {
            return CliOutput.BadInput(error, $"name '{name}' is not in {path} (expected one of {string.Join(", ", entries.Select(e => e.Name))})");
        }

        CredentialFile.Write(path, entries.Where(e => e.Name != name));
        output.WriteLine($"{name} removed from {path}");
        return ExitCodes.Ok;
    }

    public static int List(string path, TextWriter output, TextWriter error)
    {
        var (entries, problems) = CredentialFile.Read(path);
        if (problems.Count > 0)
        {
            return CliOutput.BadInput(error, string.Join(" | ", problems));
        }

        foreach (var e in entries)
        {
            output.WriteLine($"{(e.Kind == CredentialKind.User ? "user " : "token")}  {e.Name}  {Roles.Id(e.Role)}");
        }

        if (entries.Count == 0)
        {
            output.WriteLine($"no users or tokens in {path}");
        }

        return ExitCodes.Ok;
    }

    /// <summary>From the terminal without echo (asked twice), or the first line of redirected stdin.</summary>
    private static string? ReadPassword()
    {
        if (Console.IsInputRedirected)
        {
            return Console.In.ReadLine();
        }

        string first = ReadHidden("password: ");
        string second = ReadHidden("again: ");
        return first == second ? first : null;
    }

    private static string ReadHidden(string prompt)
    {
        Console.Error.Write(prompt);
        var b = new StringBuilder();
        while (true)
        {
            var k = Console.ReadKey(intercept: true);
            if (k.Key == ConsoleKey.Enter)
            {
                Console.Error.WriteLine();
                return b.ToString();
            }

            if (k.Key == ConsoleKey.Backspace)
            {
                if (b.Length > 0)
                {
                    b.Length--;
                }
            }
            else if (!char.IsControl(k.KeyChar))
            {
                b.Append(k.KeyChar);
            }
        }
    }
}
