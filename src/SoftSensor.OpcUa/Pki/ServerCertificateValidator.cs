using System.Net;
using System.Security.Cryptography.X509Certificates;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Pki;

/// <summary>
/// Checks a server's application instance certificate before the client trusts its channel, in
/// the order of Part 4 §6.1.3 (Table 106, certificate validation): structure; trust (the
/// certificate itself in trusted/certs, or a chain through issuers/ to a CA in trusted/certs) —
/// an untrusted one is copied to rejected/; validity period; host name (the endpoint's host among
/// the DNS names or IP addresses of the subject alternative name); application URI (the server's
/// ApplicationUri among the SAN URIs); key usage (digitalSignature and key or data encipherment);
/// revocation (each CA-issued certificate against a CRL signed by its issuer in trusted/crl or
/// issuers/crl). Each failure is a <see cref="ServiceResultException"/> with its status code.
/// </summary>
public sealed class ServerCertificateValidator(PkiStore store, TimeProvider time)
{
    /// <summary>The command that trusts a server, named in the untrusted-certificate error.</summary>
    public static string TrustCommand(string endpointUrl, string pkiRoot) => $"softsensor opcua trust --endpoint {endpointUrl} --pki {pkiRoot}";

    /// <summary>Validates the certificate chain a server sent; returns its own (leaf) certificate.</summary>
    public X509Certificate2 Validate(byte[]? chainDer, string endpointUrl, string? applicationUri)
    {
        if (chainDer is null || chainDer.Length == 0)
        {
            throw Fail(StatusCodes.BadCertificateInvalid, $"The server at {endpointUrl} sent no certificate");
        }

        List<X509Certificate2> chain;
        try
        {
            chain = [.. CertificateFacts.SplitChain(chainDer).Select(d => CertificateFacts.Load(d))];
        }
        catch (Exception e) when (e is System.Security.Cryptography.CryptographicException or System.Formats.Asn1.AsnContentException)
        {
            throw Fail(StatusCodes.BadCertificateInvalid, $"The server at {endpointUrl} sent a certificate that cannot be parsed ({e.Message})");
        }

        var leaf = chain[0];
        var trusted = store.LoadTrusted();
        var issuers = store.LoadIssuers();
        var path = TrustedPath(leaf, chain, trusted, issuers);
        if (path is null)
        {
            string copy = store.Reject(leaf);
            throw Fail(StatusCodes.BadCertificateUntrusted,
                $"The server certificate {CertificateFacts.Describe(leaf)} of {endpointUrl} is not trusted; it was copied to {copy}. "
                + $"Check the thumbprint with the server's administrator, then run: {TrustCommand(endpointUrl, store.Root)}");
        }

        var now = time.GetUtcNow().UtcDateTime;
        if (now < leaf.NotBefore.ToUniversalTime() || now > leaf.NotAfter.ToUniversalTime())
        {
            throw Fail(StatusCodes.BadCertificateTimeInvalid, $"The server certificate {CertificateFacts.Describe(leaf)} is outside its validity period (now {now:yyyy-MM-dd HH:mm} UTC)");
        }

        var (uris, dnsNames, addresses) = CertificateFacts.AlternativeNames(leaf);
        string host = EndpointHost(endpointUrl);
        bool hostListed = IPAddress.TryParse(host, out var ip)
            ? addresses.Any(a => a.Equals(ip))
            : dnsNames.Any(d => string.Equals(d, host, StringComparison.OrdinalIgnoreCase));
        if (!hostListed)
        {
            throw Fail(StatusCodes.BadCertificateHostNameInvalid,
                $"The server certificate {CertificateFacts.Describe(leaf)} does not name host '{host}' (its DNS names: {string.Join(", ", dnsNames)}; IP addresses: {string.Join(", ", addresses)})");
        }

        if (!string.IsNullOrEmpty(applicationUri) && !uris.Contains(applicationUri, StringComparer.Ordinal))
        {
            throw Fail(StatusCodes.BadCertificateUriInvalid, $"The server certificate {CertificateFacts.Describe(leaf)} does not carry the server's ApplicationUri '{applicationUri}' (it has: {string.Join(", ", uris)})");
        }

        if (leaf.Extensions["2.5.29.15"] is X509KeyUsageExtension usage)
        {
            var flags = usage.KeyUsages;
            if (!flags.HasFlag(X509KeyUsageFlags.DigitalSignature) || !(flags.HasFlag(X509KeyUsageFlags.KeyEncipherment) || flags.HasFlag(X509KeyUsageFlags.DataEncipherment)))
            {
                throw Fail(StatusCodes.BadCertificateUseNotAllowed, $"The server certificate {CertificateFacts.Describe(leaf)} has key usage {flags} (expected DigitalSignature and KeyEncipherment or DataEncipherment)");
            }
        }

        CheckRevocation(path, endpointUrl);
        return leaf;
    }

    /// <summary>The chain from the leaf to the trusted certificate, or null when nothing trusted is reached.</summary>
    private static List<X509Certificate2>? TrustedPath(X509Certificate2 leaf, List<X509Certificate2> sent, List<X509Certificate2> trusted, List<X509Certificate2> issuers)
    {
        if (trusted.Any(t => t.Thumbprint == leaf.Thumbprint))
        {
            return [leaf];
        }

        using var chain = new X509Chain();
        chain.ChainPolicy.TrustMode = X509ChainTrustMode.CustomRootTrust;
        chain.ChainPolicy.RevocationMode = X509RevocationMode.NoCheck;
        chain.ChainPolicy.VerificationTime = DateTime.Now;
        chain.ChainPolicy.VerificationFlags = X509VerificationFlags.IgnoreNotTimeValid | X509VerificationFlags.IgnoreWrongUsage;
        chain.ChainPolicy.CustomTrustStore.AddRange(trusted.ToArray());
        chain.ChainPolicy.ExtraStore.AddRange(issuers.Concat(sent.Skip(1)).ToArray());
        if (!chain.Build(leaf))
        {
            return null;
        }

        var elements = chain.ChainElements.Select(e => e.Certificate).ToList();
        return trusted.Any(t => elements.Any(e => e.Thumbprint == t.Thumbprint)) ? elements : null;
    }

    private void CheckRevocation(List<X509Certificate2> path, string endpointUrl)
    {
        if (path.Count < 2)
        {
            return; // a self-signed certificate trusted by itself: no issuer to revoke it
        }

        var crls = store.LoadCrls().Select(RevocationList.TryParse).OfType<RevocationList>().ToList();
        for (int i = 0; i < path.Count - 1; i++)
        {
            var subject = path[i];
            var issuer = path[i + 1];
            var list = crls.Where(c => c.IsSignedBy(issuer)).MaxBy(c => c.ThisUpdate);
            string code = i == 0 ? "certificate" : "issuer certificate";
            if (list is null)
            {
                throw Fail(StatusCodes.BadCertificateRevocationUnknown,
                    $"No revocation list of '{issuer.Subject}' in {store.TrustedCrls} or {store.IssuerCrls}: cannot tell whether the server's {code} {CertificateFacts.Describe(subject)} of {endpointUrl} is revoked");
            }

            if (list.Revokes(subject))
            {
                throw Fail(i == 0 ? StatusCodes.BadCertificateRevoked : StatusCodes.BadCertificateIssuerRevoked,
                    $"The server's {code} {CertificateFacts.Describe(subject)} is revoked by '{issuer.Subject}'");
            }
        }
    }

    private static string EndpointHost(string endpointUrl) => Transport.EndpointAddress.Parse(endpointUrl).Host;

    private static ServiceResultException Fail(uint code, string message) => new(new StatusCode(code), message);
}
