using Microsoft.Extensions.Logging;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Session;

/// <summary>
/// Builds the user identity token for ActivateSession from the policies the server advertised
/// on its None endpoint (Part 4 §7.36, §7.42). A user-name password goes in clear text only when
/// the token policy's SecurityPolicyUri is None or empty (the channel is None here), with a
/// warning in the log; encrypted passwords need a secured policy, which this client does not
/// have yet.
/// </summary>
internal static class IdentityTokens
{
    public static IUaEncodeable Build(UserIdentity identity, IReadOnlyList<EndpointDescription> endpoints, ILogger logger)
    {
        var wanted = identity is UserNameIdentity ? UserTokenType.UserName : UserTokenType.Anonymous;
        var policy = endpoints
            .Where(e => e.SecurityMode == MessageSecurityMode.None)
            .SelectMany(e => e.UserIdentityTokens)
            .Where(p => p.TokenType == wanted)
            .OrderBy(p => string.IsNullOrEmpty(p.SecurityPolicyUri) || p.SecurityPolicyUri == SecurityPolicies.None ? 0 : 1)
            .FirstOrDefault()
            ?? throw new ServiceResultException(new StatusCode(StatusCodes.BadIdentityTokenRejected), $"The server offers no {wanted} token policy on a SecurityPolicy None endpoint");

        if (identity is not UserNameIdentity user)
        {
            return new AnonymousIdentityToken(policy.PolicyId);
        }

        if (!string.IsNullOrEmpty(policy.SecurityPolicyUri) && policy.SecurityPolicyUri != SecurityPolicies.None)
        {
            throw new ServiceResultException(new StatusCode(StatusCodes.BadIdentityTokenRejected),
                $"User-name policy '{policy.PolicyId}' asks for {policy.SecurityPolicyUri} password encryption, which this client does not support yet");
        }

        SessionLog.ClearTextPassword(logger, user.User, policy.PolicyId);
        return new UserNameIdentityToken(policy.PolicyId, user.User, System.Text.Encoding.UTF8.GetBytes(user.Password), null);
    }

    /// <summary>Who, for logs: "anonymous" or the user name (never the password).</summary>
    public static string Describe(UserIdentity identity) => identity is UserNameIdentity u ? u.User : "anonymous";
}
