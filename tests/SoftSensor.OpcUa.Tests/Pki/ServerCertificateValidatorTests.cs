using System.Numerics;
using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Pki;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Tests.Pki;

/// <summary>
/// Server certificate checks of Part 4 §6.1.3 on certificates made with the framework's
/// CertificateRequest and CertificateRevocationListBuilder (RFC 5280 structures).
/// </summary>
public sealed class ServerCertificateValidatorTests : IDisposable
{
    private const string Url = "opc.tcp://plant-opc.example:4840";
    private readonly string root = Directory.CreateTempSubdirectory("softsensor-pki-").FullName;
    private readonly DateTimeOffset now = DateTimeOffset.UtcNow;

    public void Dispose() => Directory.Delete(root, true);

    [Fact]
    public void SelfSigned_TrustedDirectly_Passes_OtherHostOrUriFails()
    {
        using var server = ApplicationCertificate.Create("urn:plant:server", "plant server", "plant-opc.example", now, TimeSpan.FromDays(30));
        var store = new PkiStore(root);
        store.Trust(server);
        var validator = new ServerCertificateValidator(store, TimeProvider.System);

        Assert.Equal(server.Thumbprint, validator.Validate(server.RawData, Url, "urn:plant:server").Thumbprint);
        Assert.Equal(StatusCodes.BadCertificateHostNameInvalid, Code(() => validator.Validate(server.RawData, "opc.tcp://other-host:4840", "urn:plant:server")));
        Assert.Equal(StatusCodes.BadCertificateUriInvalid, Code(() => validator.Validate(server.RawData, Url, "urn:plant:other")));
    }

    [Fact]
    public void Expired_IsBadCertificateTimeInvalid()
    {
        using var server = ApplicationCertificate.Create("urn:plant:server", "plant server", "plant-opc.example", now.AddDays(-10), TimeSpan.FromDays(2));
        var store = new PkiStore(root);
        store.Trust(server);
        Assert.Equal(StatusCodes.BadCertificateTimeInvalid, Code(() => new ServerCertificateValidator(store, TimeProvider.System).Validate(server.RawData, Url, "urn:plant:server")));
    }

    [Fact]
    public void CaIssued_NeedsTheCaCrl_AndARevokedSerialIsRefused()
    {
        using var caKey = RSA.Create(2048);
        var caRequest = new CertificateRequest("CN=plant CA", caKey, HashAlgorithmName.SHA256, RSASignaturePadding.Pkcs1);
        caRequest.CertificateExtensions.Add(new X509BasicConstraintsExtension(true, false, 0, true));
        caRequest.CertificateExtensions.Add(new X509KeyUsageExtension(X509KeyUsageFlags.KeyCertSign | X509KeyUsageFlags.CrlSign, true));
        using var ca = caRequest.CreateSelfSigned(now.AddDays(-1), now.AddDays(365));
        using var serverKey = RSA.Create(2048);
        var request = new CertificateRequest("CN=plant server", serverKey, HashAlgorithmName.SHA256, RSASignaturePadding.Pkcs1);
        var names = new SubjectAlternativeNameBuilder();
        names.AddUri(new Uri("urn:plant:server"));
        names.AddDnsName("plant-opc.example");
        request.CertificateExtensions.Add(names.Build());
        request.CertificateExtensions.Add(new X509KeyUsageExtension(X509KeyUsageFlags.DigitalSignature | X509KeyUsageFlags.KeyEncipherment, true));
        using var server = request.Create(ca, now.AddDays(-1), now.AddDays(30), [1, 2, 3, 4]);

        var store = new PkiStore(root);
        store.EnsureLayout();
        File.WriteAllBytes(Path.Combine(store.TrustedCerts, "ca.der"), ca.RawData);
        var validator = new ServerCertificateValidator(store, TimeProvider.System);

        Assert.Equal(StatusCodes.BadCertificateRevocationUnknown, Code(() => validator.Validate(server.RawData, Url, "urn:plant:server")));

        var crl = new CertificateRevocationListBuilder();
        File.WriteAllBytes(Path.Combine(store.TrustedCrls, "ca.crl"), crl.Build(ca, BigInteger.One, now.AddDays(7), HashAlgorithmName.SHA256, RSASignaturePadding.Pkcs1, now.AddMinutes(-1)));
        Assert.Equal(server.Thumbprint, validator.Validate(server.RawData, Url, "urn:plant:server").Thumbprint);

        crl.AddEntry(server, now.AddMinutes(-1));
        File.WriteAllBytes(Path.Combine(store.TrustedCrls, "ca.crl"), crl.Build(ca, new BigInteger(2), now.AddDays(7), HashAlgorithmName.SHA256, RSASignaturePadding.Pkcs1, now));
        Assert.Equal(StatusCodes.BadCertificateRevoked, Code(() => validator.Validate(server.RawData, Url, "urn:plant:server")));
    }

    [Fact]
    public void OwnCertificate_CreatedOnFirstUse_HasRsa2048Sha256UriAndHost_AndIsReusedAfter()
    {
        var store = new PkiStore(root);
        var (first, created) = store.LoadOrCreateOwn("urn:softsensor:test", "softsensor test", now);
        var (second, createdAgain) = store.LoadOrCreateOwn("urn:softsensor:test", "softsensor test", now);

        Assert.True(created);
        Assert.False(createdAgain);
        Assert.Equal(first.Thumbprint, second.Thumbprint);
        Assert.True(second.HasPrivateKey);
        Assert.Equal(2048, second.GetRSAPublicKey()!.KeySize);
        Assert.Equal("1.2.840.113549.1.1.11", second.SignatureAlgorithm.Value); // sha256WithRSAEncryption (RFC 4055)
        var (uris, dns, _) = CertificateFacts.AlternativeNames(second);
        Assert.Equal(["urn:softsensor:test"], uris);
        Assert.Contains(ApplicationCertificate.HostName(), dns);
        foreach (var dir in new[] { "own/certs", "own/private", "trusted/certs", "trusted/crl", "issuers/certs", "issuers/crl", "rejected" })
        {
            Assert.True(Directory.Exists(Path.Combine(root, dir)), dir);
        }
    }

    private static uint Code(Action check) => Assert.Throws<ServiceResultException>(check).Status.Code;
}
