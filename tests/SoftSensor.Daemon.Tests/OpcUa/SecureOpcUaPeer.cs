using System.Security.Cryptography.X509Certificates;
using SoftSensor.OpcUa.Pki;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Tests.Peers;

namespace SoftSensor.Daemon.Tests.OpcUa;

/// <summary>
/// One node-opcua server with secure-only endpoints (tests/peers/opcua-server.js with
/// OPCUA_SECURE_PKI: Basic256Sha256, Aes128_Sha256_RsaOaep, Aes256_Sha256_RsaPss, Sign and
/// SignAndEncrypt, no None endpoint, no anonymous session), a user-name login and the parity
/// plant tags, shared by the secure verb and parity tests; its PKI and the clients' in a temp folder.
/// </summary>
public sealed class SecureOpcUaPeer : IAsyncLifetime
{
    public const string User = "operator";
    public const string Password = "pilot-plant-7";

    public SecureOpcUaPeer()
    {
        Root = Directory.CreateTempSubdirectory("softsensor-opcsec-daemon-").FullName;
        Server = new OpcUaPeerServer(new Dictionary<string, string>
        {
            ["OPCUA_SECURE_PKI"] = Path.Combine(Root, "server"),
            ["OPCUA_USER"] = User,
            ["OPCUA_PASSWORD"] = Password,
            ["OPCUA_PLANT_TAGS"] = string.Join(",", ParityRig.TagNames()),
        });
    }

    public string Root { get; }

    public OpcUaPeerServer Server { get; }

    /// <summary>A client PKI folder that trusts the server (as after <c>opcua trust --yes</c>).</summary>
    public string TrustingPki => Path.Combine(Root, "client-trusting");

    public X509Certificate2 ServerCertificate() =>
        X509Certificate2.CreateFromPem(File.ReadAllText(Path.Combine(Root, "server", "server", "own", "certs", "certificate.pem")));

    public SessionOptions Options(string policy = "Basic256Sha256", SecurityChoice mode = SecurityChoice.SignAndEncrypt) => new()
    {
        EndpointUrl = Server.EndpointUrl,
        Identity = UserIdentity.UserName(User, Password),
        Security = new SecuritySettings { Mode = mode, Policy = policy, PkiDirectory = TrustingPki },
    };

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

[CollectionDefinition(Name)]
public sealed class SecureOpcUaPeerCollection : ICollectionFixture<SecureOpcUaPeer>
{
    public const string Name = "secure node-opcua peer (daemon)";
}
