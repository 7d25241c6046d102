using Microsoft.Extensions.Logging;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Pki;
using SoftSensor.OpcUa.SecureChannel;
using SoftSensor.OpcUa.SecureChannel.Security;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Session;

/// <summary>
/// Chooses the endpoint and security of a connection: GetEndpoints on a SecurityPolicy None
/// channel (which Part 4 §5.4.4 allows for discovery), keeps the endpoints that match the asked
/// mode and policy and that this client speaks (deprecated policies are refused with the reason),
/// takes the most secure (SignAndEncrypt over Sign, then the policy's rank, then the server's
/// SecurityLevel), loads or creates this client's certificate and validates the server's against
/// the trust list.
/// </summary>
public static class EndpointSelector
{
    /// <summary>The endpoints a server offers (GetEndpoints over SecurityPolicy None).</summary>
    public static async Task<EndpointDescription[]> GetEndpointsAsync(string endpointUrl, ChannelOptions options, TimeProvider time, ILogger logger, CancellationToken cancellationToken)
    {
        var channel = await UaSecureChannel.OpenAsync(endpointUrl, options, time, Microsoft.Extensions.Logging.Abstractions.NullLogger.Instance, cancellationToken);
        try
        {
            var request = new GetEndpointsRequest { Header = new RequestHeader { Timestamp = time.GetUtcNow().UtcDateTime, RequestHandle = 1 }, EndpointUrl = endpointUrl };
            var response = await channel.SendAsync<GetEndpointsResponse>(request, null, cancellationToken);
            return response.Endpoints;
        }
        finally
        {
            await channel.CloseAsync(CancellationToken.None);
        }
    }

    /// <summary>Resolves the channel security for <paramref name="options"/>; None needs no discovery.</summary>
    public static async Task<ChannelSecurity> ResolveAsync(SessionOptions options, TimeProvider time, ILogger logger, CancellationToken cancellationToken)
    {
        var wanted = options.Security;
        var policy = wanted.Policy is null ? null : SecurityPolicy.Find(wanted.Policy);
        if (wanted.Mode == SecurityChoice.None || (policy is not null && policy.IsNone))
        {
            if (wanted.Mode is SecurityChoice.Sign or SecurityChoice.SignAndEncrypt)
            {
                throw new ServiceResultException(new StatusCode(StatusCodes.BadSecurityPolicyRejected), $"Mode {wanted.Mode} needs a security policy other than None");
            }

            return ChannelSecurity.None;
        }

        var endpoints = await GetEndpointsAsync(options.EndpointUrl, options.Channel, time, logger, cancellationToken);
        var chosen = Choose(endpoints, wanted.Mode, policy, options.EndpointUrl);
        var selected = SecurityPolicy.FromUri(chosen.SecurityPolicyUri)!;
        if (selected.IsNone)
        {
            SelectorLog.Selected(logger, options.EndpointUrl, "None", wanted.Mode.ToString());
            return ChannelSecurity.None;
        }

        var store = new PkiStore(wanted.PkiDirectory ?? SecuritySettings.DefaultPkiDirectory);
        var (own, created) = store.LoadOrCreateOwn(options.ApplicationUri, options.ApplicationName, time.GetUtcNow());
        if (created)
        {
            SelectorLog.CertificateCreated(logger, CertificateFacts.Describe(own), store.OwnCerts);
        }

        var server = new ServerCertificateValidator(store, time).Validate(chosen.ServerCertificate, options.EndpointUrl, chosen.Server.ApplicationUri);
        var security = new ChannelSecurity { Policy = selected, Mode = chosen.SecurityMode, ClientCertificate = own, ServerCertificate = server };
        SelectorLog.Selected(logger, options.EndpointUrl, security.Describe(), wanted.Mode.ToString());
        return security;
    }

    /// <summary>The most secure endpoint matching the wish; refuses with what the server offers when none does.</summary>
    public static EndpointDescription Choose(IReadOnlyList<EndpointDescription> endpoints, SecurityChoice mode, SecurityPolicy? policy, string endpointUrl)
    {
        var binary = endpoints.Where(e => e.TransportProfileUri is null || e.TransportProfileUri.EndsWith("uatcp-uasc-uabinary", StringComparison.Ordinal)).ToList();
        var matching = binary
            .Where(e => SecurityPolicy.FromUri(e.SecurityPolicyUri) is { } p && (policy is null || p == policy))
            .Where(e => mode switch
            {
                SecurityChoice.Sign => e.SecurityMode == MessageSecurityMode.Sign,
                SecurityChoice.SignAndEncrypt => e.SecurityMode == MessageSecurityMode.SignAndEncrypt,
                _ => e.SecurityMode is MessageSecurityMode.None or MessageSecurityMode.Sign or MessageSecurityMode.SignAndEncrypt,
            })
            .Where(e => (e.SecurityMode == MessageSecurityMode.None) == SecurityPolicy.FromUri(e.SecurityPolicyUri)!.IsNone)
            .OrderByDescending(e => e.SecurityMode == MessageSecurityMode.SignAndEncrypt ? 2 : e.SecurityMode == MessageSecurityMode.Sign ? 1 : 0)
            .ThenByDescending(e => SecurityPolicy.FromUri(e.SecurityPolicyUri)!.Rank)
            .ThenByDescending(e => e.SecurityLevel)
            .ToList();
        if (matching.Count > 0)
        {
            return matching[0];
        }

        string offered = string.Join("; ", binary.Select(Describe).Distinct(StringComparer.Ordinal));
        string asked = $"{(mode == SecurityChoice.Auto ? "any mode" : mode.ToString())} with {(policy is null ? "any supported policy" : policy.Name)}";
        uint code = policy is not null && binary.All(e => e.SecurityPolicyUri != policy.Uri) ? StatusCodes.BadSecurityPolicyRejected : StatusCodes.BadSecurityModeRejected;
        throw new ServiceResultException(new StatusCode(code), $"The server at {endpointUrl} has no endpoint for {asked}; it offers: {(offered.Length == 0 ? "nothing over opc.tcp" : offered)}");
    }

    private static string Describe(EndpointDescription e)
    {
        string name = e.SecurityPolicyUri is { } uri && uri.StartsWith(SecurityPolicies.Prefix, StringComparison.Ordinal) ? uri[SecurityPolicies.Prefix.Length..] : e.SecurityPolicyUri ?? "?";
        string why = SecurityPolicy.Deprecated.TryGetValue(name, out var reason) ? $" (refused: {reason})" : SecurityPolicy.FromUri(e.SecurityPolicyUri) is null ? " (unknown to this client)" : string.Empty;
        return $"{name} {e.SecurityMode}{why}";
    }
}

/// <summary>Log events of endpoint selection (event ids 4160–4169).</summary>
internal static partial class SelectorLog
{
    [LoggerMessage(EventId = 4160, Level = LogLevel.Information, Message = "OPC UA endpoint {Endpoint}: security {Security} selected (asked: {Asked})")]
    public static partial void Selected(ILogger logger, string endpoint, string security, string asked);

    [LoggerMessage(EventId = 4161, Level = LogLevel.Warning, Message = "OPC UA application certificate created: {Certificate} in {Folder}; servers must trust it")]
    public static partial void CertificateCreated(ILogger logger, string certificate, string folder);
}
