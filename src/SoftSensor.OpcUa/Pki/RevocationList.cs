using System.Formats.Asn1;
using System.Numerics;
using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;

namespace SoftSensor.OpcUa.Pki;

/// <summary>
/// An X.509 certificate revocation list (RFC 5280 §5.1): issuer, update times, revoked serial
/// numbers, and the signature over tbsCertList. Only sha256WithRSAEncryption signatures (the
/// algorithm of the supported security policies) are verified; any other is "cannot verify".
/// </summary>
public sealed class RevocationList
{
    private const string Sha256WithRsa = "1.2.840.113549.1.1.11";

    private RevocationList(X500DistinguishedName issuer, DateTimeOffset thisUpdate, DateTimeOffset? nextUpdate, HashSet<BigInteger> revoked, byte[] signed, string algorithm, byte[] signature)
    {
        Issuer = issuer;
        ThisUpdate = thisUpdate;
        NextUpdate = nextUpdate;
        this.revoked = revoked;
        this.signed = signed;
        this.algorithm = algorithm;
        this.signature = signature;
    }

    private readonly HashSet<BigInteger> revoked;
    private readonly byte[] signed;
    private readonly string algorithm;
    private readonly byte[] signature;

    public X500DistinguishedName Issuer { get; }

    public DateTimeOffset ThisUpdate { get; }

    public DateTimeOffset? NextUpdate { get; }

    /// <summary>Parses a DER CRL; null when the bytes are not one.</summary>
    public static RevocationList? TryParse(byte[] der)
    {
        try
        {
            var list = new AsnReader(der, AsnEncodingRules.DER).ReadSequence();
            var tbsBytes = list.PeekEncodedValue().ToArray();
            var tbs = list.ReadSequence();
            var algorithm = list.ReadSequence().ReadObjectIdentifier();
            var signature = list.ReadBitString(out _);
            if (tbs.PeekTag().HasSameClassAndValue(Asn1Tag.Integer))
            {
                tbs.ReadInteger();
            }

            tbs.ReadSequence(); // signature algorithm (repeated)
            var issuer = new X500DistinguishedName(tbs.ReadEncodedValue().Span);
            var thisUpdate = ReadTime(tbs);
            DateTimeOffset? nextUpdate = tbs.HasData && IsTime(tbs.PeekTag()) ? ReadTime(tbs) : null;
            var serials = new HashSet<BigInteger>();
            if (tbs.HasData && tbs.PeekTag().HasSameClassAndValue(Asn1Tag.Sequence))
            {
                var entries = tbs.ReadSequence();
                while (entries.HasData)
                {
                    serials.Add(entries.ReadSequence().ReadInteger());
                }
            }

            return new RevocationList(issuer, thisUpdate, nextUpdate, serials, tbsBytes, algorithm, signature);
        }
        catch (AsnContentException)
        {
            return null;
        }
    }

    /// <summary>True when <paramref name="issuer"/> signed this list (sha256WithRSAEncryption only).</summary>
    public bool IsSignedBy(X509Certificate2 issuer)
    {
        if (algorithm != Sha256WithRsa || !issuer.SubjectName.RawData.AsSpan().SequenceEqual(Issuer.RawData))
        {
            return false;
        }

        using var key = issuer.GetRSAPublicKey();
        return key is not null && key.VerifyData(signed, signature, HashAlgorithmName.SHA256, RSASignaturePadding.Pkcs1);
    }

    /// <summary>True when the serial number of <paramref name="certificate"/> is on the list.</summary>
    public bool Revokes(X509Certificate2 certificate) =>
        revoked.Contains(new BigInteger(certificate.SerialNumberBytes.Span, isUnsigned: false, isBigEndian: true));

    private static bool IsTime(Asn1Tag tag) => tag.HasSameClassAndValue(Asn1Tag.UtcTime) || tag.HasSameClassAndValue(Asn1Tag.GeneralizedTime);

    private static DateTimeOffset ReadTime(AsnReader r) =>
        r.PeekTag().HasSameClassAndValue(Asn1Tag.UtcTime) ? r.ReadUtcTime() : r.ReadGeneralizedTime();
}
