using SoftSensor.OpcUa.SecureChannel.Security;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Subscriptions;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.Daemon.Configuration;

/// <summary>The checks of section <c>opcUa</c> and of the tags and write-back nodes that need it.</summary>
internal sealed partial class SoftSensorOptionsValidator
{
    private static void ValidateOpcUa(List<string> errors, SoftSensorOptions options)
    {
        var o = options.OpcUa;
        bool hasEndpoint = !string.IsNullOrWhiteSpace(o.Endpoint);
        if (hasEndpoint)
        {
            try
            {
                EndpointAddress.Parse(o.Endpoint);
            }
            catch (FormatException)
            {
                errors.Add($"opcUa:endpoint is '{o.Endpoint}' (expected opc.tcp://host[:port][/path])");
            }
        }

        var mode = SecuritySettings.ParseMode(o.Security);
        if (mode is null)
        {
            errors.Add($"opcUa:security is '{o.Security}' (expected none, sign or sign-encrypt; empty for the most secure endpoint both sides support)");
        }

        if (!string.IsNullOrWhiteSpace(o.Policy))
        {
            try
            {
                var policy = SecurityPolicy.Find(o.Policy.Trim());
                if (policy.IsNone != (mode == SecurityChoice.None) && mode is not (null or SecurityChoice.Auto))
                {
                    errors.Add($"opcUa:policy is '{o.Policy}' with opcUa:security '{o.Security}' (expected policy None with security none, and a secured policy with sign or sign-encrypt)");
                }
            }
            catch (ServiceResultException e)
            {
                errors.Add($"opcUa:policy is '{o.Policy}' ({e.Message})");
            }
        }

        // A tag that names an OPC UA node with no server to read it from would never deliver a value:
        // its estimates would only turn Bad (stale) at run time. Refuse it at start instead.
        for (int i = 0; i < options.Reactors.Count && !hasEndpoint; i++)
        {
            foreach (var (tag, t) in options.Reactors[i].Tags)
            {
                if (!string.IsNullOrWhiteSpace(t.OpcUaNode))
                {
                    errors.Add($"reactors:{i}:tags:{tag}:opcUaNode is '{t.OpcUaNode}' (expected opcUa:endpoint to be set, e.g. opc.tcp://10.0.0.5:4840: no OPC UA server is configured to read it from)");
                }
            }
        }

        if (o.PublishingInterval < TimeSpan.FromMilliseconds(10))
        {
            errors.Add($"opcUa:publishingInterval is {o.PublishingInterval} (expected 00:00:00.010 or more)");
        }

        if (o.SamplingInterval < TimeSpan.Zero)
        {
            errors.Add($"opcUa:samplingInterval is {o.SamplingInterval} (expected 00:00:00 or more)");
        }

        if (o.QueueSize < 1)
        {
            errors.Add($"opcUa:queueSize is {o.QueueSize} (expected 1 or more)");
        }

        if (!double.IsFinite(o.AbsoluteDeadband) || o.AbsoluteDeadband < 0)
        {
            errors.Add($"opcUa:absoluteDeadband is {o.AbsoluteDeadband} (expected a finite number ≥ 0 in the tag's plant unit)");
        }

        var ids = options.Reactors.Select(r => r.Id).ToHashSet(StringComparer.Ordinal);
        foreach (var (reactor, map) in o.WriteBack)
        {
            string key = $"opcUa:writeBack:{reactor}";
            if (!ids.Contains(reactor))
            {
                errors.Add($"{key} names reactor '{reactor}' (expected the id of a configured reactor: {string.Join(", ", ids.Order(StringComparer.Ordinal))})");
            }

            foreach (var (estimate, node) in map)
            {
                if (!hasEndpoint)
                {
                    errors.Add($"{key}:{estimate} is '{node}' (expected opcUa:endpoint to be set: no OPC UA server is configured to write it to)");
                }
                else if (new NodeReference(node).Validate() is { } nodeError)
                {
                    errors.Add($"{key}:{estimate} is '{node}' ({nodeError})");
                }
            }
        }
    }
}
