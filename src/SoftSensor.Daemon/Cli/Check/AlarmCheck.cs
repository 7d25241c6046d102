using System.Globalization;
using System.Reflection;
using Microsoft.Extensions.Configuration;
using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Alarming;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Cli.Check;

/// <summary>
/// Reads the alarm rule files of section <c>alarms:ruleFiles</c> (files or folders of <c>*.json</c>) as
/// the daemon does (<see cref="AlarmRuleFile"/>) and checks that every signal a rule reads exists: an
/// estimate of <see cref="EstimateNames"/>, or a tag of some reactor's map (or the daemon's own
/// <c>softsensor.*</c> signals).
/// </summary>
internal static class AlarmCheck
{
    private const string DaemonSignalPrefix = "softsensor.";

    private static readonly HashSet<string> EstimateIds = typeof(EstimateNames)
        .GetFields(BindingFlags.Public | BindingFlags.Static)
        .Where(f => f.IsLiteral && f.FieldType == typeof(string))
        .Select(f => (string)f.GetRawConstantValue()!)
        .ToHashSet(StringComparer.Ordinal);

    public static IReadOnlyList<AlarmRuleLine> Run(IConfiguration configuration, SoftSensorOptions options, string folder, List<string> problems)
    {
        var named = configuration.GetSection("alarms:ruleFiles").Get<List<string>>() ?? [];
        if (named.Count == 0)
        {
            return [];
        }

        var files = new List<string>();
        foreach (var p in named.Select(p => ConfigurationCheck.Resolve(p, folder)))
        {
            if (Directory.Exists(p))
            {
                files.AddRange(Directory.GetFiles(p, "*.json").Order(StringComparer.Ordinal));
            }
            else if (File.Exists(p))
            {
                files.Add(p);
            }
            else
            {
                problems.Add($"alarms:ruleFiles names '{p}': no such file or folder (expected an alarm rule file, e.g. config/alarms/process.json)");
            }
        }

        var set = AlarmRuleFile.Load(files);
        problems.AddRange(set.Errors);
        var tags = options.Reactors.SelectMany(r => r.Tags.Keys).ToHashSet(StringComparer.Ordinal);
        var lines = new List<AlarmRuleLine>();
        foreach (var rule in set.Rules)
        {
            Signal(rule.Id, "source", rule.Source, tags, problems);
            if (rule.Reference is { } reference)
            {
                Signal(rule.Id, "reference", reference, tags, problems);
            }

            if (rule.Gate is { } gate)
            {
                Signal(rule.Id, "gate", gate, tags, problems);
            }

            lines.Add(new AlarmRuleLine(rule.Id, rule.Kind.ToString(), Text(rule.Source), rule.Reference is { } r ? Text(r) : null,
                Thresholds(rule), rule.Priority.ToString(), rule.Category));
        }

        return lines;
    }

    private static void Signal(string rule, string field, SignalRef signal, HashSet<string> tags, List<string> problems)
    {
        switch (signal.Origin)
        {
            case SignalOrigin.Estimate when !EstimateIds.Contains(signal.Name):
                problems.Add($"alarm rule '{rule}': {field} is '{signal.Name}', an unknown estimate (expected one of {string.Join(", ", EstimateIds.Order(StringComparer.Ordinal))})");
                break;
            case SignalOrigin.Tag when !tags.Contains(signal.Name) && !signal.Name.StartsWith(DaemonSignalPrefix, StringComparison.Ordinal):
                problems.Add($"alarm rule '{rule}': {field} is 'tag:{signal.Name}', a tag no reactor maps (expected a tag of a reactor's tag map)");
                break;
            default:
                break;
        }
    }

    private static string Text(SignalRef s) => s.Origin switch
    {
        SignalOrigin.Estimate => s.Name,
        SignalOrigin.Input => "input:" + s.Name,
        _ => "tag:" + s.Name,
    };

    private static string Thresholds(AlarmRule r)
    {
        var parts = new List<string>();
        void Add(string name, double v)
        {
            if (double.IsFinite(v))
            {
                parts.Add(name + " " + v.ToString("G6", CultureInfo.InvariantCulture));
            }
        }

        Add("limit", r.Limit);
        Add("low", r.Low);
        Add("high", r.High);
        Add("setpoint", r.Setpoint);
        if (r.MarginFraction != 0)
        {
            Add("margin", r.MarginFraction);
        }

        if (r.Deadband != 0)
        {
            Add("deadband", r.Deadband);
        }

        if (r.OnDelay > TimeSpan.Zero)
        {
            parts.Add($"on-delay {r.OnDelay.TotalSeconds.ToString(CultureInfo.InvariantCulture)} s");
        }

        return string.Join(", ", parts);
    }
}
