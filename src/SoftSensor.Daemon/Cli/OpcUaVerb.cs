using System.CommandLine;
using Microsoft.Extensions.Logging;
using SoftSensor.Daemon.Cli.OpcUa;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor opcua browse --endpoint URL [--path P] [--json] [--security none|sign|sign-encrypt]
/// [--policy NAME] [--pki DIR] [--user NAME]</c>: lists the children of a node
/// of an OPC UA server (browse name, node id as <c>nsu=...;s=...</c>, node class, data type, value)
/// so that an engineer can build the tag map. The path is slash-separated browse names from the
/// root, e.g. <c>Objects/Reactor1</c>; without it the Objects folder is listed. Exit codes: 0 listed;
/// 1 the server cannot be reached or refused (one stderr line naming the endpoint); 2 bad input
/// (a malformed endpoint URL, a path that does not exist, a missing password, an unknown or
/// deprecated policy). The security used goes to stderr in one line. <c>opcua trust</c>: see
/// <see cref="OpcUaTrustCommand"/>.
/// </summary>
internal sealed class OpcUaVerb : IVerb
{
    public Command Build()
    {
        var endpoint = new Option<string>("--endpoint") { Description = "Server endpoint, opc.tcp://host:port[/path]", Required = true };
        var path = new Option<string>("--path") { Description = "Browse path from the root, e.g. Objects/Reactor1 (default Objects)", DefaultValueFactory = _ => "Objects" };
        var json = new Option<bool>("--json") { Description = "Write one JSON document instead of a table" };
        var user = new Option<string?>("--user") { Description = "User name (the password is read from the environment variable SOFTSENSOR_OPCUA_PASSWORD)" };
        var browse = new Command("browse", "List the children of a node: browse name, node id, node class, data type, value.") { endpoint, path, json, user };
        var security = new OpcUaSecurityFlags();
        security.AddTo(browse);
        browse.SetAction((parse, ct) =>
        {
            var (settings, problem) = security.Read(parse);
            return problem is not null
                ? Task.FromResult(CliOutput.BadInput(parse.InvocationConfiguration.Error, problem))
                : BrowseAsync(new BrowseRequest(parse.GetValue(endpoint)!, parse.GetValue(path)!, parse.GetValue(json), parse.GetValue(user), settings!), parse.InvocationConfiguration.Output, parse.InvocationConfiguration.Error, ct);
        });
        return new Command("opcua", "Talk to an OPC UA server: browse its nodes, trust its certificate.") { browse, OpcUaTrustCommand.Build() };
    }

    private sealed record BrowseRequest(string EndpointUrl, string Path, bool Json, string? User, SecuritySettings Security);

    private static async Task<int> BrowseAsync(BrowseRequest request, TextWriter output, TextWriter error, CancellationToken cancellationToken)
    {
        var (endpointUrl, path, json, user, security) = request;
        try
        {
            EndpointAddress.Parse(endpointUrl);
        }
        catch (FormatException e)
        {
            return CliOutput.BadInput(error, $"--endpoint: {e.Message}");
        }

        var identity = UserIdentity.Anonymous;
        if (!string.IsNullOrEmpty(user))
        {
            string? password = Environment.GetEnvironmentVariable("SOFTSENSOR_OPCUA_PASSWORD");
            if (password is null)
            {
                return CliOutput.BadInput(error, $"--user '{user}': set the password in the environment variable SOFTSENSOR_OPCUA_PASSWORD");
            }

            identity = UserIdentity.UserName(user, password);
        }

        using var logs = LoggerFactory.Create(b => b.SetMinimumLevel(LogLevel.Warning).AddSimpleConsole(o => o.SingleLine = true).AddConsole(o => o.LogToStandardErrorThreshold = LogLevel.Trace));
        var logger = logs.CreateLogger("opcua");
        try
        {
            await using var connection = await UaConnection.OpenAsync(new SessionOptions { EndpointUrl = endpointUrl, Identity = identity, Security = security }, TimeProvider.System, logger, cancellationToken);
            var target = await BrowsePathResolver.ResolveAsync(connection.Session, path, cancellationToken);
            if (!target.IsFound)
            {
                return CliOutput.BadInput(error, $"--path '{path}': {target.Error}");
            }

            var children = await NodeBrowser.ListChildrenAsync(connection.Session, target.Node!, cancellationToken);
            var nodeId = connection.Session.Namespaces.ToExpanded(target.Node!).ToString();
            if (json)
            {
                CliOutput.WriteJson(output, new BrowseListing(endpointUrl, path, nodeId, [.. children.Select(BrowseListingRow.From)]));
            }
            else
            {
                WriteTable(output, path, nodeId, children);
            }

            string chosen = security.Mode == SecurityChoice.Auto && security.Policy is null ? " (the most secure endpoint both sides support)" : string.Empty;
            await error.WriteLineAsync($"security: {connection.Channel.Security.Describe()}{chosen}");

            return ExitCodes.Ok;
        }
        catch (ServiceResultException e)
        {
            await error.WriteLineAsync($"error: {endpointUrl}: {e.Message}".ReplaceLineEndings(" | "));
            return ExitCodes.Failure;
        }
    }

    private static void WriteTable(TextWriter output, string path, string nodeId, IReadOnlyList<BrowsedNode> children)
    {
        output.WriteLine($"{path} ({nodeId}): {children.Count} children");
        output.WriteLine($"{"browse name",-28} {"class",-13} {"data type",-14} {"value",-24} node id");
        foreach (var c in children)
        {
            string value = c.Value is null ? string.Empty : c.Value.Status.IsGood ? c.Value.Value.ToString() : $"{c.Value.Value} [{c.Value.Status}]";
            output.WriteLine($"{c.BrowseName,-28} {c.NodeClass,-13} {c.DataType ?? string.Empty,-14} {value,-24} {c.NodeId}");
        }
    }

    private sealed record BrowseListing(string Endpoint, string Path, string NodeId, BrowseListingRow[] Children);

    private sealed record BrowseListingRow(string BrowseName, string NodeId, string NodeClass, string? DataType, object? Value, string? Quality, uint? StatusCode, DateTime? SourceTimestamp)
    {
        public static BrowseListingRow From(BrowsedNode n) => new(
            n.BrowseName,
            n.NodeId.ToString(),
            n.NodeClass.ToString(),
            n.DataType,
            n.Value?.Value is { IsNull: false } v ? v.AsDouble() is double d && double.IsFinite(d) ? d : v.ToString() : null,
            n.Value?.Status.Severity.ToString(),
            n.Value?.Status.Code,
            n.Value is { SourceTimestamp: var t } && t != DateTime.MinValue ? t : null);
    }
}
