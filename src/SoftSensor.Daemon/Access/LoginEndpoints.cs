using System.Net;
using System.Security.Cryptography;
using System.Text;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.Access;

/// <summary>
/// Login on the status server: <c>GET /login</c> the form (its own anti-forgery pair: a cookie and a
/// field, so a foreign page cannot log a browser in as someone else); <c>POST /login</c> user and
/// password, then the session cookie and a redirect to <c>next</c> (a local path only);
/// <c>GET /login?token=</c> trades a one-time token (the demo's link) for a session;
/// <c>POST /logout</c>; <c>GET /api/session</c> who is logged in and the session's anti-forgery token
/// for the page's scripts (same-origin only: no CORS).
/// </summary>
internal static class LoginEndpoints
{
    private const string LoginCookie = "softsensor_login";

    public static void MapLoginEndpoints(this IEndpointRouteBuilder app)
    {
        app.MapGet("/login", (HttpContext context, string? next, string? token, CredentialStore credentials, SessionStore sessions) =>
        {
            if (token is not null)
            {
                if (credentials.UseOneTimeToken(token) is { } role)
                {
                    StartSession(context, sessions, new Principal(Roles.Id(role) + "-link", role, "one-time token"));
                    return Results.Redirect(LocalPath(next));
                }

                return Page(context, next, "That login link was used already or is unknown: log in with a user name and password.", 401);
            }

            return Page(context, next, "", 200);
        });
        app.MapPost("/login", async (HttpContext context, CredentialStore credentials, SessionStore sessions, ILogger<CredentialStore> log) =>
        {
            var form = await context.Request.ReadFormAsync(context.RequestAborted);
            string next = form["next"].ToString();
            string? expected = context.Request.Cookies[LoginCookie];
            string presented = form[AccessMiddleware.AntiForgeryField].ToString();
            if (expected is null || !CryptographicOperations.FixedTimeEquals(Encoding.ASCII.GetBytes(expected), Encoding.ASCII.GetBytes(presented)))
            {
                return Page(context, next, "The login form expired: try again.", 403);
            }

            string user = form["user"].ToString();
            if (credentials.CheckPassword(user, form["password"].ToString()) is not { } principal)
            {
                AccessLog.LoginRefused(log, user.Length <= 64 ? user : user[..64], context.Connection.RemoteIpAddress?.ToString() ?? "?");
                return Page(context, next, "Unknown user or wrong password.", 401);
            }

            StartSession(context, sessions, principal);
            return Results.Redirect(LocalPath(next), permanent: false, preserveMethod: false);
        });
        app.MapPost("/logout", (HttpContext context, SessionStore sessions) =>
        {
            if (context.Request.Cookies[SessionStore.CookieName] is { } id)
            {
                sessions.Close(id);
            }

            context.Response.Cookies.Delete(SessionStore.CookieName);
            return Results.Redirect("/login");
        });
        app.MapGet("/api/session", (HttpContext context) =>
            AccessMiddleware.UserName(context) is { } name
                ? Results.Json(new { user = name, role = context.User.FindFirst(System.Security.Claims.ClaimTypes.Role)?.Value, csrf = AccessMiddleware.Token(context) })
                : Results.Json(new { user = (string?)null, role = (string?)null, csrf = (string?)null }));
    }

    private static void StartSession(HttpContext context, SessionStore sessions, Principal principal)
    {
        var s = sessions.Open(principal);
        context.Response.Cookies.Append(SessionStore.CookieName, s.Id, new CookieOptions
        {
            HttpOnly = true,
            SameSite = SameSiteMode.Strict,
            Secure = context.Request.IsHttps,
            Path = "/",
            IsEssential = true,
        });
        context.Response.Cookies.Delete(LoginCookie);
    }

    /// <summary>A redirect target that stays on this server: a path starting with one slash, else <c>/</c>.</summary>
    public static string LocalPath(string? next) =>
        next is { Length: > 0 } n && n[0] == '/' && !n.StartsWith("//", StringComparison.Ordinal) && !n.Contains('\\', StringComparison.Ordinal) ? n : "/";

    private static IResult Page(HttpContext context, string? next, string message, int status)
    {
        string pair = PasswordHash.RandomId();
        context.Response.Cookies.Append(LoginCookie, pair, new CookieOptions
        {
            HttpOnly = true,
            SameSite = SameSiteMode.Strict,
            Secure = context.Request.IsHttps,
            Path = "/login",
            MaxAge = TimeSpan.FromMinutes(30),
        });
        var h = new StringBuilder("<!doctype html><html><head><meta charset=\"utf-8\"><title>softsensor login</title></head><body>");
        h.Append("<h1>Log in</h1><p>Advisory soft sensor: not a safety instrumented system.</p>");
        if (message.Length > 0)
        {
            h.Append("<p id=\"outcome\">").Append(WebUtility.HtmlEncode(message)).Append("</p>");
        }

        h.Append("<form id=\"login\" method=\"post\" action=\"/login\">")
         .Append("<input type=\"hidden\" name=\"").Append(AccessMiddleware.AntiForgeryField).Append("\" value=\"").Append(pair).Append("\">")
         .Append("<input type=\"hidden\" name=\"next\" value=\"").Append(WebUtility.HtmlEncode(LocalPath(next))).Append("\">")
         .Append("<label>User <input name=\"user\" autocomplete=\"username\"></label><br>")
         .Append("<label>Password <input name=\"password\" type=\"password\" autocomplete=\"current-password\"></label><br>")
         .Append("<button>Log in</button></form></body></html>");
        return Results.Content(h.ToString(), "text/html; charset=utf-8", Encoding.UTF8, status);
    }
}
