using System.Text.Json;
using SoftSensor.Core.Alarms;

namespace SoftSensor.Daemon.Alarming;

/// <summary>The rules read from one or more rule files, or every problem found, each naming the file, the rule and the field.</summary>
internal sealed record AlarmRuleSet(IReadOnlyList<AlarmRule> Rules, TimeSpan MaxShelve, IReadOnlyList<string> Errors)
{
    /// <summary>Default longest shelve: one 8-hour shift (common practice).</summary>
    public static readonly TimeSpan DefaultMaxShelve = TimeSpan.FromHours(8);
}

/// <summary>Reads alarm rule files (JSON, <see cref="AlarmRuleFileDocument"/>) into Core's <see cref="AlarmRule"/>.</summary>
internal static class AlarmRuleFile
{
    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web)
    {
        ReadCommentHandling = JsonCommentHandling.Skip,
        AllowTrailingCommas = true,
        UnmappedMemberHandling = System.Text.Json.Serialization.JsonUnmappedMemberHandling.Disallow,
    };

    /// <summary>Reads every file; problems are collected, not thrown.</summary>
    public static AlarmRuleSet Load(IEnumerable<string> paths)
    {
        var rules = new List<AlarmRule>();
        var errors = new List<string>();
        var maxShelve = AlarmRuleSet.DefaultMaxShelve;
        foreach (var path in paths)
        {
            AlarmRuleFileDocument? doc;
            try
            {
                doc = JsonSerializer.Deserialize<AlarmRuleFileDocument>(File.ReadAllText(path), Json);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException or JsonException)
            {
                errors.Add($"alarm rule file '{path}': {e.Message}");
                continue;
            }

            if (doc is null)
            {
                errors.Add($"alarm rule file '{path}': empty document, expected {{\"rules\": [...]}}");
                continue;
            }

            if (doc.MaxShelveHours is { } h)
            {
                if (h is > 0 and <= 24 * 7)
                {
                    maxShelve = TimeSpan.FromHours(h);
                }
                else
                {
                    errors.Add($"alarm rule file '{path}': maxShelveHours is {h}, expected above 0 and at most 168");
                }
            }

            for (int i = 0; i < doc.Rules.Count; i++)
            {
                if (Map(doc.Rules[i], $"alarm rule file '{path}', rule {i + 1}", errors) is { } rule)
                {
                    rules.Add(rule);
                }
            }
        }

        errors.AddRange(AlarmRuleValidation.Validate(rules));
        return new AlarmRuleSet(rules, maxShelve, errors);
    }

    /// <summary>Maps one document; null (with errors added) when a field cannot be read.</summary>
    public static AlarmRule? Map(AlarmRuleDocument d, string at, List<string> errors)
    {
        int before = errors.Count;
        if (string.IsNullOrWhiteSpace(d.Id))
        {
            errors.Add($"{at}: id is missing");
        }
        else
        {
            at = $"{at} ('{d.Id}')";
        }

        var kind = ParseEnum<AlarmConditionKind>(d.Kind, "kind", at, errors, required: true);
        var source = ParseSignal(d.Source, "source", at, errors, required: true);
        var reference = ParseSignal(d.Reference, "reference", at, errors, required: false);
        var gate = ParseSignal(d.Gate, "gate", at, errors, required: false);
        var priority = ParseEnum<AlarmPriority>(d.Priority ?? "medium", "priority", at, errors, required: true);
        var direction = ParseEnum<RateDirection>(d.Direction ?? "either", "direction", at, errors, required: true);
        var onDelay = Seconds(d.OnDelaySeconds, "onDelaySeconds", at, errors);
        var offDelay = Seconds(d.OffDelaySeconds, "offDelaySeconds", at, errors);
        var window = Seconds(d.WindowSeconds, "windowSeconds", at, errors);
        if (errors.Count > before)
        {
            return null;
        }

        return new AlarmRule
        {
            Id = d.Id!,
            Kind = kind!.Value,
            Source = source!.Value,
            Reference = reference,
            Gate = gate,
            GateAbove = d.GateAbove ?? 0,
            Limit = d.Limit ?? double.NaN,
            Low = d.Low ?? double.NaN,
            High = d.High ?? double.NaN,
            Setpoint = d.Setpoint ?? double.NaN,
            MarginFraction = d.MarginFraction ?? 0,
            MarginAbsolute = d.MarginAbsolute ?? 0,
            Deadband = d.Deadband ?? 0,
            OnDelay = onDelay,
            OffDelay = offDelay,
            RateWindow = window,
            Direction = direction!.Value,
            IncludeUncertain = d.IncludeUncertain ?? false,
            SuppressWhenBad = d.SuppressWhenBad,
            Priority = priority!.Value,
            Category = d.Category ?? (AlarmConditionKinds.IsDataQuality(kind.Value) ? "quality" : "process"),
            Message = d.Message ?? d.Id!,
        };
    }

    private static T? ParseEnum<T>(string? text, string field, string at, List<string> errors, bool required)
        where T : struct, Enum
    {
        if (string.IsNullOrWhiteSpace(text))
        {
            if (required)
            {
                errors.Add($"{at}: {field} is missing, expected one of {Names<T>()}");
            }

            return null;
        }

        string key = text.Replace("-", "", StringComparison.Ordinal).Replace("_", "", StringComparison.Ordinal);
        if (Enum.TryParse<T>(key, ignoreCase: true, out var v) && Enum.IsDefined(v) && !int.TryParse(key, out _))
        {
            return v;
        }

        errors.Add($"{at}: {field} is '{text}', expected one of {Names<T>()}");
        return null;
    }

    private static string Names<T>()
        where T : struct, Enum => string.Join(", ", Enum.GetNames<T>().Select(n => string.Concat(n.Select((c, i) => char.IsUpper(c) && i > 0 ? "_" + char.ToLowerInvariant(c) : char.ToLowerInvariant(c).ToString()))));

    private static SignalRef? ParseSignal(string? text, string field, string at, List<string> errors, bool required)
    {
        if (text is null && !required)
        {
            return null;
        }

        if (SignalRef.TryParse(text, out var r, out string error))
        {
            return r;
        }

        errors.Add($"{at}: {field}: {error}");
        return null;
    }

    private static TimeSpan Seconds(double? value, string field, string at, List<string> errors)
    {
        if (value is null)
        {
            return TimeSpan.Zero;
        }

        if (value is >= 0 and <= 86400 * 7)
        {
            return TimeSpan.FromSeconds(value.Value);
        }

        errors.Add($"{at}: {field} is {value}, expected 0 to 604800 seconds");
        return TimeSpan.Zero;
    }
}
