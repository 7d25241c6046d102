using System.CommandLine;
using SoftSensor.OpcUa.SecureChannel.Security;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Session;

namespace SoftSensor.Daemon.Cli.OpcUa;

/// <summary>The security flags shared by the opcua verbs: --security, --policy, --pki.</summary>
internal sealed class OpcUaSecurityFlags
{
    public Option<string?> Security { get; } = new("--security") { Description = "none, sign or sign-encrypt (default: the most secure endpoint both sides support)" };

    public Option<string?> Policy { get; } = new("--policy") { Description = "Basic256Sha256, Aes128_Sha256_RsaOaep or Aes256_Sha256_RsaPss (default: the most secure both support)" };

    public Option<string?> Pki { get; } = new("--pki") { Description = $"PKI folder: own/, trusted/, issuers/, rejected/ (default {SecuritySettings.DefaultPkiDirectory})" };

    public void AddTo(Command command)
    {
        command.Options.Add(Security);
        command.Options.Add(Policy);
        command.Options.Add(Pki);
    }

    /// <summary>The settings, or the one-line error naming the flag.</summary>
    public (SecuritySettings? Settings, string? Error) Read(ParseResult parse)
    {
        string? security = parse.GetValue(Security);
        var mode = SecuritySettings.ParseMode(security);
        if (mode is null)
        {
            return (null, $"--security '{security}': expected none, sign or sign-encrypt");
        }

        string? policy = parse.GetValue(Policy);
        if (!string.IsNullOrWhiteSpace(policy))
        {
            try
            {
                SecurityPolicy.Find(policy);
            }
            catch (ServiceResultException e)
            {
                return (null, $"--policy '{policy}': {e.Message}");
            }
        }

        return (new SecuritySettings { Mode = mode.Value, Policy = string.IsNullOrWhiteSpace(policy) ? null : policy, PkiDirectory = parse.GetValue(Pki) }, null);
    }
}
