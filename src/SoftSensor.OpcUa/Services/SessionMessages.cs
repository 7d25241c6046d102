using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>SignatureData (Part 4 §7.37): the algorithm URI and the signature; empty under SecurityPolicy None.</summary>
public sealed record SignatureData(string? Algorithm, byte[]? Signature)
{
    public static SignatureData Empty { get; } = new(null, null);

    public void Encode(UaBinaryWriter w)
    {
        w.WriteString(Algorithm);
        w.WriteByteString(Signature);
    }

    public static SignatureData Decode(UaBinaryReader r) => new(r.ReadString(), r.ReadByteString());
}

/// <summary>CreateSession request (Part 4 §5.6.2.2).</summary>
public sealed record CreateSessionRequest : IServiceRequest
{
    public uint BinaryEncodingId => 461;

    public RequestHeader Header { get; set; } = new();

    public ApplicationDescription ClientDescription { get; init; } = new();

    public string? ServerUri { get; init; }

    public string? EndpointUrl { get; init; }

    public string? SessionName { get; init; }

    public byte[]? ClientNonce { get; init; }

    public byte[]? ClientCertificate { get; init; }

    public double RequestedSessionTimeoutMs { get; init; }

    public uint MaxResponseMessageSize { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        ClientDescription.Encode(w);
        w.WriteString(ServerUri);
        w.WriteString(EndpointUrl);
        w.WriteString(SessionName);
        w.WriteByteString(ClientNonce);
        w.WriteByteString(ClientCertificate);
        w.WriteDouble(RequestedSessionTimeoutMs);
        w.WriteUInt32(MaxResponseMessageSize);
    }
}

/// <summary>CreateSession response (Part 4 §5.6.2.2); the software certificates are read and dropped.</summary>
public sealed record CreateSessionResponse : IServiceResponse
{
    public const uint EncodingId = 464;

    public required ResponseHeader Header { get; init; }

    public required NodeId SessionId { get; init; }

    public required NodeId AuthenticationToken { get; init; }

    public double RevisedSessionTimeoutMs { get; init; }

    public byte[]? ServerNonce { get; init; }

    /// <summary>The server's certificate (or chain), as sent: the client signs it in ActivateSession.</summary>
    public byte[]? ServerCertificate { get; init; }

    public EndpointDescription[] ServerEndpoints { get; init; } = [];

    /// <summary>The server's signature over the client's certificate and nonce (Part 4 §5.6.2.2).</summary>
    public SignatureData ServerSignature { get; init; } = SignatureData.Empty;

    public uint MaxRequestMessageSize { get; init; }

    public static CreateSessionResponse Decode(UaBinaryReader r)
    {
        var header = ResponseHeader.Decode(r);
        var sessionId = r.ReadNodeId();
        var token = r.ReadNodeId();
        double timeout = r.ReadDouble();
        var nonce = r.ReadByteString();
        var certificate = r.ReadByteString();
        var endpoints = r.ReadArrayOrEmpty(EndpointDescription.Decode);
        r.ReadArray(static x => (x.ReadByteString(), x.ReadByteString())); // ServerSoftwareCertificates
        var signature = SignatureData.Decode(r);
        uint maxRequest = r.ReadUInt32();
        return new CreateSessionResponse
        {
            Header = header,
            SessionId = sessionId,
            AuthenticationToken = token,
            RevisedSessionTimeoutMs = timeout,
            ServerNonce = nonce,
            ServerCertificate = certificate,
            ServerEndpoints = endpoints,
            ServerSignature = signature,
            MaxRequestMessageSize = maxRequest,
        };
    }
}

/// <summary>ActivateSession request (Part 4 §5.6.3.2).</summary>
public sealed record ActivateSessionRequest : IServiceRequest
{
    public uint BinaryEncodingId => 467;

    public RequestHeader Header { get; set; } = new();

    public required IUaEncodeable UserIdentityToken { get; init; }

    public string?[] LocaleIds { get; init; } = [];

    /// <summary>The client's signature over the server's certificate and its last nonce (empty under None).</summary>
    public SignatureData ClientSignature { get; init; } = SignatureData.Empty;

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        ClientSignature.Encode(w);
        w.WriteInt32(-1); // ClientSoftwareCertificates
        w.WriteArray(LocaleIds, static (x, s) => x.WriteString(s));
        w.WriteExtensionObject(UserIdentityToken);
        SignatureData.Empty.Encode(w); // UserTokenSignature
    }
}

/// <summary>ActivateSession response (Part 4 §5.6.3.2).</summary>
public sealed record ActivateSessionResponse(ResponseHeader Header, byte[]? ServerNonce, StatusCode[] Results) : IServiceResponse
{
    public const uint EncodingId = 470;

    public static ActivateSessionResponse Decode(UaBinaryReader r)
    {
        var response = new ActivateSessionResponse(ResponseHeader.Decode(r), r.ReadByteString(), r.ReadArrayOrEmpty(static x => x.ReadStatusCode()));
        r.ReadArray(static x => x.ReadDiagnosticInfo());
        return response;
    }
}

/// <summary>AnonymousIdentityToken (Part 4 §7.36.3).</summary>
public sealed record AnonymousIdentityToken(string? PolicyId) : IUaEncodeable
{
    public uint BinaryEncodingId => 321;

    public void Encode(UaBinaryWriter w) => w.WriteString(PolicyId);
}

/// <summary>
/// UserNameIdentityToken (Part 4 §7.36.4). With no EncryptionAlgorithm the password travels as
/// UTF-8 clear text: allowed only when both channel and token policy are None (the session warns).
/// </summary>
public sealed record UserNameIdentityToken(string? PolicyId, string UserName, byte[] Password, string? EncryptionAlgorithm) : IUaEncodeable
{
    public uint BinaryEncodingId => 324;

    public void Encode(UaBinaryWriter w)
    {
        w.WriteString(PolicyId);
        w.WriteString(UserName);
        w.WriteByteString(Password);
        w.WriteString(EncryptionAlgorithm);
    }

    public override string ToString() => $"UserNameIdentityToken {{ PolicyId = {PolicyId}, UserName = {UserName} }}";
}

/// <summary>CloseSession request (Part 4 §5.6.4.2).</summary>
public sealed record CloseSessionRequest : IServiceRequest
{
    public uint BinaryEncodingId => 473;

    public RequestHeader Header { get; set; } = new();

    public bool DeleteSubscriptions { get; init; } = true;

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteBoolean(DeleteSubscriptions);
    }
}

/// <summary>CloseSession response (Part 4 §5.6.4.2).</summary>
public sealed record CloseSessionResponse(ResponseHeader Header) : IServiceResponse
{
    public const uint EncodingId = 476;

    public static CloseSessionResponse Decode(UaBinaryReader r) => new(ResponseHeader.Decode(r));
}
