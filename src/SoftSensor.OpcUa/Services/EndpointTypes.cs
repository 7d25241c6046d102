using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>ApplicationDescription (Part 4 §7.2).</summary>
public sealed record ApplicationDescription
{
    public string? ApplicationUri { get; init; }

    public string? ProductUri { get; init; }

    public LocalizedText ApplicationName { get; init; } = LocalizedText.Null;

    public ApplicationType ApplicationType { get; init; }

    public string? GatewayServerUri { get; init; }

    public string? DiscoveryProfileUri { get; init; }

    public string?[] DiscoveryUrls { get; init; } = [];

    public void Encode(UaBinaryWriter w)
    {
        w.WriteString(ApplicationUri);
        w.WriteString(ProductUri);
        w.WriteLocalizedText(ApplicationName);
        w.WriteInt32((int)ApplicationType);
        w.WriteString(GatewayServerUri);
        w.WriteString(DiscoveryProfileUri);
        w.WriteArray(DiscoveryUrls, static (x, s) => x.WriteString(s));
    }

    public static ApplicationDescription Decode(UaBinaryReader r) => new()
    {
        ApplicationUri = r.ReadString(),
        ProductUri = r.ReadString(),
        ApplicationName = r.ReadLocalizedText(),
        ApplicationType = (ApplicationType)r.ReadInt32(),
        GatewayServerUri = r.ReadString(),
        DiscoveryProfileUri = r.ReadString(),
        DiscoveryUrls = r.ReadArrayOrEmpty(static x => x.ReadString()),
    };
}

/// <summary>UserTokenPolicy (Part 4 §7.42).</summary>
public sealed record UserTokenPolicy(string? PolicyId, UserTokenType TokenType, string? IssuedTokenType, string? IssuerEndpointUrl, string? SecurityPolicyUri)
{
    public static UserTokenPolicy Decode(UaBinaryReader r) =>
        new(r.ReadString(), (UserTokenType)r.ReadInt32(), r.ReadString(), r.ReadString(), r.ReadString());
}

/// <summary>EndpointDescription (Part 4 §7.14).</summary>
public sealed record EndpointDescription
{
    public string? EndpointUrl { get; init; }

    public ApplicationDescription Server { get; init; } = new();

    public byte[]? ServerCertificate { get; init; }

    public MessageSecurityMode SecurityMode { get; init; }

    public string? SecurityPolicyUri { get; init; }

    public UserTokenPolicy[] UserIdentityTokens { get; init; } = [];

    public string? TransportProfileUri { get; init; }

    public byte SecurityLevel { get; init; }

    public static EndpointDescription Decode(UaBinaryReader r) => new()
    {
        EndpointUrl = r.ReadString(),
        Server = ApplicationDescription.Decode(r),
        ServerCertificate = r.ReadByteString(),
        SecurityMode = (MessageSecurityMode)r.ReadInt32(),
        SecurityPolicyUri = r.ReadString(),
        UserIdentityTokens = r.ReadArrayOrEmpty(UserTokenPolicy.Decode),
        TransportProfileUri = r.ReadString(),
        SecurityLevel = r.ReadByte(),
    };
}

/// <summary>The security policy URIs of Part 7 this client knows.</summary>
public static class SecurityPolicies
{
    public const string Prefix = "http://opcfoundation.org/UA/SecurityPolicy#";
    public const string None = Prefix + "None";
    public const string Basic256Sha256 = Prefix + "Basic256Sha256";
    public const string Aes128Sha256RsaOaep = Prefix + "Aes128_Sha256_RsaOaep";
    public const string Aes256Sha256RsaPss = Prefix + "Aes256_Sha256_RsaPss";
}
