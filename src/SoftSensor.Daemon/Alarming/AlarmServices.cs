using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Sinks;

namespace SoftSensor.Daemon.Alarming;

/// <summary>Section <c>alarms</c>: the rule files (or folders of <c>*.json</c> rule files) to load; none turns alarms off.</summary>
internal sealed class AlarmOptions
{
    public const string Section = "alarms";

    public List<string> RuleFiles { get; set; } = [];

    /// <summary>
    /// The files named, folders expanded (name order); a relative path is read beside the
    /// configuration file (<see cref="DefinitionPaths"/>).
    /// </summary>
    public IReadOnlyList<string> ResolveFiles(string? configFolder = null) =>
        [.. RuleFiles.Select(p => Beside(p, configFolder))
            .SelectMany<string, string>(p => Directory.Exists(p) ? Directory.GetFiles(p, "*.json").Order(StringComparer.Ordinal) : [p])];

    private static string Beside(string path, string? configFolder) => DefinitionPaths.Resolve(path, configFolder);
}

/// <summary>Checks at start that every rule file reads and every rule is valid (one message listing all).</summary>
internal sealed class AlarmOptionsValidator(Pipeline.ConfigLocation? location = null) : IValidateOptions<AlarmOptions>
{
    public ValidateOptionsResult Validate(string? name, AlarmOptions options)
    {
        if (options.RuleFiles.Count == 0)
        {
            return ValidateOptionsResult.Success;
        }

        var set = AlarmRuleFile.Load(options.ResolveFiles(location?.Folder));
        return set.Errors.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(set.Errors);
    }
}

/// <summary>Registers the alarms (one line in the host: <c>services.AddAlarms(configuration)</c>).</summary>
internal static class AlarmServices
{
    public static IServiceCollection AddAlarms(this IServiceCollection services, IConfiguration configuration)
    {
        var section = configuration.GetSection(AlarmOptions.Section);
        services.AddOptions<AlarmOptions>().Bind(section).ValidateOnStart();
        services.TryAddEnumerable(ServiceDescriptor.Singleton<IValidateOptions<AlarmOptions>, AlarmOptionsValidator>(
            sp => new AlarmOptionsValidator(sp.GetService<Pipeline.ConfigLocation>())));
        if ((section.Get<AlarmOptions>() ?? new AlarmOptions()).RuleFiles.Count == 0)
        {
            return services;
        }

        string journalPath = configuration["store:path"] ?? "data/softsensor.db";
        services.AddSingleton(_ => new AlarmJournal(journalPath));
        services.AddSingleton(sp =>
        {
            var files = sp.GetRequiredService<IOptions<AlarmOptions>>().Value.ResolveFiles(sp.GetService<Pipeline.ConfigLocation>()?.Folder);
            var set = AlarmRuleFile.Load(files);
            if (set.Errors.Count > 0)
            {
                throw new OptionsValidationException(AlarmOptions.Section, typeof(AlarmOptions), set.Errors);
            }

            AlarmLog.Loaded(sp.GetRequiredService<ILoggerFactory>().CreateLogger(typeof(AlarmServices).FullName!), set.Rules.Count, string.Join(", ", files));
            var journal = sp.GetRequiredService<AlarmJournal>();
            return new AlarmEngine(set, journal.Statuses, journal.BatchOf);
        });
        services.AddSingleton<AlarmInputSignals>();
        services.AddSingleton<IAlarmSignalSource>(sp => sp.GetRequiredService<AlarmInputSignals>());
        services.AddSingleton<IAlarmSignalSource, OutboxFillSignal>();
        services.AddSingleton<IAlarmSignalSource, DiskSpaceSignal>();
        services.AddSingleton<IAlarmPublisher, StoreAlarmMirror>();
        services.AddSingleton<IAlarmPublisher, MqttAlarmPublisher>();
        services.AddSingleton<AlarmService>();
        services.AddSingleton<IEstimateSink>(sp => sp.GetRequiredService<AlarmService>());
        services.AddHostedService<AlarmCommandListener>();
        return services;
    }
}
