using System.Text.Json;
using SoftSensor.Daemon.Tests.Cli;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.OpcUa.Tests.Peers;

namespace SoftSensor.Daemon.Tests.OpcUa;

/// <summary><c>softsensor opcua browse</c> against a real node-opcua server (tests/peers), in-process as Program runs it.</summary>
public sealed class OpcUaBrowseVerbTests(OpcUaPeerFixture peer) : IClassFixture<OpcUaPeerFixture>
{
    private const string Ns = "nsu=" + OpcUaPeerServer.NamespaceUri + ";";
    private readonly string _endpoint = peer.Server.EndpointUrl;

    [Fact]
    public void Browse_reactor_path_lists_its_variables_with_node_ids_class_type_and_value()
    {
        var (code, output, error) = CliRunner.Run("opcua", "browse", "--endpoint", _endpoint, "--path", "Objects/Reactor1");

        Assert.True(code == 0, error);
        var lines = output.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
        Assert.StartsWith($"Objects/Reactor1 ({Ns}s=Reactor1):", lines[0], StringComparison.Ordinal);
        // The peer's Reactor1 (tests/peers/opcua-server.js): five Double variables and two folders of objects.
        foreach (var name in new[] { "OffgasO2", "OffgasCO2", "AirFlow", "Temperature", "Counter" })
        {
            var row = Assert.Single(lines, l => l.StartsWith(name + " ", StringComparison.Ordinal));
            Assert.EndsWith($"{Ns}s=Reactor1.{name}", row, StringComparison.Ordinal);
            Assert.Contains("Variable", row, StringComparison.Ordinal);
            Assert.Contains("Double", row, StringComparison.Ordinal);
        }

        Assert.Single(lines, l => l.StartsWith("Estimates ", StringComparison.Ordinal) && l.EndsWith($"{Ns}s=Reactor1.Estimates", StringComparison.Ordinal));
        Assert.Single(lines, l => l.StartsWith("Bulk ", StringComparison.Ordinal) && l.EndsWith($"{Ns}s=Reactor1.Bulk", StringComparison.Ordinal));
    }

    [Fact]
    public void Browse_json_is_one_document_with_node_ids_usable_as_opcUaNode()
    {
        var (code, output, error) = CliRunner.Run("opcua", "browse", "--endpoint", _endpoint, "--path", "Objects/Reactor1", "--json");

        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        var root = doc.RootElement;
        Assert.Equal(_endpoint, root.GetProperty("endpoint").GetString());
        Assert.Equal(Ns + "s=Reactor1", root.GetProperty("nodeId").GetString());
        var o2 = root.GetProperty("children").EnumerateArray().Single(c => c.GetProperty("browseName").GetString() == "OffgasO2");
        Assert.Equal(Ns + "s=Reactor1.OffgasO2", o2.GetProperty("nodeId").GetString());
        Assert.Equal("Double", o2.GetProperty("dataType").GetString());
        Assert.InRange(o2.GetProperty("value").GetDouble(), 19.9, 20.5); // the peer's O2 signal: 20.2 ± 0.3 %
        Assert.Equal(0u, o2.GetProperty("statusCode").GetUInt32());
    }

    [Fact]
    public void Browse_without_path_lists_the_objects_folder()
    {
        var (code, output, error) = CliRunner.Run("opcua", "browse", "--endpoint", _endpoint);

        Assert.True(code == 0, error);
        // Objects (i=85) holds the standard Server object (i=2253, IEC 62541-5 §8.3.2) and the peer's Reactor1.
        Assert.StartsWith("Objects (i=85):", output, StringComparison.Ordinal);
        Assert.Contains(output.Split('\n'), l => l.StartsWith("Server ", StringComparison.Ordinal) && l.TrimEnd().EndsWith("i=2253", StringComparison.Ordinal));
        Assert.Contains(output.Split('\n'), l => l.StartsWith("Reactor1 ", StringComparison.Ordinal) && l.TrimEnd().EndsWith(Ns + "s=Reactor1", StringComparison.Ordinal));
    }

    [Fact]
    public void Browse_unknown_path_is_bad_input_naming_the_path()
    {
        var (code, output, error) = CliRunner.Run("opcua", "browse", "--endpoint", _endpoint, "--path", "Objects/Reactor9");

        Assert.Equal(2, code);
        Assert.Equal(string.Empty, output);
        var line = Assert.Single(error.Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.StartsWith("error: --path 'Objects/Reactor9'", line, StringComparison.Ordinal);
    }

    [Fact]
    public void Browse_endpoint_nobody_listens_on_is_one_error_line_and_exit_1()
    {
        string url = $"opc.tcp://127.0.0.1:{FreePort.Next()}/softsensor";

        var (code, output, error) = CliRunner.Run("opcua", "browse", "--endpoint", url);

        Assert.Equal(1, code);
        Assert.Equal(string.Empty, output);
        var line = Assert.Single(error.Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.StartsWith($"error: {url}: Cannot connect to 127.0.0.1:", line, StringComparison.Ordinal);
    }

    [Fact]
    public void Browse_malformed_endpoint_is_bad_input_naming_the_flag()
    {
        var (code, output, error) = CliRunner.Run("opcua", "browse", "--endpoint", "http://127.0.0.1:4840");

        Assert.Equal(2, code);
        Assert.Equal(string.Empty, output);
        Assert.Equal("error: --endpoint: Endpoint URL 'http://127.0.0.1:4840' is not of the form opc.tcp://host[:port][/path].", error.Trim());
    }
}
