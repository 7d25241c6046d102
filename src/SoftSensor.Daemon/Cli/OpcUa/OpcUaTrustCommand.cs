using System.CommandLine;
using Microsoft.Extensions.Logging.Abstractions;
using SoftSensor.OpcUa.Pki;
using SoftSensor.OpcUa.SecureChannel;
using SoftSensor.OpcUa.SecureChannel.Security;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.Daemon.Cli.OpcUa;

/// <summary>
/// <c>softsensor opcua trust --endpoint URL --pki DIR [--yes]</c>: asks the server for its
/// endpoints (GetEndpoints, which Part 4 §5.4.4 allows over SecurityPolicy None), prints its
/// certificate (subject, SHA-1 thumbprint, validity, ApplicationUri) and the security it offers,
/// and on confirmation (or with --yes) copies the certificate into the folder's trusted/certs.
/// Exit codes: 0 trusted; 1 not reachable, or not confirmed; 2 bad input.
/// </summary>
internal static class OpcUaTrustCommand
{
    public static Command Build()
    {
        var endpoint = new Option<string>("--endpoint") { Description = "Server endpoint, opc.tcp://host:port[/path]", Required = true };
        var pki = new Option<string>("--pki") { Description = "PKI folder whose trusted/certs receives the server's certificate", Required = true };
        var yes = new Option<bool>("--yes") { Description = "Trust without asking" };
        var trust = new Command("trust", "Show a server's certificate and trust it (copy it into the PKI folder's trusted/certs).") { endpoint, pki, yes };
        trust.SetAction((parse, ct) => RunAsync(parse.GetValue(endpoint)!, parse.GetValue(pki)!, parse.GetValue(yes), parse.InvocationConfiguration.Output, parse.InvocationConfiguration.Error, ct));
        return trust;
    }

    private static async Task<int> RunAsync(string endpointUrl, string pkiRoot, bool yes, TextWriter output, TextWriter error, CancellationToken cancellationToken)
    {
        try
        {
            EndpointAddress.Parse(endpointUrl);
        }
        catch (FormatException e)
        {
            return CliOutput.BadInput(error, $"--endpoint: {e.Message}");
        }

        EndpointDescription[] endpoints;
        try
        {
            endpoints = await EndpointSelector.GetEndpointsAsync(endpointUrl, new ChannelOptions(), TimeProvider.System, NullLogger.Instance, cancellationToken);
        }
        catch (ServiceResultException e)
        {
            await error.WriteLineAsync($"error: {endpointUrl}: {e.Message}".ReplaceLineEndings(" | "));
            return ExitCodes.Failure;
        }

        var secured = endpoints.Where(e => e.ServerCertificate is { Length: > 0 }).ToList();
        if (secured.Count == 0)
        {
            await error.WriteLineAsync($"error: {endpointUrl}: the server sends no certificate (it offers SecurityPolicy None only): nothing to trust");
            return ExitCodes.Failure;
        }

        var store = new PkiStore(pkiRoot);
        int trusted = 0;
        foreach (var group in secured.GroupBy(e => Convert.ToHexString(System.Security.Cryptography.SHA1.HashData(CertificateFacts.SplitChain(e.ServerCertificate!)[0]))))
        {
            using var certificate = CertificateFacts.Load(CertificateFacts.SplitChain(group.First().ServerCertificate!)[0]);
            output.WriteLine($"server:      {group.First().Server.ApplicationUri} at {endpointUrl}");
            output.WriteLine($"subject:     {certificate.Subject}");
            output.WriteLine($"thumbprint:  {certificate.Thumbprint} (SHA-1)");
            output.WriteLine($"valid:       {certificate.NotBefore.ToUniversalTime():yyyy-MM-dd HH:mm} to {certificate.NotAfter.ToUniversalTime():yyyy-MM-dd HH:mm} UTC");
            output.WriteLine($"offers:      {string.Join(", ", endpoints.Select(Offer).Distinct(StringComparer.Ordinal))}");
            if (!yes && !Confirm(output))
            {
                await error.WriteLineAsync($"error: {endpointUrl}: certificate {certificate.Thumbprint} not trusted (answer y, or pass --yes)");
                return ExitCodes.Failure;
            }

            output.WriteLine($"trusted:     {store.Trust(certificate)}");
            trusted++;
            try
            {
                new ServerCertificateValidator(store, TimeProvider.System).Validate(group.First().ServerCertificate, endpointUrl, group.First().Server.ApplicationUri);
            }
            catch (ServiceResultException e)
            {
                await error.WriteLineAsync($"warning: {endpointUrl}: trusted, but the certificate still fails a check: {e.Message}".ReplaceLineEndings(" | "));
            }
        }

        return trusted > 0 ? ExitCodes.Ok : ExitCodes.Failure;
    }

    private static string Offer(EndpointDescription e)
    {
        var policy = SecurityPolicy.FromUri(e.SecurityPolicyUri);
        string name = e.SecurityPolicyUri?.Replace(SecurityPolicies.Prefix, string.Empty, StringComparison.Ordinal) ?? "?";
        string note = policy is null ? SecurityPolicy.Deprecated.ContainsKey(name) ? " (deprecated: refused)" : " (unknown: refused)" : string.Empty;
        return $"{name} {e.SecurityMode}{note}";
    }

    private static bool Confirm(TextWriter output)
    {
        output.Write("Trust this certificate? Compare the thumbprint with the one the server's administrator reads on the server. [y/N] ");
        output.Flush();
        string? answer = Console.IsInputRedirected && Console.In.Peek() < 0 ? null : Console.ReadLine();
        output.WriteLine();
        return answer?.Trim().ToLowerInvariant() is "y" or "yes";
    }
}
