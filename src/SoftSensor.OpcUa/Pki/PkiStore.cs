using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;

namespace SoftSensor.OpcUa.Pki;

/// <summary>
/// The client's certificate folders (the layout of Part 12 §7.3 trust lists, on disk):
/// <c>own/certs</c> (this client's certificate, DER) and <c>own/private</c> (its key, PKCS#8 PEM,
/// readable by the owner only); <c>trusted/certs</c> and <c>trusted/crl</c> (servers and CAs
/// trusted, and the CAs' revocation lists); <c>issuers/certs</c> and <c>issuers/crl</c> (CAs that
/// may complete a chain but are not trusted by themselves); <c>rejected</c> (server certificates
/// refused, for the operator to inspect and move to trusted/certs, or trust with the trust verb).
/// </summary>
public sealed class PkiStore
{
    private const string OwnName = "softsensor";

    public PkiStore(string root)
    {
        Root = Path.GetFullPath(root);
    }

    public string Root { get; }

    public string OwnCerts => Path.Combine(Root, "own", "certs");

    public string OwnPrivate => Path.Combine(Root, "own", "private");

    public string TrustedCerts => Path.Combine(Root, "trusted", "certs");

    public string TrustedCrls => Path.Combine(Root, "trusted", "crl");

    public string IssuerCerts => Path.Combine(Root, "issuers", "certs");

    public string IssuerCrls => Path.Combine(Root, "issuers", "crl");

    public string Rejected => Path.Combine(Root, "rejected");

    /// <summary>Creates the folders that do not exist yet.</summary>
    public void EnsureLayout()
    {
        foreach (var dir in new[] { OwnCerts, TrustedCerts, TrustedCrls, IssuerCerts, IssuerCrls, Rejected })
        {
            Directory.CreateDirectory(dir);
        }

        if (!Directory.Exists(OwnPrivate))
        {
            Directory.CreateDirectory(OwnPrivate);
            if (!OperatingSystem.IsWindows())
            {
                File.SetUnixFileMode(OwnPrivate, UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute);
            }
        }
    }

    /// <summary>
    /// This client's certificate with its private key: loaded from own/, or created on first use
    /// (and again when the stored one has expired or names another ApplicationUri). The bool says
    /// whether it was created now.
    /// </summary>
    public (X509Certificate2 Certificate, bool Created) LoadOrCreateOwn(string applicationUri, string applicationName, DateTimeOffset now)
    {
        EnsureLayout();
        string certPath = Path.Combine(OwnCerts, OwnName + ".der");
        string keyPath = Path.Combine(OwnPrivate, OwnName + ".pem");
        if (File.Exists(certPath) && File.Exists(keyPath))
        {
            var stored = CertificateFacts.Load(File.ReadAllBytes(certPath));
            bool current = stored.NotAfter.ToUniversalTime() > now.UtcDateTime.AddDays(1) && CertificateFacts.AlternativeNames(stored).Uris.Contains(applicationUri);
            if (current)
            {
                using var rsa = RSA.Create();
                rsa.ImportFromPem(File.ReadAllText(keyPath));
                var withKey = stored.CopyWithPrivateKey(rsa);
                stored.Dispose();
                return (withKey, false);
            }

            stored.Dispose();
        }

        var created = ApplicationCertificate.Create(applicationUri, applicationName, ApplicationCertificate.HostName(), now, TimeSpan.FromDays(5 * 365));
        using (var key = created.GetRSAPrivateKey()!)
        {
            WritePrivate(keyPath, key.ExportPkcs8PrivateKeyPem());
        }

        File.WriteAllBytes(certPath, created.RawData);
        return (created, true);
    }

    /// <summary>The certificates in trusted/certs (servers trusted one by one, and trusted CAs).</summary>
    public List<X509Certificate2> LoadTrusted() => LoadAll(TrustedCerts);

    /// <summary>The CAs in issuers/certs.</summary>
    public List<X509Certificate2> LoadIssuers() => LoadAll(IssuerCerts);

    /// <summary>The revocation lists (DER) of trusted/crl and issuers/crl.</summary>
    public List<byte[]> LoadCrls() =>
        [.. new[] { TrustedCrls, IssuerCrls }.Where(Directory.Exists).SelectMany(Directory.EnumerateFiles).Order(StringComparer.Ordinal).Select(File.ReadAllBytes)];

    /// <summary>Copies a certificate into trusted/certs; returns its path.</summary>
    public string Trust(X509Certificate2 certificate)
    {
        EnsureLayout();
        string path = Path.Combine(TrustedCerts, CertificateFacts.FileName(certificate));
        File.WriteAllBytes(path, certificate.RawData);
        string rejected = Path.Combine(Rejected, CertificateFacts.FileName(certificate));
        if (File.Exists(rejected))
        {
            File.Delete(rejected);
        }

        return path;
    }

    /// <summary>Copies a refused certificate into rejected/; returns its path.</summary>
    public string Reject(X509Certificate2 certificate)
    {
        EnsureLayout();
        string path = Path.Combine(Rejected, CertificateFacts.FileName(certificate));
        File.WriteAllBytes(path, certificate.RawData);
        return path;
    }

    private static List<X509Certificate2> LoadAll(string dir)
    {
        var list = new List<X509Certificate2>();
        if (!Directory.Exists(dir))
        {
            return list;
        }

        foreach (var file in Directory.EnumerateFiles(dir).Order(StringComparer.Ordinal))
        {
            try
            {
                list.Add(file.EndsWith(".pem", StringComparison.OrdinalIgnoreCase) ? X509Certificate2.CreateFromPem(File.ReadAllText(file)) : CertificateFacts.Load(File.ReadAllBytes(file)));
            }
            catch (CryptographicException)
            {
                // Not a certificate (a note, a key): ignored, as a trust list holds certificates only.
            }
        }

        return list;
    }

    private static void WritePrivate(string path, string text)
    {
        var options = new FileStreamOptions { Mode = FileMode.Create, Access = FileAccess.Write };
        if (!OperatingSystem.IsWindows())
        {
            options.UnixCreateMode = UnixFileMode.UserRead | UnixFileMode.UserWrite;
        }

        using var stream = new FileStream(path, options);
        using var writer = new StreamWriter(stream);
        writer.Write(text);
    }
}
