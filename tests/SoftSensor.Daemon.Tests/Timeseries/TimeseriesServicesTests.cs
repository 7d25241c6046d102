using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Sinks;
using SoftSensor.Daemon.Timeseries;

namespace SoftSensor.Daemon.Tests.Timeseries;

public sealed class TimeseriesServicesTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-tsdi-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private ServiceProvider Build(Dictionary<string, string?> config)
    {
        var configuration = new ConfigurationBuilder().AddInMemoryCollection(config).Build();
        var services = new ServiceCollection().AddLogging(b => b.SetMinimumLevel(LogLevel.Warning));
        services.AddTimeseries(configuration);
        return services.BuildServiceProvider();
    }

    [Fact]
    public void AddTimeseries_WithUrl_RegistersTheSinkAndTheSender()
    {
        using var sp = Build(new()
        {
            ["timeseries:url"] = "http://127.0.0.1:9", ["timeseries:outboxPath"] = Path.Combine(_dir, "s.db"),
        });
        Assert.IsType<TimeseriesSink>(Assert.Single(sp.GetServices<IEstimateSink>()));
        Assert.IsType<OutboxSender>(Assert.Single(sp.GetServices<IHostedService>()));
        Assert.True(File.Exists(Path.Combine(_dir, "s.db")));
    }

    [Fact]
    public void AddTimeseries_WithoutUrl_RegistersNothingButTheOptions()
    {
        using var sp = Build([]);
        Assert.Empty(sp.GetServices<IEstimateSink>());
        Assert.False(sp.GetRequiredService<IOptions<TimeseriesOptions>>().Value.Enabled);
    }

    [Fact]
    public void AddTimeseries_BadValues_FailValidationNamingTheKeys()
    {
        using var sp = Build(new() { ["timeseries:url"] = "127.0.0.1:8086", ["timeseries:batchSize"] = "0", ["timeseries:outboxPath"] = Path.Combine(_dir, "s.db") });
        var e = Assert.Throws<OptionsValidationException>(() => sp.GetRequiredService<IOptions<TimeseriesOptions>>().Value);
        Assert.Equal(["timeseries:url is '127.0.0.1:8086', expected an absolute http:// or https:// URL", "timeseries:batchSize is 0, expected 1 to 100000"], e.Failures);
    }
}
