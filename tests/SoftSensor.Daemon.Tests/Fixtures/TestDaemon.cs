using Microsoft.AspNetCore.Builder;
using Microsoft.Extensions.DependencyInjection;
using SoftSensor.Daemon.Hosting;

namespace SoftSensor.Daemon.Tests.Fixtures;

/// <summary>A daemon host built from in-memory configuration for tests; disposed with its temp folder.</summary>
internal sealed class TestDaemon : IAsyncDisposable
{
    private readonly string _dir;

    private TestDaemon(WebApplication app, string dir)
    {
        App = app;
        _dir = dir;
    }

    public WebApplication App { get; }

    public T Get<T>() where T : notnull => App.Services.GetRequiredService<T>();

    public string StatusAddress => DaemonHost.StatusAddress(App);

    /// <summary>Builds and starts a daemon; <paramref name="config"/> gets the store path and a free status port unless it has them.</summary>
    public static async Task<TestDaemon> StartAsync(Dictionary<string, string?> config, Action<IServiceCollection>? services = null)
    {
        string dir = Directory.CreateTempSubdirectory("softsensor-daemon-").FullName;
        config.TryAdd("store:path", Path.Combine(dir, "store.db"));
        config.TryAdd("status:url", "http://127.0.0.1:0");
        if (!config.ContainsKey("access:credentialsFile"))
        {
            config["access:credentialsFile"] = TestAccess.WriteCredentials(dir);
        }

        var app = DaemonHost.Build(new DaemonHostSettings
        {
            Overrides = config,
            SystemFolder = Path.Combine(dir, "etc"),
            ConfigureServices = services,
            ConsoleLevel = Microsoft.Extensions.Logging.LogLevel.Warning,
        });
        await app.StartAsync();
        var daemon = new TestDaemon(app, dir);
        await daemon.WaitSubscribedAsync(config);
        return daemon;
    }

    /// <summary>Waits until the broker granted every configured tag topic (a publish before that would be lost).</summary>
    public async Task WaitSubscribedAsync(Dictionary<string, string?> config)
    {
        var link = Get<SoftSensor.Daemon.Mqtt.MqttLink>();
        var topics = config.Where(kv => kv.Key.EndsWith(":topic", StringComparison.OrdinalIgnoreCase)).Select(kv => kv.Value!).ToList();
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(10);
        while (!topics.All(link.IsSubscribed))
        {
            Assert.True(DateTime.UtcNow < until, "the daemon did not subscribe its tag topics within 10 s");
            await Task.Delay(20);
        }
    }

    public async ValueTask DisposeAsync()
    {
        await App.StopAsync();
        await App.DisposeAsync();
        try
        {
            Directory.Delete(_dir, recursive: true);
        }
        catch (IOException)
        {
            // A leftover temp folder is harmless.
        }
    }
}
