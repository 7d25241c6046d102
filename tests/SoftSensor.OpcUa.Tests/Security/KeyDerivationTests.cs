using SoftSensor.OpcUa.SecureChannel.Security;

namespace SoftSensor.OpcUa.Tests.Security;

/// <summary>P_SHA256 (RFC 5246 §5) and the key split of Part 6 §6.7.5.</summary>
public sealed class KeyDerivationTests
{
    [Fact]
    public void PSha256_Tls12PrfTestVector_Matches()
    {
        // TLS 1.2 PRF-SHA256 test vector published on the IETF TLS working-group list (2009), from
        // memory: PRF(secret, "test label", seed) = P_SHA256(secret, "test label" ‖ seed), 100 bytes.
        var secret = Convert.FromHexString("9bbe436ba940f017b17652849a71db35");
        var seed = Convert.FromHexString("a0ba9f936cda311827a6f796ffd5198c");
        var output = ChannelKeys.PSha256(secret, [.. "test label"u8.ToArray(), .. seed], 100);
        Assert.Equal(
            "e3f229ba727be17b8d122620557cd453c2aab21d07c3d495329b52d4e61edb5a6b301791e90d35c9c9a46b4e14baf9af0fa022f7077def17abfd3797c0564bab4fbc91666e9def9b97fce34f796789baa48082d122ee42c5a72e5a5110fff70187347b66",
            Convert.ToHexStringLower(output));
    }

    [Theory]
    [InlineData("Basic256Sha256", 32)]
    [InlineData("Aes128_Sha256_RsaOaep", 16)]
    [InlineData("Aes256_Sha256_RsaPss", 32)]
    public void Derive_SplitsSigningKeyEncryptingKeyAndIvInThatOrder(string name, int encryptionKeyBytes)
    {
        // Part 7: DerivedSignatureKeyLength 256 bits for all three; AES key 128 or 256 bits; IV = AES block, 16 bytes.
        var policy = SecurityPolicy.Find(name);
        var clientNonce = Enumerable.Range(0, 32).Select(i => (byte)i).ToArray();
        var serverNonce = Enumerable.Range(100, 32).Select(i => (byte)i).ToArray();
        var (client, server) = ChannelKeys.Derive(policy, clientNonce, serverNonce);

        var clientStream = ChannelKeys.PSha256(serverNonce, clientNonce, 32 + encryptionKeyBytes + 16);
        Assert.Equal(clientStream[..32], client.SigningKey);
        Assert.Equal(clientStream[32..(32 + encryptionKeyBytes)], client.EncryptingKey);
        Assert.Equal(clientStream[(32 + encryptionKeyBytes)..], client.InitializationVector);
        Assert.Equal(ChannelKeys.PSha256(clientNonce, serverNonce, 32), server.SigningKey);
    }

    [Theory]
    [InlineData("Basic128Rsa15")]
    [InlineData("Basic256")]
    [InlineData("http://opcfoundation.org/UA/SecurityPolicy#Basic256")]
    public void Find_DeprecatedPolicy_IsRefusedSayingWhy(string name)
    {
        var e = Assert.Throws<SoftSensor.OpcUa.Services.ServiceResultException>(() => SecurityPolicy.Find(name));
        Assert.Contains("deprecated", e.Message, StringComparison.Ordinal);
        Assert.Contains("SHA-1", e.Message, StringComparison.Ordinal);
    }
}
