using System.Collections;
using System.ComponentModel;
using System.Globalization;
using System.Reflection;
using Microsoft.Extensions.Configuration;

namespace SoftSensor.Daemon.Configuration;

/// <summary>
/// The strict reading of a reactor definition: every key of the merged configuration (files,
/// environment, command line) must be a setting of the options type it lands in, and every value
/// must parse as that setting's type. The binder alone would skip an unknown key and fail on the
/// first unparsable value with a stack trace; this walks the whole tree first and reports every
/// problem, one line each, naming the key, the nearest valid name or the expected form.
/// </summary>
internal static class DefinitionSchema
{
    /// <summary>Root sections that belong to the .NET host, not to the definition (left unchecked).</summary>
    private static readonly string[] HostSections = ["Logging", "AllowedHosts", "Kestrel"];

    /// <summary>The problems of <paramref name="configuration"/>, checked against <paramref name="root"/> and the extra root <paramref name="sections"/>.</summary>
    public static IReadOnlyList<string> Problems(IConfiguration configuration, Type root, IReadOnlyDictionary<string, Type> sections)
    {
        var problems = new List<string>();
        var names = Settings(root).Keys.Concat(sections.Keys).Concat(HostSections).ToList();
        foreach (var child in configuration.GetChildren())
        {
            if (HostSections.Contains(child.Key, StringComparer.OrdinalIgnoreCase) || IsComment(child.Key))
            {
                continue;
            }

            var section = sections.FirstOrDefault(s => string.Equals(s.Key, child.Key, StringComparison.OrdinalIgnoreCase));
            if (section.Value is not null)
            {
                Walk(child, section.Value, problems);
            }
            else if (Settings(root).TryGetValue(child.Key, out var p))
            {
                Walk(child, p.PropertyType, problems);
            }
            else
            {
                problems.Add(Unknown(child, names));
            }
        }

        return problems;
    }

    private static void Walk(IConfigurationSection section, Type type, List<string> problems)
    {
        var target = Nullable.GetUnderlyingType(type) ?? type;
        if (IsScalar(target))
        {
            Scalar(section, target, problems);
            return;
        }

        if (Dictionary(target) is { } valueType)
        {
            foreach (var child in section.GetChildren())
            {
                Walk(child, valueType, problems);
            }

            return;
        }

        if (Element(target) is { } elementType)
        {
            foreach (var child in section.GetChildren())
            {
                if (!int.TryParse(child.Key, NumberStyles.None, CultureInfo.InvariantCulture, out _))
                {
                    problems.Add($"{child.Path} is not an item of the list {section.Path} (expected a JSON array)");
                    continue;
                }

                Walk(child, elementType, problems);
            }

            return;
        }

        if (section.Value is { Length: > 0 } text && !section.GetChildren().Any())
        {
            problems.Add($"{section.Path} is '{text}' (expected an object with the settings {string.Join(", ", Settings(target).Keys)})");
            return;
        }

        var settings = Settings(target);
        foreach (var child in section.GetChildren())
        {
            if (IsComment(child.Key))
            {
                continue;
            }

            if (settings.TryGetValue(child.Key, out var p))
            {
                Walk(child, p.PropertyType, problems);
            }
            else
            {
                problems.Add(Unknown(child, settings.Keys));
            }
        }
    }

    /// <summary>A key that begins with '_' (e.g. <c>_comment</c>) is a note for people, outside any tag map or list.</summary>
    private static bool IsComment(string key) => key.StartsWith('_');

    private static void Scalar(IConfigurationSection section, Type type, List<string> problems)
    {
        if (section.GetChildren().Any())
        {
            problems.Add($"{section.Path} is an object (expected {Form(type)})");
            return;
        }

        string? text = section.Value;
        if (text is null || type == typeof(string))
        {
            return;
        }

        if (type.IsEnum)
        {
            if (text.Length == 0 || char.IsDigit(text[0]) || text[0] == '-' || !Enum.TryParse(type, text, ignoreCase: true, out var v) || !Enum.IsDefined(type, v!))
            {
                problems.Add($"{section.Path} is '{text}' (expected {Form(type)})");
            }

            return;
        }

        if (text.Length == 0 && type != typeof(string))
        {
            problems.Add($"{section.Path} is empty (expected {Form(type)})");
            return;
        }

        try
        {
            TypeDescriptor.GetConverter(type).ConvertFromInvariantString(text);
        }
        catch (Exception e) when (e is FormatException or ArgumentException or OverflowException or NotSupportedException)
        {
            problems.Add($"{section.Path} is '{text}' (expected {Form(type)})");
        }
    }

