using System.Security.Cryptography.X509Certificates;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Server.Kestrel.Core;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Access;

/// <summary>Registers access control and sets the web server's limits (one call each in the host).</summary>
internal static class AccessServices
{
    public static IServiceCollection AddAccessControl(this IServiceCollection services, IConfiguration configuration)
    {
        // Sessions and the file check keep real time even when the demo accelerates the process clock.
        services.AddSingleton(sp => ActivatorUtilities.CreateInstance<CredentialStore>(sp, TimeProvider.System));
        services.AddSingleton(sp => ActivatorUtilities.CreateInstance<SessionStore>(sp, TimeProvider.System));
        services.AddSingleton<AccessJournal>();
        services.AddSingleton(sp =>
        {
            var o = sp.GetRequiredService<IOptions<SoftSensorOptions>>().Value;
            var hosts = new HostPolicy(o.Status.Url, o.Access.AllowedHosts);
            return new AccessPolicy(hosts, o.Access.AnonymousRead ?? hosts.IsLoopback);
        });
        services.AddSingleton<IValidateOptions<SoftSensorOptions>, AccessOptionsValidator>();
        services.AddSingleton<IValidateOptions<SoftSensorOptions>>(new SecretPlacementValidator(configuration));
        return services;
    }

    /// <summary>Kestrel limits (headers, connections, bodies) and the certificate of an https:// URL.</summary>
    public static void ConfigureServerLimits(this IWebHostBuilder web, IConfiguration configuration)
    {
        var access = configuration.GetSection("access").Get<AccessOptions>() ?? new AccessOptions();
        web.ConfigureKestrel(k =>
        {
            k.AddServerHeader = false;
            k.Limits.MaxRequestBodySize = RequestLimits.ServerBytes;
            k.Limits.MaxRequestHeadersTotalSize = RequestLimits.HeaderBytes;
            k.Limits.MaxRequestHeaderCount = RequestLimits.HeaderCount;
            k.Limits.MaxRequestLineSize = 8 * 1024;
            k.Limits.MaxConcurrentConnections = Math.Max(1, access.MaxConnections);
            k.Limits.MaxConcurrentUpgradedConnections = 0;
            k.Limits.RequestHeadersTimeout = TimeSpan.FromSeconds(10);
            k.Limits.KeepAliveTimeout = TimeSpan.FromSeconds(60);
            k.Limits.Http2.MaxStreamsPerConnection = 16;
            if (access.CertificateFile.Length > 0)
            {
                string cert = access.CertificateFile, key = access.CertificateKeyFile;
                k.ConfigureHttpsDefaults(h => h.ServerCertificate = X509Certificate2.CreateFromPemFile(cert, key.Length > 0 ? key : null));
            }
        });
    }

    /// <summary>Access control first in the pipeline, then the login endpoints.</summary>
    public static void UseAccessControl(this WebApplication app)
    {
        app.UseMiddleware<AccessMiddleware>();
        app.MapLoginEndpoints();
    }
}

/// <summary>Checks section <c>access</c> against the status URL; every problem names its key.</summary>
internal sealed class AccessOptionsValidator : IValidateOptions<SoftSensorOptions>
{
    public ValidateOptionsResult Validate(string? name, SoftSensorOptions options)
    {
        var errors = new List<string>();
        var a = options.Access;
        bool https = Uri.TryCreate(options.Status.Url, UriKind.Absolute, out var url) && url.Scheme == Uri.UriSchemeHttps;
        if (https && (a.CertificateFile.Length == 0 || !File.Exists(a.CertificateFile)))
        {
            errors.Add($"access:certificateFile is '{a.CertificateFile}' (expected a PEM certificate file for the https:// status URL)");
        }

        if (a.CertificateKeyFile.Length > 0 && !File.Exists(a.CertificateKeyFile))
        {
            errors.Add($"access:certificateKeyFile is '{a.CertificateKeyFile}' (expected an existing PEM key file)");
        }

        if (!https && a.CertificateFile.Length > 0)
        {
            errors.Add($"access:certificateFile is set but status:url is '{options.Status.Url}' (expected an https:// URL to use it)");
        }

        var hosts = new HostPolicy(options.Status.Url, a.AllowedHosts);
        if (hosts.IsWildcard && a.AllowedHosts.Count == 0)
        {
            errors.Add($"access:allowedHosts is empty while status:url '{options.Status.Url}' listens on every address (expected the host names clients use)");
        }

        if (string.IsNullOrWhiteSpace(a.CredentialsFile))
        {
            errors.Add("access:credentialsFile is empty (expected the path of the credentials file)");
        }

        if (a.SessionIdleTimeout <= TimeSpan.Zero)
        {
            errors.Add($"access:sessionIdleTimeout is {a.SessionIdleTimeout} (expected above 0)");
        }

        if (a.MaxConnections < 1)
        {
            errors.Add($"access:maxConnections is {a.MaxConnections} (expected 1 or more)");
        }

        return errors.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(errors);
    }
}

/// <summary>
/// Refuses a secret written into a JSON configuration file (readable by whoever reads the
/// configuration, often kept in version control): <c>mqtt:password</c> belongs in the environment
/// (<c>SOFTSENSOR_mqtt__password</c>) or in the file named by <c>mqtt:passwordFile</c>.
/// </summary>
internal sealed class SecretPlacementValidator(IConfiguration configuration) : IValidateOptions<SoftSensorOptions>
{
    private static readonly string[] SecretKeys = ["mqtt:password"];

    public ValidateOptionsResult Validate(string? name, SoftSensorOptions options)
    {
        if (configuration is not IConfigurationRoot root)
        {
            return ValidateOptionsResult.Success;
        }

        var errors = new List<string>();
        foreach (var provider in root.Providers.OfType<Microsoft.Extensions.Configuration.Json.JsonConfigurationProvider>())
        {
            foreach (var key in SecretKeys)
            {
                if (provider.TryGet(key, out string? v) && !string.IsNullOrEmpty(v))
                {
                    const string where = "the environment (SOFTSENSOR_mqtt__password) or a file named by mqtt:passwordFile (mode 0600)";
                    errors.Add($"{key} is set in {provider.Source.Path} (a password does not belong in a JSON configuration file; put it in {where})");
                }
            }
        }

        return errors.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(errors);
    }
}
