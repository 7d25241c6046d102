using System.Net.Http.Headers;
using System.Runtime.CompilerServices;
using SoftSensor.Daemon.Access;

namespace SoftSensor.Daemon.Tests.Fixtures;

/// <summary>
/// The credentials every <see cref="TestDaemon"/> gets: bearer tokens for an operator and a viewer, and
/// password users alice (operator) and victor (viewer). The operator token is also the process's
/// <c>SOFTSENSOR_TOKEN</c>, so the client verbs run in-process authenticate as the CLI would.
/// Test passwords are hashed with few PBKDF2 iterations (fast tests); the shipped verb uses 600,000.
/// </summary>
internal static class TestAccess
{
    public const string OperatorToken = "test-operator-token-not-secret-0123456789ab";
    public const string ViewerToken = "test-viewer-token-not-secret-0123456789abcde";
    public const string OperatorUser = "alice";
    public const string ViewerUser = "victor";
    public const string Password = "correct horse battery";

    private static readonly string[] Lines =
    [
        $"token ci-operator operator {PasswordHash.TokenHash(OperatorToken)}",
        $"token ci-viewer viewer {PasswordHash.TokenHash(ViewerToken)}",
        $"user {OperatorUser} operator {PasswordHash.Hash(Password, 1000)}",
        $"user {ViewerUser} viewer {PasswordHash.Hash(Password, 1000)}",
    ];

    public static AuthenticationHeaderValue Operator => new("Bearer", OperatorToken);

    public static AuthenticationHeaderValue Viewer => new("Bearer", ViewerToken);

    [ModuleInitializer]
    internal static void SetClientToken() => Environment.SetEnvironmentVariable(ClientToken.Variable, OperatorToken);

    /// <summary>Writes the credentials file into <paramref name="dir"/>; its path.</summary>
    public static string WriteCredentials(string dir)
    {
        string path = Path.Combine(dir, "credentials");
        File.WriteAllText(path, CredentialFile.Header + "\n" + string.Join("\n", Lines) + "\n");
        if (!OperatingSystem.IsWindows())
        {
            File.SetUnixFileMode(path, UnixFileMode.UserRead | UnixFileMode.UserWrite);
        }

        return path;
    }

    /// <summary>An HTTP client of the daemon that sends the operator token.</summary>
    public static HttpClient OperatorClient(string baseAddress)
    {
        var http = new HttpClient { BaseAddress = new Uri(baseAddress) };
        http.DefaultRequestHeaders.Authorization = Operator;
        return http;
    }
}
