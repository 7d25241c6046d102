using Microsoft.Extensions.Configuration;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Demo;

namespace SoftSensor.Daemon.Tests.Configuration;

public class ShippedConfigurationTests
{
    [Theory]
    [InlineData("config/demo.json")]
    [InlineData("config/plant-example.json")]
    public void Validate_shipped_configuration_file_succeeds(string file)
    {
        string path = DemoFiles.Find(file) ?? throw new FileNotFoundException(file);
        var settings = new SoftSensor.Daemon.Hosting.DaemonHostSettings { ConfigFile = path, SystemFolder = Path.Combine(Path.GetTempPath(), "softsensor-shipped-no-system-folder") };
        Assert.Empty(SoftSensor.Daemon.Hosting.DaemonDefinition.Problems(settings));
        var manager = new ConfigurationManager();
        SoftSensor.Daemon.Hosting.DaemonConfiguration.Apply(manager, settings);
        var o = new SoftSensorOptions();
        manager.Bind(o);

        var result = new SoftSensorOptionsValidator().Validate(null, o);

        Assert.True(result.Succeeded, result.FailureMessage);
        Assert.NotEmpty(o.Reactors[0].Tags);
    }
}