    /// <summary>The expected form of a setting's value, for messages.</summary>
    public static string Form(Type type) => type switch
    {
        _ when type == typeof(double) || type == typeof(float) || type == typeof(decimal) => "a number, e.g. 1.5",
        _ when type == typeof(int) || type == typeof(long) => "a whole number, e.g. 10",
        _ when type == typeof(bool) => "true or false",
        _ when type == typeof(TimeSpan) => "a duration hh:mm:ss, e.g. 00:00:10",
        _ when type == typeof(DateTimeOffset) => "an ISO 8601 time with offset, e.g. 2026-01-01T00:00:00Z",
        _ when type == typeof(Uri) => "an absolute URL",
        _ when type.IsEnum => "one of " + string.Join(", ", Enum.GetNames(type).Select(Camel)),
        _ => "text",
    };

    private static string Unknown(IConfigurationSection child, IEnumerable<string> valid)
    {
        var names = valid.Distinct(StringComparer.OrdinalIgnoreCase).ToList();
        string? nearest = Nearest(child.Key, names);
        string parent = child.Path.Contains(':', StringComparison.Ordinal) ? child.Path[..child.Path.LastIndexOf(':')] : "the file's top level";
        return nearest is not null
            ? $"{child.Path} is not a setting of {parent} (did you mean '{nearest}'?)"
            : $"{child.Path} is not a setting of {parent} (expected one of {string.Join(", ", names)})";
    }

    /// <summary>The valid name closest to <paramref name="key"/> (edit distance at most a third of its length, at least 2), or null.</summary>
    public static string? Nearest(string key, IReadOnlyCollection<string> names)
    {
        string? best = null;
        int bestDistance = int.MaxValue;
        foreach (var n in names)
        {
            int d = Distance(key.ToLowerInvariant(), n.ToLowerInvariant());
            if (d < bestDistance)
            {
                bestDistance = d;
                best = n;
            }
        }

        return bestDistance <= Math.Max(2, key.Length / 3) ? best : null;
    }

    // Levenshtein distance with adjacent transpositions (optimal string alignment).
    private static int Distance(string a, string b)
    {
        var d = new int[a.Length + 1, b.Length + 1];
        for (int i = 0; i <= a.Length; i++) d[i, 0] = i;
        for (int j = 0; j <= b.Length; j++) d[0, j] = j;
        for (int i = 1; i <= a.Length; i++)
        {
            for (int j = 1; j <= b.Length; j++)
            {
                int cost = a[i - 1] == b[j - 1] ? 0 : 1;
                d[i, j] = Math.Min(Math.Min(d[i - 1, j] + 1, d[i, j - 1] + 1), d[i - 1, j - 1] + cost);
                if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1])
                {
                    d[i, j] = Math.Min(d[i, j], d[i - 2, j - 2] + 1);
                }
            }
        }

        return d[a.Length, b.Length];
    }

    private static bool IsScalar(Type t) =>
        t.IsPrimitive || t.IsEnum || t == typeof(string) || t == typeof(decimal) || t == typeof(TimeSpan)
        || t == typeof(DateTimeOffset) || t == typeof(DateTime) || t == typeof(Uri) || t == typeof(Guid);

    private static Type? Dictionary(Type t) =>
        t.IsGenericType && t.GetInterfaces().Concat([t]).FirstOrDefault(i => i.IsGenericType && i.GetGenericTypeDefinition() == typeof(IDictionary<,>)) is { } d
            ? d.GetGenericArguments()[1]
            : null;

    private static Type? Element(Type t) =>
        t.IsArray ? t.GetElementType()
        : t.IsGenericType && typeof(IEnumerable).IsAssignableFrom(t) ? t.GetGenericArguments()[0]
        : null;

    /// <summary>The bindable settings of an options type by their camelCase key (case-insensitive lookup).</summary>
    private static Dictionary<string, PropertyInfo> Settings(Type t)
    {
        var d = new Dictionary<string, PropertyInfo>(StringComparer.OrdinalIgnoreCase);
        foreach (var p in t.GetProperties(BindingFlags.Public | BindingFlags.Instance))
        {
            bool settable = p.SetMethod is { IsPublic: true };
            bool fillable = !IsScalar(Nullable.GetUnderlyingType(p.PropertyType) ?? p.PropertyType) && p.GetMethod is { IsPublic: true };
            if ((settable || fillable) && p.GetIndexParameters().Length == 0)
            {
                d[Camel(p.Name)] = p;
            }
        }

        return d;
    }

    private static string Camel(string name) => name.Length == 0 ? name : char.ToLowerInvariant(name[0]) + name[1..];
}
