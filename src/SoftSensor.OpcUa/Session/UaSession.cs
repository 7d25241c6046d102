using Microsoft.Extensions.Logging;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.SecureChannel;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Session;

/// <summary>
/// A session on a secure channel (Part 4 §5.6): CreateSession, ActivateSession with the
/// configured identity, the NamespaceArray, and the services (in the partial files beside this
/// one). On a secured channel the server proves it holds its certificate's key by signing the
/// client's certificate and nonce (checked here), and the client signs the server's certificate
/// and latest nonce in every ActivateSession (Part 4 §5.6.2, §5.6.3). The session outlives its channel: after a reconnect <see cref="ReactivateAsync"/> binds it
/// to a new channel (Part 4 §6.7). Threading contract: services may be called concurrently.
/// </summary>
public sealed partial class UaSession
{
    private readonly SessionOptions options;
    private readonly TimeProvider time;
    private readonly ILogger logger;
    private int requestHandle;

    private UaSession(UaSecureChannel channel, SessionOptions options, TimeProvider time, ILogger logger, CreateSessionResponse created)
    {
        Channel = channel;
        this.options = options;
        this.time = time;
        this.logger = logger;
        SessionId = created.SessionId;
        AuthenticationToken = created.AuthenticationToken;
        RevisedTimeout = TimeSpan.FromMilliseconds(created.RevisedSessionTimeoutMs);
        ServerEndpoints = created.ServerEndpoints;
        serverCertificate = created.ServerCertificate;
        serverNonce = created.ServerNonce;
    }

    private readonly byte[]? serverCertificate;
    private byte[]? serverNonce;

    /// <summary>The channel the session currently talks on.</summary>
    public UaSecureChannel Channel { get; private set; }

    public NodeId SessionId { get; }

    /// <summary>The secret that identifies the session in every request header (never logged).</summary>
    internal NodeId AuthenticationToken { get; }

    public TimeSpan RevisedTimeout { get; }

    public IReadOnlyList<EndpointDescription> ServerEndpoints { get; }

    /// <summary>The server's namespaces, read at activation.</summary>
    public NamespaceTable Namespaces { get; private set; } = new([]);

    /// <summary>Creates and activates a session on an open channel, then reads the NamespaceArray.</summary>
    public static async Task<UaSession> CreateAsync(UaSecureChannel channel, SessionOptions options, TimeProvider time, ILogger logger, CancellationToken cancellationToken)
    {
        var security = channel.Security;
        var clientNonce = System.Security.Cryptography.RandomNumberGenerator.GetBytes(32);
        var clientCertificate = security.IsNone ? null : security.ClientCertificate!.RawData;
        var request = new CreateSessionRequest
        {
            Header = new RequestHeader { Timestamp = time.GetUtcNow().UtcDateTime, RequestHandle = 1 },
            ClientDescription = new ApplicationDescription
            {
                ApplicationUri = options.ApplicationUri,
                ProductUri = options.ProductUri,
                ApplicationName = new LocalizedText(null, options.ApplicationName),
                ApplicationType = ApplicationType.Client,
            },
            EndpointUrl = options.EndpointUrl,
            SessionName = options.SessionName,
            ClientNonce = clientNonce,
            ClientCertificate = clientCertificate,
            RequestedSessionTimeoutMs = options.SessionTimeout.TotalMilliseconds,
            MaxResponseMessageSize = options.Channel.Limits.MaxMessageSize,
        };
        CreateSessionResponse created;
        try
        {
            created = await channel.SendAsync<CreateSessionResponse>(request, null, cancellationToken);
        }
        catch (ServiceResultException e) when (security.IsNone && (e.Status.Is(StatusCodes.BadSecurityModeRejected) || e.Status.Is(StatusCodes.BadSecurityPolicyRejected)))
        {
            throw new ServiceResultException(e.Status, "The server refuses sessions over SecurityPolicy None (it offers secured endpoints only: ask for sign or sign-encrypt, or leave the security choice to the client)", e);
        }

        SessionSignatures.CheckServer(security, created, clientCertificate, clientNonce);
        var session = new UaSession(channel, options, time, logger, created);
        await session.ActivateAsync(channel, cancellationToken);
        SessionLog.Created(logger, session.SessionId.ToString(), options.EndpointUrl, IdentityTokens.Describe(options.Identity), session.RevisedTimeout.TotalMilliseconds);
        return session;
    }

