using SoftSensor.Daemon.Tests.Cli;

namespace SoftSensor.Daemon.Tests.OpcUa;

/// <summary>
/// <c>softsensor opcua trust</c> and <c>opcua browse</c> with security against a real node-opcua
/// server that has secure endpoints only. The password comes from SOFTSENSOR_OPCUA_PASSWORD, so
/// these tests set and restore that variable and must not run beside another that reads it.
/// </summary>
[Collection(SecureOpcUaPeerCollection.Name)]
public sealed class OpcUaSecureVerbTests(SecureOpcUaPeer peer)
{
    private const string PasswordVariable = "SOFTSENSOR_OPCUA_PASSWORD";

    [Fact]
    public void Untrusted_server_is_refused_then_browsed_after_trust_yes()
    {
        string pki = Path.Combine(peer.Root, "verb-pki");
        using var server = peer.ServerCertificate();
        var (code, _, error) = WithPassword(SecureOpcUaPeer.Password, () => CliRunner.Run("opcua", "browse", "--endpoint", peer.Server.EndpointUrl, "--path", "Objects/Reactor1", "--pki", pki, "--user", SecureOpcUaPeer.User));

        Assert.Equal(1, code);
        var line = Assert.Single(error.Split('\n', StringSplitOptions.RemoveEmptyEntries), l => l.StartsWith("error:", StringComparison.Ordinal));
        Assert.Contains("BadCertificateUntrusted", line, StringComparison.Ordinal);
        Assert.Contains(server.Thumbprint, line, StringComparison.Ordinal);
        Assert.Contains(server.Subject, line, StringComparison.Ordinal);
        Assert.Contains($"softsensor opcua trust --endpoint {peer.Server.EndpointUrl} --pki ", line, StringComparison.Ordinal);
        Assert.Single(Directory.GetFiles(Path.Combine(pki, "rejected")));

        var (trustCode, trustOut, trustError) = CliRunner.Run("opcua", "trust", "--endpoint", peer.Server.EndpointUrl, "--pki", pki, "--yes");
        Assert.True(trustCode == 0, trustError);
        Assert.Contains($"thumbprint:  {server.Thumbprint}", trustOut, StringComparison.Ordinal);
        Assert.Contains("Aes256_Sha256_RsaPss SignAndEncrypt", trustOut, StringComparison.Ordinal);
        Assert.Contains("Basic256Sha256 Sign", trustOut, StringComparison.Ordinal);
        Assert.Single(Directory.GetFiles(Path.Combine(pki, "trusted", "certs")));

        var (browseCode, browseOut, browseError) = WithPassword(SecureOpcUaPeer.Password, () => CliRunner.Run("opcua", "browse", "--endpoint", peer.Server.EndpointUrl, "--path", "Objects/Reactor1", "--pki", pki, "--user", SecureOpcUaPeer.User));
        Assert.True(browseCode == 0, browseError);
        Assert.Contains("OffgasO2", browseOut, StringComparison.Ordinal);
        Assert.Contains("security: Aes256_Sha256_RsaPss SignAndEncrypt (the most secure endpoint both sides support)", browseError, StringComparison.Ordinal);
    }

    [Fact]
    public void Wrong_password_is_one_line_naming_Bad_UserAccessDenied()
    {
        var (code, _, error) = WithPassword("wrong", () => CliRunner.Run("opcua", "browse", "--endpoint", peer.Server.EndpointUrl, "--security", "sign", "--policy", "Aes128_Sha256_RsaOaep", "--pki", peer.TrustingPki, "--user", SecureOpcUaPeer.User));

        Assert.Equal(1, code);
        var lines = error.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        var line = Assert.Single(lines, l => l.StartsWith("error:", StringComparison.Ordinal));
        Assert.Contains("BadUserAccessDenied", line, StringComparison.Ordinal);
        Assert.Contains("user", line, StringComparison.OrdinalIgnoreCase);
    }

    [Theory]
    [InlineData("Basic256", "SHA-1")]
    [InlineData("Basic128Rsa15", "Bleichenbacher")]
    public void Deprecated_policy_is_refused_saying_why(string policy, string reason)
    {
        var (code, _, error) = CliRunner.Run("opcua", "browse", "--endpoint", peer.Server.EndpointUrl, "--policy", policy, "--pki", peer.TrustingPki);

        Assert.Equal(2, code);
        Assert.Contains($"--policy '{policy}'", error, StringComparison.Ordinal);
        Assert.Contains(reason, error, StringComparison.Ordinal);
    }

    private static (int, string, string) WithPassword(string password, Func<(int, string, string)> run)
    {
        var before = Environment.GetEnvironmentVariable(PasswordVariable);
        Environment.SetEnvironmentVariable(PasswordVariable, password);
        try
        {
            return run();
        }
        finally
        {
            Environment.SetEnvironmentVariable(PasswordVariable, before);
        }
    }
}
