using Microsoft.Extensions.Configuration;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Tests.Fixtures;

namespace SoftSensor.Daemon.Tests.Configuration;

public class SoftSensorOptionsValidatorTests
{
    private static SoftSensorOptions Bind(Dictionary<string, string?> keys)
    {
        var o = new SoftSensorOptions();
        new ConfigurationBuilder().AddInMemoryCollection(keys).Build().Bind(o);
        return o;
    }

    [Fact]
    public void Validate_hand_case_configuration_succeeds()
    {
        var result = new SoftSensorOptionsValidator().Validate(null, Bind(TestConfigs.HandCase(1883, "t")));
        Assert.True(result.Succeeded, result.FailureMessage);
    }

    [Fact]
    public void Validate_several_errors_reports_all_in_one_message_naming_each_key()
    {
        var keys = TestConfigs.HandCase(1883, "t");
        keys["site"] = "Pilot Plant";
        keys["mqtt:port"] = "70000";
        keys["reactors:0:cyclePeriod"] = "00:00:00.01";
        keys["reactors:0:tags:fic101:role"] = "AirFlow";
        keys["reactors:0:tags:qi202:topic"] = "plant/#";
        keys["status:url"] = "ftp://x";

        var result = new SoftSensorOptionsValidator().Validate(null, Bind(keys));

        Assert.False(result.Succeeded);
        Assert.Equal(
            "site is 'Pilot Plant' (expected lowercase letters, digits, '-' or '_'); "
            + "reactors:0:cyclePeriod is 00:00:00.0100000 (expected between 00:00:00.1 and 01:00:00); "
            + $"reactors:0:tags:fic101:role is 'AirFlow' (expected one of {string.Join(", ", Enum.GetNames<SoftSensor.Core.Signals.SignalRole>())}); "
            + "reactors:0:tags:qi202:topic is 'plant/#' (expected an exact MQTT topic without wildcards); "
            + "reactors:0:tags has no gas-line flow (expected a tag with role AirFlowNlPerMin, OxygenFlowNlPerMin, NitrogenFlowNlPerMin or CarbonDioxideFlowNlPerMin); "
            + "mqtt:port is 70000 (expected 1 to 65535); "
            + "status:url is 'ftp://x' (expected an http:// or https:// URL such as http://127.0.0.1:8470)",
            result.FailureMessage);
    }

    [Fact]
    public void Validate_no_reactors_names_the_key()
    {
        var result = new SoftSensorOptionsValidator().Validate(null, Bind(new() { ["site"] = "s", ["area"] = "a" }));
        Assert.Equal("reactors is empty (expected at least one reactor)", result.FailureMessage);
    }

    [Fact]
    public void Validate_measured_inlet_without_inlet_tags_names_the_key()
    {
        var keys = TestConfigs.HandCase(1883, "t");
        keys["reactors:0:gas:inlet"] = "measured";
        var result = new SoftSensorOptionsValidator().Validate(null, Bind(keys));
        Assert.Equal("reactors:0:gas:inlet is 'measured' (expected tags with roles InletO2Percent and InletCo2Percent)", result.FailureMessage);
    }

    [Fact]
    public void Validate_opcUaNode_without_an_endpoint_names_the_tag_key_and_opcUa_endpoint()
    {
        var keys = TestConfigs.HandCase(1883, "t");
        keys["reactors:0:tags:qi201:topic"] = "";
        keys["reactors:0:tags:qi201:opcUaNode"] = "Objects/Reactor1/OffgasO2";
        keys["opcUa:writeBack:r1:our"] = "Objects/Reactor1/Estimates/OUR";

        var result = new SoftSensorOptionsValidator().Validate(null, Bind(keys));

        Assert.Equal(
            "reactors:0:tags:qi201:opcUaNode is 'Objects/Reactor1/OffgasO2' (expected opcUa:endpoint to be set, e.g. opc.tcp://10.0.0.5:4840: no OPC UA server is configured to read it from); "
            + "opcUa:writeBack:r1:our is 'Objects/Reactor1/Estimates/OUR' (expected opcUa:endpoint to be set: no OPC UA server is configured to write it to)",
            result.FailureMessage);
    }

    [Fact]
    public void Validate_opcUa_section_bad_endpoint_and_unknown_write_back_reactor_name_their_keys()
    {
        var keys = TestConfigs.HandCase(1883, "t");
        keys["reactors:0:tags:qi201:topic"] = "";
        keys["reactors:0:tags:qi201:opcUaNode"] = "nsu=urn:plant:reactors;s=R1.QI201";
        keys["opcUa:endpoint"] = "http://10.0.0.5:4840";
        keys["opcUa:writeBack:r7:our"] = "Objects/HMI/R7/OUR";

        var result = new SoftSensorOptionsValidator().Validate(null, Bind(keys));

        Assert.Equal(
            "opcUa:endpoint is 'http://10.0.0.5:4840' (expected opc.tcp://host[:port][/path]); "
            + "opcUa:writeBack:r7 names reactor 'r7' (expected the id of a configured reactor: r1)",
            result.FailureMessage);
    }

    [Theory]
    [InlineData("security", "encrypt", "opcUa:security is 'encrypt' (expected none, sign or sign-encrypt; empty for the most secure endpoint both sides support)")]
    [InlineData("policy", "Basic256", "opcUa:policy is 'Basic256' (Security policy Basic256 is refused: deprecated by IEC 62541-7 since 1.04")]
    [InlineData("policy", "Basic128Rsa15", "opcUa:policy is 'Basic128Rsa15' (Security policy Basic128Rsa15 is refused: deprecated by IEC 62541-7 since 1.04")]
    [InlineData("policy", "Basic512", "opcUa:policy is 'Basic512' (Security policy 'Basic512' is unknown")]
    public void Validate_opcUa_security_keys_refuse_unknown_and_deprecated_values_naming_the_key(string key, string value, string expectedStart)
    {
        var keys = TestConfigs.HandCase(1883, "t");
        keys["opcUa:endpoint"] = "opc.tcp://127.0.0.1:4840/softsensor";
        keys["opcUa:" + key] = value;

        var result = new SoftSensorOptionsValidator().Validate(null, Bind(keys));

        Assert.StartsWith(expectedStart, result.FailureMessage, StringComparison.Ordinal);
    }

    [Fact]
    public void Validate_opcUa_secured_policy_with_security_none_is_refused()
    {
        var keys = TestConfigs.HandCase(1883, "t");
        keys["opcUa:endpoint"] = "opc.tcp://127.0.0.1:4840/softsensor";
        keys["opcUa:security"] = "none";
        keys["opcUa:policy"] = "Basic256Sha256";

        var result = new SoftSensorOptionsValidator().Validate(null, Bind(keys));

        Assert.Equal("opcUa:policy is 'Basic256Sha256' with opcUa:security 'none' (expected policy None with security none, and a secured policy with sign or sign-encrypt)", result.FailureMessage);
    }

    [Fact]
    public void Validate_opcUaNode_with_an_endpoint_succeeds()
    {
        var keys = TestConfigs.HandCase(1883, "t");
        keys["reactors:0:tags:qi201:topic"] = "";
        keys["reactors:0:tags:qi201:opcUaNode"] = "Objects/Reactor1/OffgasO2";
        keys["opcUa:endpoint"] = "opc.tcp://127.0.0.1:4840/softsensor";
        var result = new SoftSensorOptionsValidator().Validate(null, Bind(keys));
        Assert.True(result.Succeeded, result.FailureMessage);
    }
}
