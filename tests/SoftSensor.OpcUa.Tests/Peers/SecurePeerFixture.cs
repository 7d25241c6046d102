using System.Security.Cryptography.X509Certificates;
using SoftSensor.OpcUa.Pki;

namespace SoftSensor.OpcUa.Tests.Peers;

/// <summary>
/// One node-opcua server with secure-only endpoints (every supported policy, Sign and
/// SignAndEncrypt; no None endpoint, no anonymous session) and a user-name login, its PKI and a
/// client PKI that already trusts it, in a temporary folder removed afterwards.
/// </summary>
public sealed class SecurePeerFixture : IAsyncLifetime
{
    public const string User = "operator";
    public const string Password = "pilot-plant-7";

    public SecurePeerFixture()
    {
        Root = Directory.CreateTempSubdirectory("softsensor-opcsec-").FullName;
        Server = new OpcUaPeerServer(new Dictionary<string, string>
        {
            ["OPCUA_SECURE_PKI"] = Path.Combine(Root, "server"),
            ["OPCUA_USER"] = User,
            ["OPCUA_PASSWORD"] = Password,
            ["OPCUA_UPDATE_MS"] = "100",
            ["OPCUA_TOKEN_LIFETIME_MS"] = "600000",
        });
    }

    public string Root { get; }

    public OpcUaPeerServer Server { get; }

    /// <summary>A client PKI folder whose trusted/certs holds the server's certificate.</summary>
    public string TrustingPki => Path.Combine(Root, "client-trusting");

    /// <summary>The server's certificate, read from its own PKI folder.</summary>
    public X509Certificate2 ServerCertificate() =>
        X509Certificate2.CreateFromPem(File.ReadAllText(Path.Combine(Root, "server", "server", "own", "certs", "certificate.pem")));

    /// <summary>A fresh client PKI folder that trusts nothing yet.</summary>
    public string NewPki(string name) => Path.Combine(Root, name);

    public async Task InitializeAsync()
    {
        await Server.StartAsync(CancellationToken.None);
        new PkiStore(TrustingPki).Trust(ServerCertificate());
    }

    public async Task DisposeAsync()
    {
        await Server.StopAsync();
        Directory.Delete(Root, recursive: true);
    }
}

/// <summary>The test classes that share the secure node-opcua peer.</summary>
[CollectionDefinition(Name)]
public sealed class SecurePeerCollection : ICollectionFixture<SecurePeerFixture>
{
    public const string Name = "secure node-opcua peer";
}
