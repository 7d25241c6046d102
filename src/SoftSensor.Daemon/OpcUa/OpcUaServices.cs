using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using SoftSensor.Daemon.Sinks;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.OpcUa;

/// <summary>Registers the OPC UA adapter: the source factory, the write-back link and its sink (section <c>opcUa</c>).</summary>
internal static class OpcUaServices
{
    public static IServiceCollection AddOpcUaAdapter(this IServiceCollection services, IConfiguration configuration)
    {
        services.AddOptions<OpcUaOptions>().Bind(configuration.GetSection("opcUa"));
        services.AddSingleton<ISampleSourceFactory, OpcUaSampleSourceFactory>();
        services.AddSingleton<OpcUaWriteBackLink>();
        services.AddHostedService(sp => sp.GetRequiredService<OpcUaWriteBackLink>());
        services.AddSingleton<IEstimateSink, OpcUaEstimateSink>();
        return services;
    }
}
