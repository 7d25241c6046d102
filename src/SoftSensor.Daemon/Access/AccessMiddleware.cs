using System.Security.Claims;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Http.Features;
using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.Access;

/// <summary>
/// Every request to the status server passes here first, in this order: the Host header must name
/// this server (else 421); the body limit of the endpoint is set (a larger declared body answers 413
/// unread); the caller is identified by <c>Authorization: Bearer</c> or the session cookie; a read needs
/// a viewer (or anonymous reading allowed), a write an operator (401 without credentials, 403 with too
/// little); a write from a browser session must come from this origin (Origin, Sec-Fetch-Site) and carry
/// the session's anti-forgery token (form field <c>_csrf</c> or header <c>X-CSRF-Token</c>), else 403
/// and nothing changes; a write that got through is journaled with the authenticated user.
/// </summary>
internal sealed class AccessMiddleware(RequestDelegate next, AccessPolicy policy, CredentialStore credentials, SessionStore sessions,
    AccessJournal journal, ILogger<AccessMiddleware> log)
{
    public const string AntiForgeryField = "_csrf";
    public const string AntiForgeryHeader = "X-CSRF-Token";
    private const string SessionItem = "softsensor.session";

    public async Task InvokeAsync(HttpContext context)
    {
        var request = context.Request;
        string path = request.Path.Value ?? "/";
        if (!policy.Hosts.Allows(request.Headers.Host))
        {
            await RefuseAsync(context, StatusCodes.Status421MisdirectedRequest, "the Host header does not name this server");
            return;
        }

        long limit = RequestLimits.For(request.Method, path);
        if (context.Features.Get<IHttpMaxRequestBodySizeFeature>() is { IsReadOnly: false } size)
        {
            size.MaxRequestBodySize = limit;
        }

        if (request.ContentLength > limit)
        {
            await RefuseAsync(context, StatusCodes.Status413PayloadTooLarge, $"body of {request.ContentLength} bytes (at most {limit} here)");
            return;
        }

        bool read = HttpMethodsEx.IsRead(request.Method);
        bool loginPath = path is "/login" or "/logout";
        if (!read && !path.StartsWith("/api/", StringComparison.Ordinal) && !request.HasFormContentType && request.ContentLength != 0 && path != "/logout")
        {
            await RefuseAsync(context, StatusCodes.Status415UnsupportedMediaType, "a form post needs Content-Type application/x-www-form-urlencoded or multipart/form-data");
            return;
        }

        var (principal, session, bearer) = Identify(context);
        if (principal is not null)
        {
            context.User = new ClaimsPrincipal(new ClaimsIdentity(
                [new Claim(ClaimTypes.Name, principal.Name), new Claim(ClaimTypes.Role, Roles.Id(principal.Role))], principal.Method));
            context.Items[SessionItem] = session;
        }

        try
        {
            if (!read && !SameOrigin(request))
            {
                await RefuseAsync(context, StatusCodes.Status403Forbidden, "cross-origin write (Origin or Sec-Fetch-Site names another site)");
                return;
            }

            if (!loginPath)
            {
                if (principal is null && !(read && policy.AnonymousRead))
                {
                    await ChallengeAsync(context, read);
                    return;
                }

                if (!read && principal!.Role < Role.Operator)
                {
                    await RefuseAsync(context, StatusCodes.Status403Forbidden, $"{principal.Name} is a {Roles.Id(principal.Role)} (an operator may change this)");
                    return;
                }

                if (!read && !bearer && !await AntiForgeryOkAsync(context, session!))
                {
                    await RefuseAsync(context, StatusCodes.Status403Forbidden, "missing or wrong anti-forgery token");
                    return;
                }
            }

            if (!read && !loginPath)
            {
                // Journaled as the answer starts, so a client that got its answer finds the row.
                var who = principal!;
                context.Response.OnStarting(() =>
                {
                    journal.Append(who, request.Method, path, context.Response.StatusCode);
                    AccessLog.Change(log, who.Name, Roles.Id(who.Role), who.Method, request.Method, path, context.Response.StatusCode);
                    return Task.CompletedTask;
                });
            }

            await next(context);
        }
        catch (BadHttpRequestException e) when (!context.Response.HasStarted)
        {
            await RefuseAsync(context, e.StatusCode, e.Message);
            return;
        }
    }

    /// <summary>The authenticated user's name (the journal's "who"); null for an anonymous reader.</summary>
    public static string? UserName(HttpContext context) => context.User.Identity is { IsAuthenticated: true, Name: { } n } ? n : null;

    /// <summary>The hidden form field with the session's anti-forgery token ("" without a session).</summary>
    public static string FormField(HttpContext context) =>
        context.Items[SessionItem] is Session s ? $"<input type=\"hidden\" name=\"{AntiForgeryField}\" value=\"{s.AntiForgery}\">" : "";

    /// <summary>The session's anti-forgery token, or null.</summary>
    public static string? Token(HttpContext context) => context.Items[SessionItem] is Session s ? s.AntiForgery : null;

    private (Principal? Principal, Session? Session, bool Bearer) Identify(HttpContext context)
    {
        string? auth = context.Request.Headers.Authorization;
        if (auth is not null && auth.StartsWith("Bearer ", StringComparison.OrdinalIgnoreCase))
        {
            return (credentials.CheckToken(auth["Bearer ".Length..].Trim()), null, true);
        }

        var session = sessions.Find(context.Request.Cookies[SessionStore.CookieName]);
        return (session?.Principal, session, false);
    }

    private static bool SameOrigin(HttpRequest request)
    {
        string? site = request.Headers["Sec-Fetch-Site"];
        if (site is not null && site != "same-origin" && site != "none")
        {
            return false;
        }

        string? origin = request.Headers.Origin;
        return origin is null || string.Equals(origin, $"{request.Scheme}://{request.Host.Value}", StringComparison.OrdinalIgnoreCase);
    }

    private static async Task<bool> AntiForgeryOkAsync(HttpContext context, Session session)
    {
        var request = context.Request;
        if (request.HasFormContentType)
        {
            var form = await request.ReadFormAsync(context.RequestAborted);
            return session.AntiForgeryMatches(form[AntiForgeryField].ToString());
        }

        return session.AntiForgeryMatches(request.Headers[AntiForgeryHeader].ToString());
    }

    private static Task ChallengeAsync(HttpContext context, bool read)
    {
        var request = context.Request;
        if (read && request.Headers.Accept.ToString().Contains("text/html", StringComparison.Ordinal))
        {
            context.Response.Redirect("/login?next=" + Uri.EscapeDataString(request.Path + request.QueryString));
            return Task.CompletedTask;
        }

        context.Response.StatusCode = StatusCodes.Status401Unauthorized;
        context.Response.Headers.WWWAuthenticate = "Bearer realm=\"softsensor\"";
        return context.Response.WriteAsJsonAsync(new { problems = new[] { "authentication required: log in at /login or send Authorization: Bearer TOKEN" } });
    }

    private Task RefuseAsync(HttpContext context, int status, string reason)
    {
        AccessLog.Refused(log, status, reason, context.Request.Method, context.Request.Path.Value ?? "", context.Connection.RemoteIpAddress?.ToString() ?? "?");
        context.Response.StatusCode = status;
        if (status == StatusCodes.Status413PayloadTooLarge || status == StatusCodes.Status421MisdirectedRequest)
        {
            context.Response.Headers.Connection = "close";
        }

        return context.Response.WriteAsJsonAsync(new { problems = new[] { reason } });
    }
}

/// <summary>The resolved access settings: hosts and whether anonymous reading is allowed.</summary>
internal sealed class AccessPolicy(HostPolicy hosts, bool anonymousRead)
{
    public HostPolicy Hosts { get; } = hosts;

    public bool AnonymousRead { get; } = anonymousRead;
}