    /// <summary>
    /// Binds the session to a new channel with ActivateSession (Part 4 §6.7 step 2). False when the
    /// server no longer knows the session (a new one must be created); other failures throw.
    /// </summary>
    public async Task<bool> ReactivateAsync(UaSecureChannel newChannel, CancellationToken cancellationToken)
    {
        try
        {
            await ActivateAsync(newChannel, cancellationToken);
            SessionLog.Reactivated(logger, SessionId.ToString());
            return true;
        }
        catch (ServiceResultException e) when (e.Status.Is(StatusCodes.BadSessionIdInvalid) || e.Status.Is(StatusCodes.BadSessionClosed)
            || e.Status.Is(StatusCodes.BadSessionNotActivated) || e.Status.Is(StatusCodes.BadIdentityTokenInvalid) || e.Status.Is(StatusCodes.BadSecurityChecksFailed))
        {
            SessionLog.ReactivationRefused(logger, SessionId.ToString(), e.Status.ToString());
            return false;
        }
    }

    /// <summary>Sends a request with this session's header (token, handle, time).</summary>
    public Task<TResponse> CallAsync<TResponse>(IServiceRequest request, CancellationToken cancellationToken, TimeSpan? timeout = null)
        where TResponse : class, IServiceResponse
    {
        request.Header = request.Header with
        {
            AuthenticationToken = AuthenticationToken,
            Timestamp = time.GetUtcNow().UtcDateTime,
            RequestHandle = unchecked((uint)Interlocked.Increment(ref requestHandle)),
        };
        return Channel.SendAsync<TResponse>(request, timeout, cancellationToken);
    }

    /// <summary>CloseSession (deleting its subscriptions by default); a dead link is not an error here.</summary>
    public async Task CloseAsync(bool deleteSubscriptions, CancellationToken cancellationToken)
    {
        if (!Channel.IsOpen)
        {
            return;
        }

        try
        {
            await CallAsync<CloseSessionResponse>(new CloseSessionRequest { DeleteSubscriptions = deleteSubscriptions }, cancellationToken, TimeSpan.FromSeconds(5));
        }
        catch (ServiceResultException)
        {
            // Closing anyway: the server drops the session when its timeout runs out.
        }
    }

    private async Task ActivateAsync(UaSecureChannel channel, CancellationToken cancellationToken)
    {
        var token = IdentityTokens.Build(options.Identity, ServerEndpoints, channel.Security, serverCertificate, serverNonce, logger);
        var request = new ActivateSessionRequest
        {
            UserIdentityToken = token,
            LocaleIds = ["en"],
            ClientSignature = SessionSignatures.Client(channel.Security, serverCertificate, serverNonce),
        };
        request.Header = new RequestHeader
        {
            AuthenticationToken = AuthenticationToken,
            Timestamp = time.GetUtcNow().UtcDateTime,
            RequestHandle = unchecked((uint)Interlocked.Increment(ref requestHandle)),
        };
        ActivateSessionResponse activated;
        try
        {
            activated = await channel.SendAsync<ActivateSessionResponse>(request, null, cancellationToken);
        }
        catch (ServiceResultException e) when (e.Status.Is(StatusCodes.BadUserAccessDenied) || e.Status.Is(StatusCodes.BadIdentityTokenRejected) || e.Status.Is(StatusCodes.BadIdentityTokenInvalid))
        {
            string who = options.Identity is UserNameIdentity user ? $"user '{user.User}' (user name or password not accepted, or this user may not log in)" : "an anonymous session (the server wants a user name)";
            throw new ServiceResultException(e.Status, $"The server refused the login of {who}", e);
        }

        serverNonce = activated.ServerNonce ?? serverNonce;
        Channel = channel;
        Namespaces = await ReadNamespacesAsync(cancellationToken);
    }
}
