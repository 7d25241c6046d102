using System.Net;
using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;

namespace SoftSensor.OpcUa.Pki;

/// <summary>
/// Creates the client's self-signed application instance certificate (Part 6 §6.2.2, Table 26,
/// with RFC 5280 extensions): RSA 2048, SHA-256 PKCS#1 v1.5 signature, the ApplicationUri and the
/// host's DNS name in the subject alternative name, key usage digitalSignature, nonRepudiation,
/// keyEncipherment, dataEncipherment and keyCertSign (it signs itself), extended key usage client
/// and server authentication, subject and authority key identifiers.
/// </summary>
public static class ApplicationCertificate
{
    public const int KeyBits = 2048;

    public static X509Certificate2 Create(string applicationUri, string applicationName, string hostName, DateTimeOffset now, TimeSpan validity)
    {
        using var key = RSA.Create(KeyBits);
        var subject = new X500DistinguishedNameBuilder();
        subject.AddCommonName(applicationName);
        subject.AddDomainComponent(hostName);
        var request = new CertificateRequest(subject.Build(), key, HashAlgorithmName.SHA256, RSASignaturePadding.Pkcs1);
        var names = new SubjectAlternativeNameBuilder();
        names.AddUri(new Uri(applicationUri));
        names.AddDnsName(hostName);
        request.CertificateExtensions.Add(names.Build());
        request.CertificateExtensions.Add(new X509BasicConstraintsExtension(false, false, 0, true));
        request.CertificateExtensions.Add(new X509KeyUsageExtension(
            X509KeyUsageFlags.DigitalSignature | X509KeyUsageFlags.NonRepudiation | X509KeyUsageFlags.KeyEncipherment
            | X509KeyUsageFlags.DataEncipherment | X509KeyUsageFlags.KeyCertSign, true));
        request.CertificateExtensions.Add(new X509EnhancedKeyUsageExtension([new Oid("1.3.6.1.5.5.7.3.2"), new Oid("1.3.6.1.5.5.7.3.1")], false));
        var subjectKeyId = new X509SubjectKeyIdentifierExtension(request.PublicKey, false);
        request.CertificateExtensions.Add(subjectKeyId);
        request.CertificateExtensions.Add(X509AuthorityKeyIdentifierExtension.CreateFromSubjectKeyIdentifier(subjectKeyId));
        return request.CreateSelfSigned(now.AddMinutes(-5), now.Add(validity));
    }

    /// <summary>The name of this host for the certificate (the DNS name the server sees in its checks).</summary>
    public static string HostName() => Dns.GetHostName();
}
