using System.Net;
using System.Text.RegularExpressions;
using SoftSensor.Daemon.Tests.Fixtures;

namespace SoftSensor.Daemon.Tests.Access;

/// <summary>An HTTP client that logs in through the login form, as a browser would (cookies kept).</summary>
internal sealed partial class LoginClient : IDisposable
{
    private LoginClient(HttpClient http, CookieContainer cookies)
    {
        Http = http;
        Cookies = cookies;
    }

    public HttpClient Http { get; }

    public CookieContainer Cookies { get; }

    public static async Task<LoginClient> LogInAsync(string baseAddress, string user, string password = TestAccess.Password)
    {
        var cookies = new CookieContainer();
        var http = new HttpClient(new HttpClientHandler { CookieContainer = cookies, AllowAutoRedirect = false }) { BaseAddress = new Uri(baseAddress) };
        string form = await http.GetStringAsync(new Uri("/login", UriKind.Relative));
        using var post = new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["_csrf"] = Field().Match(form).Groups[1].Value, ["next"] = "/", ["user"] = user, ["password"] = password,
        });
        using var r = await http.PostAsync(new Uri("/login", UriKind.Relative), post);
        Assert.True(r.StatusCode == HttpStatusCode.Redirect, $"login of {user} answered {(int)r.StatusCode}: {await r.Content.ReadAsStringAsync()}");
        return new LoginClient(http, cookies);
    }

    /// <summary>The anti-forgery token a page of this session carries (from /batches).</summary>
    public async Task<string> AntiForgeryAsync() => Field().Match(await Http.GetStringAsync(new Uri("/batches", UriKind.Relative))).Groups[1].Value;

    public void Dispose() => Http.Dispose();

    [GeneratedRegex("name=\"_csrf\" value=\"([^\"]+)\"")]
    private static partial Regex Field();
}
