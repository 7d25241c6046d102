using System.Net.Security;
using System.Security.Cryptography.X509Certificates;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>
/// The MQTT link's secrets and certificates: the password from the environment or
/// <see cref="MqttOptions.PasswordFile"/>, a private CA the broker's certificate must chain to
/// (host name checked as usual), and a client certificate with its key (PEM files).
/// </summary>
internal static class MqttSecrets
{
    /// <summary>The password: the environment's (bound to <c>mqtt:password</c>) or the first line of the password file.</summary>
    public static string Password(MqttOptions o) =>
        o.PasswordFile.Length > 0 ? (File.ReadLines(o.PasswordFile).FirstOrDefault() ?? "").TrimEnd('\r', '\n') : o.Password;

    public static X509Certificate2Collection LoadCa(string path)
    {
        var c = new X509Certificate2Collection();
        c.ImportFromPemFile(path);
        return c;
    }

    public static X509Certificate2 LoadClientCertificate(string certificate, string key)
    {
        using var pem = X509Certificate2.CreateFromPemFile(certificate, key.Length > 0 ? key : null);
        // SslStream on Linux needs the key in a form it can hand to OpenSSL: export and load once more.
        return X509CertificateLoader.LoadPkcs12(pem.Export(X509ContentType.Pkcs12), null);
    }

    /// <summary>Whether the broker's certificate chains to one of <paramref name="roots"/> and names the host.</summary>
    public static bool ValidateAgainst(X509Certificate2Collection roots, X509Certificate? presented, SslPolicyErrors errors)
    {
        if (presented is null || (errors & (SslPolicyErrors.RemoteCertificateNotAvailable | SslPolicyErrors.RemoteCertificateNameMismatch)) != 0)
        {
            return false;
        }

        using var leaf = X509CertificateLoader.LoadCertificate(presented.GetRawCertData());
        using var chain = new X509Chain();
        chain.ChainPolicy.TrustMode = X509ChainTrustMode.CustomRootTrust;
        chain.ChainPolicy.CustomTrustStore.AddRange(roots);
        chain.ChainPolicy.RevocationMode = X509RevocationMode.NoCheck;
        return chain.Build(leaf);
    }
}
