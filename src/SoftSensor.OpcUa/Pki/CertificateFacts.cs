using System.Formats.Asn1;
using System.Net;
using System.Security.Cryptography.X509Certificates;

namespace SoftSensor.OpcUa.Pki;

/// <summary>
/// What the checks and the trust verb read from an X.509 certificate (RFC 5280): the subject
/// alternative names (§4.2.1.6: URI, DNS name, IP address), a one-line description, and the
/// splitting of a DER certificate chain (OPC UA sends a chain as concatenated DER, Part 6 §6.2.3).
/// </summary>
public static class CertificateFacts
{
    public static X509Certificate2 Load(ReadOnlySpan<byte> der) => X509CertificateLoader.LoadCertificate(der);

    /// <summary>Splits concatenated DER certificates; the first is the sender's own.</summary>
    public static List<byte[]> SplitChain(ReadOnlyMemory<byte> chain)
    {
        var parts = new List<byte[]>();
        var rest = chain;
        while (!rest.IsEmpty)
        {
            var reader = new AsnReader(rest, AsnEncodingRules.DER);
            var one = reader.PeekEncodedValue();
            parts.Add(one.ToArray());
            rest = rest[one.Length..];
        }

        return parts;
    }

    /// <summary>The URIs, DNS names and IP addresses of the subject alternative name extension (empty when absent).</summary>
    public static (List<string> Uris, List<string> DnsNames, List<IPAddress> Addresses) AlternativeNames(X509Certificate2 certificate)
    {
        var uris = new List<string>();
        var dns = new List<string>();
        var ips = new List<IPAddress>();
        var extension = certificate.Extensions["2.5.29.17"];
        if (extension is null)
        {
            return (uris, dns, ips);
        }

        var names = new AsnReader(extension.RawData, AsnEncodingRules.DER).ReadSequence();
        while (names.HasData)
        {
            var tag = names.PeekTag();
            if (tag.TagClass != TagClass.ContextSpecific)
            {
                names.ReadEncodedValue();
                continue;
            }

            switch (tag.TagValue)
            {
                case 2:
                    dns.Add(names.ReadCharacterString(UniversalTagNumber.IA5String, new Asn1Tag(TagClass.ContextSpecific, 2)));
                    break;
                case 6:
                    uris.Add(names.ReadCharacterString(UniversalTagNumber.IA5String, new Asn1Tag(TagClass.ContextSpecific, 6)));
                    break;
                case 7:
                    ips.Add(new IPAddress(names.ReadOctetString(new Asn1Tag(TagClass.ContextSpecific, 7))));
                    break;
                default:
                    names.ReadEncodedValue();
                    break;
            }
        }

        return (uris, dns, ips);
    }

    /// <summary>"subject, thumbprint …, valid … to …" for messages and the trust verb.</summary>
    public static string Describe(X509Certificate2 certificate) =>
        $"'{certificate.Subject}' (SHA-1 thumbprint {certificate.Thumbprint}, valid {certificate.NotBefore.ToUniversalTime():yyyy-MM-dd HH:mm} to {certificate.NotAfter.ToUniversalTime():yyyy-MM-dd HH:mm} UTC)";

    /// <summary>A file name for a certificate: its common name (safe characters only) and thumbprint.</summary>
    public static string FileName(X509Certificate2 certificate)
    {
        string name = certificate.GetNameInfo(X509NameType.SimpleName, false);
        var safe = new string([.. name.Select(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' or '.' ? c : '_')]);
        return $"{(safe.Length == 0 ? "certificate" : safe)} [{certificate.Thumbprint}].der";
    }
}
