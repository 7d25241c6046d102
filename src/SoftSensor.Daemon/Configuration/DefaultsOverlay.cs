using Microsoft.Extensions.Configuration;

namespace SoftSensor.Daemon.Configuration;

/// <summary>
/// Fills every tag's missing keys from its reactor's <c>defaults</c>, then from the file's
/// (<see cref="TagDefaults"/>), as configuration keys above all layers: a key any layer sets for the
/// tag itself is never overlaid.
/// </summary>
internal static class DefaultsOverlay
{
    /// <summary>The keys to add to <paramref name="configuration"/> (empty when no defaults apply).</summary>
    public static Dictionary<string, string?> Keys(IConfiguration configuration)
    {
        var overlay = new Dictionary<string, string?>(StringComparer.OrdinalIgnoreCase);
        var file = Leaves(configuration.GetSection("defaults"));
        foreach (var reactor in configuration.GetSection("reactors").GetChildren())
        {
            var own = Leaves(reactor.GetSection("defaults"));
            foreach (var (k, v) in file)
            {
                own.TryAdd(k, v);
            }

            if (own.Count == 0)
            {
                continue;
            }

            own.TryGetValue("topicPrefix", out var prefix);
            foreach (var tag in reactor.GetSection("tags").GetChildren())
            {
                foreach (var (k, v) in own)
                {
                    if (!string.Equals(k, "topicPrefix", StringComparison.OrdinalIgnoreCase) && tag[k] is null)
                    {
                        overlay[tag.Path + ":" + k] = v;
                    }
                }

                if (!string.IsNullOrEmpty(prefix) && string.IsNullOrEmpty(tag["topic"]) && string.IsNullOrEmpty(tag["opcUaNode"]))
                {
                    overlay[tag.Path + ":topic"] = prefix.TrimEnd('/') + "/" + tag.Key;
                }
            }
        }

        return overlay;
    }

    private static Dictionary<string, string?> Leaves(IConfigurationSection section) =>
        section.AsEnumerable(makePathsRelative: true)
            .Where(kv => kv.Value is not null)
            .ToDictionary(kv => kv.Key, kv => kv.Value, StringComparer.OrdinalIgnoreCase);
}
