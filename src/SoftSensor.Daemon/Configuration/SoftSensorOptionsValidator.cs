using System.Text.RegularExpressions;
using Microsoft.Extensions.Options;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Configuration;

/// <summary>
/// Checks the whole configuration at start and reports every problem at once, each naming its key,
/// the value found and what was expected (the host's ValidateOnStart turns them into one message).
/// </summary>
internal sealed partial class SoftSensorOptionsValidator : IValidateOptions<SoftSensorOptions>
{
    public ValidateOptionsResult Validate(string? name, SoftSensorOptions options)
    {
        var errors = new List<string>();
        TopicLevel(errors, $"site", options.Site);
        TopicLevel(errors, $"area", options.Area);
        if (options.Reactors.Count == 0)
        {
            errors.Add($"reactors is empty (expected at least one reactor)");
        }

        var ids = new HashSet<string>(StringComparer.Ordinal);
        var topics = new Dictionary<string, string>(StringComparer.Ordinal);
        for (int i = 0; i < options.Reactors.Count; i++)
        {
            var r = options.Reactors[i];
            string key = $"reactors:{i}";
            TopicLevel(errors, key + ":id", r.Id);
            if (r.Id.Length > 0 && !ids.Add(r.Id))
            {
                errors.Add($"{key}:id is '{r.Id}' (expected an id no other reactor uses)");
            }

            if (r.CyclePeriod < TimeSpan.FromMilliseconds(100) || r.CyclePeriod > TimeSpan.FromHours(1))
            {
                errors.Add($"{key}:cyclePeriod is {r.CyclePeriod} (expected between 00:00:00.1 and 01:00:00)");
            }

            ValidateGas(errors, key + ":gas", r.Gas);
            if (!string.IsNullOrWhiteSpace(r.ModelFile))
            {
                errors.AddRange(EstimatorSetup.Validate(key + ":estimator/balance", r.Estimator, r.Balance));
            }
            if (r.Tags.Count == 0)
            {
                errors.Add($"{key}:tags is empty (expected a tag map)");
            }

            if (r.CycleTrigger.Length > 0 && !r.Tags.ContainsKey(r.CycleTrigger))
            {
                errors.Add($"{key}:cycleTrigger is '{r.CycleTrigger}' (expected a tag of this reactor's map, or empty)");
            }

            var roles = new HashSet<SignalRole>();
            foreach (var (tag, t) in r.Tags)
            {
                ValidateTag(errors, $"{key}:tags:{tag}", t, roles, topics);
            }

            if (r.Tags.Count > 0)
            {
                RequireRoles(errors, key, r, roles);
            }

            ValidateBatches(errors, key, r);
        }

        ValidateMqtt(errors, options.Mqtt);
        ValidateOpcUa(errors, options);
        if (string.IsNullOrWhiteSpace(options.Store.Path))
        {
            errors.Add($"store:path is empty (expected a file path)");
        }

        if (options.Store.CheckpointEveryCycles < 1)
        {
            errors.Add($"store:checkpointEveryCycles is {options.Store.CheckpointEveryCycles} (expected 1 or more)");
        }

        ValidateRetention(errors, options.Store);

        if (!Uri.TryCreate(options.Status.Url, UriKind.Absolute, out var url) || (url.Scheme != Uri.UriSchemeHttp && url.Scheme != Uri.UriSchemeHttps))
        {
            errors.Add($"status:url is '{options.Status.Url}' (expected an http:// or https:// URL such as http://127.0.0.1:8470)");
        }

        return errors.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(errors);
    }

    private static void ValidateRetention(List<string> errors, StoreOptions store)
    {
        if (store.Retention < TimeSpan.FromDays(1))
        {
            errors.Add($"store:retention is {store.Retention} (expected 1 day or more, e.g. 365.00:00:00)");
        }

        if (store.CheckpointsKept < 1)
        {
            errors.Add($"store:checkpointsKept is {store.CheckpointsKept} (expected 1 or more)");
        }

        if (!double.IsFinite(store.MinFreeDiskMegabytes) || store.MinFreeDiskMegabytes < 0)
        {
            errors.Add($"store:minFreeDiskMegabytes is {store.MinFreeDiskMegabytes.ToString(System.Globalization.CultureInfo.InvariantCulture)} (expected 0 or more megabytes)");
        }

        if (!double.IsFinite(store.MaintenanceIntervalSeconds) || store.MaintenanceIntervalSeconds is < 0.01 or > 86_400)
        {
            errors.Add($"store:maintenanceIntervalSeconds is {store.MaintenanceIntervalSeconds.ToString(System.Globalization.CultureInfo.InvariantCulture)} (expected 0.01 to 86400 seconds)");
        }
    }

    private static void ValidateTag(List<string> errors, string key, TagOptions t, HashSet<SignalRole> roles, Dictionary<string, string> topics)
    {
        if (!Enum.TryParse<SignalRole>(t.Role, ignoreCase: true, out var role) || !Enum.IsDefined(role) || int.TryParse(t.Role, out _))
        {
            errors.Add($"{key}:role is '{t.Role}' (expected one of {string.Join(", ", Enum.GetNames<SignalRole>())})");
        }
        else
        {
            if (!roles.Add(role))
            {
                errors.Add($"{key}:role is '{t.Role}' (expected a role no other tag of this reactor has)");
            }

            if (PlantUnits.Problem(role, t.Unit) is { } unitProblem)
            {
                errors.Add($"{key}:unit is {unitProblem}");
            }
            else if (PlantUnits.IsGauge(t.Unit) && !double.IsFinite(t.AtmosphereKPa))
            {
                errors.Add($"{key}:atmosphereKPa is missing (expected the atmospheric reference in kPa of the gauge pressure unit '{t.Unit}', on the tag or in defaults)");
            }
        }

        if (!double.IsFinite(t.Scale) || t.Scale == 0)
        {
            errors.Add($"{key}:scale is {t.Scale} (expected a finite non-zero number)");
        }

        if (!double.IsFinite(t.Offset))
        {
            errors.Add($"{key}:offset is {t.Offset} (expected a finite number)");
        }

        if (t.MaxAge <= TimeSpan.Zero)
        {
            errors.Add($"{key}:maxAge is {t.MaxAge} (expected a positive duration)");
        }

        if (t.DeadTime < TimeSpan.Zero || t.DeadTime > TimeSpan.FromHours(1))
        {
            errors.Add($"{key}:deadTime is {t.DeadTime} (expected between 00:00:00 and 01:00:00)");
        }

        if (!string.IsNullOrWhiteSpace(t.OpcUaNode))
        {
            if (new SoftSensor.OpcUa.Subscriptions.NodeReference(t.OpcUaNode).Validate() is { } nodeError)
            {
                errors.Add($"{key}:opcUaNode is '{t.OpcUaNode}' ({nodeError})");
            }

            if (!string.IsNullOrWhiteSpace(t.Topic))
            {
                errors.Add($"{key}:topic is '{t.Topic}' (expected empty when opcUaNode is set: a tag has one source)");
            }
        }
        else if (string.IsNullOrWhiteSpace(t.Topic) || t.Topic.Contains('+', StringComparison.Ordinal) || t.Topic.Contains('#', StringComparison.Ordinal))
        {
            errors.Add($"{key}:topic is '{t.Topic}' (expected an exact MQTT topic without wildcards)");
        }
        else if (!topics.TryAdd(t.Topic, key))
        {
            errors.Add($"{key}:topic is '{t.Topic}' (expected a topic no other tag uses; {topics[t.Topic]} has it)");
        }

        if (!Enum.IsDefined(t.Payload.Format))
        {
            errors.Add($"{key}:payload:format is '{t.Payload.Format}' (expected json or number)");
        }
        else if (t.Payload.Format == PayloadFormat.Json && string.IsNullOrWhiteSpace(t.Payload.ValuePath))
        {
            errors.Add($"{key}:payload:valuePath is empty (expected the dotted path of the value, e.g. value)");
        }
    }

    private static void RequireRoles(List<string> errors, string key, ReactorOptions r, HashSet<SignalRole> roles)
    {
        foreach (var role in new[] { SignalRole.OutletO2Percent, SignalRole.OutletCo2Percent })
        {
            if (!roles.Contains(role))
            {
                errors.Add($"{key}:tags has no tag with role {role} (expected one: the gas balance needs it)");
            }
        }

        if (!roles.Overlaps([SignalRole.AirFlowNlPerMin, SignalRole.OxygenFlowNlPerMin, SignalRole.NitrogenFlowNlPerMin, SignalRole.CarbonDioxideFlowNlPerMin]))
        {
            errors.Add($"{key}:tags has no gas-line flow (expected a tag with role AirFlowNlPerMin, OxygenFlowNlPerMin, NitrogenFlowNlPerMin or CarbonDioxideFlowNlPerMin)");
        }

        if (r.Gas.Inlet == InletSetting.Measured && !(roles.Contains(SignalRole.InletO2Percent) && roles.Contains(SignalRole.InletCo2Percent)))
        {
            errors.Add($"{key}:gas:inlet is 'measured' (expected tags with roles InletO2Percent and InletCo2Percent)");
        }

        if (!roles.Contains(SignalRole.LiquidVolumeL) && double.IsNaN(r.Gas.LiquidVolumeL))
        {
            errors.Add($"{key}:gas:liquidVolumeL is not set (expected a volume in L, or a tag with role LiquidVolumeL)");
        }

        if (r.Gas.AnalyserBasis == AnalyserBasisKind.Wet && !roles.Contains(SignalRole.AnalyserTemperatureC))
        {
            errors.Add($"{key}:gas:analyserBasis is 'wet' (expected a tag with role AnalyserTemperatureC)");
        }
    }

    private static void ValidateGas(List<string> errors, string key, GasOptions g)
    {
        if (!(g.MfcReferenceTemperatureK is > 200 and < 400))
        {
            errors.Add($"{key}:mfcReferenceTemperatureK is {g.MfcReferenceTemperatureK} (expected kelvin between 200 and 400, e.g. 273.15)");
        }

        if (!(g.MfcReferencePressureKPa is > 50 and < 200))
        {
            errors.Add($"{key}:mfcReferencePressureKPa is {g.MfcReferencePressureKPa} (expected kPa between 50 and 200, e.g. 101.325)");
        }

        if (!Enum.IsDefined(g.AnalyserBasis))
        {
            errors.Add($"{key}:analyserBasis is '{g.AnalyserBasis}' (expected dry or wet)");
        }

        if (!Enum.IsDefined(g.Inlet))
        {
            errors.Add($"{key}:inlet is '{g.Inlet}' (expected lines, fixed or measured)");
        }

        if (!(g.AirCo2Percent is >= 0 and < 100))
        {
            errors.Add($"{key}:airCo2Percent is {g.AirCo2Percent} (expected a percentage in [0, 100))");
        }

        if (!double.IsNaN(g.AnalyserPressureKPa) && !(g.AnalyserPressureKPa is > 10 and < 1000))
        {
            errors.Add($"{key}:analyserPressureKPa is {g.AnalyserPressureKPa} (expected kPa between 10 and 1000, or leave it out)");
        }

        if (!(g.MinAerationNlPerMin >= 0))
        {
            errors.Add($"{key}:minAerationNlPerMin is {g.MinAerationNlPerMin} (expected 0 or more)");
        }

        foreach (var (name, v) in new[] { ("o2AccuracyPercentAbs", g.O2AccuracyPercentAbs), ("co2AccuracyPercentAbs", g.Co2AccuracyPercentAbs), ("flowAccuracyPercentOfReading", g.FlowAccuracyPercentOfReading) })
        {
            if (!(v >= 0 && double.IsFinite(v)))
            {
                errors.Add($"{key}:{name} is {v} (expected 0 or more)");
            }
        }

        if (!(g.InletO2Percent is > 0 and <= 100))
        {
            errors.Add($"{key}:inletO2Percent is {g.InletO2Percent} (expected a percentage in (0, 100])");
        }

        if (!(g.InletCo2Percent is >= 0 and < 100))
        {
            errors.Add($"{key}:inletCo2Percent is {g.InletCo2Percent} (expected a percentage in [0, 100))");
        }

        if (!double.IsNaN(g.LiquidVolumeL) && !(g.LiquidVolumeL > 0 && double.IsFinite(g.LiquidVolumeL)))
        {
            errors.Add($"{key}:liquidVolumeL is {g.LiquidVolumeL} (expected a positive volume in L, or leave it out)");
        }
    }

    private static void ValidateMqtt(List<string> errors, MqttOptions m)
    {
        const string key = "mqtt";
        if (string.IsNullOrWhiteSpace(m.Host))
        {
            errors.Add($"{key}:host is empty (expected a host name or address)");
        }

        if (m.Port is < 1 or > 65535)
        {
            errors.Add($"{key}:port is {m.Port} (expected 1 to 65535)");
        }

        if (string.IsNullOrWhiteSpace(m.ClientId))
        {
            errors.Add($"{key}:clientId is empty (expected a client id unique on the broker)");
        }

        if (m.Password.Length > 0 && m.Username.Length == 0)
        {
            errors.Add($"{key}:username is empty (expected a user name when a password is set)");
        }

        if (string.IsNullOrWhiteSpace(m.TopicPrefix) || m.TopicPrefix.StartsWith('/') || m.TopicPrefix.EndsWith('/')
            || m.TopicPrefix.IndexOfAny(['+', '#']) >= 0)
        {
            errors.Add($"{key}:topicPrefix is '{m.TopicPrefix}' (expected topic levels without a leading or trailing '/' or wildcards, e.g. softsensor)");
        }

        if (m.TimestampWindowPast <= TimeSpan.Zero || m.TimestampWindowFuture < TimeSpan.Zero)
        {
            errors.Add($"{key}:timestampWindowPast is {m.TimestampWindowPast} and {key}:timestampWindowFuture is {m.TimestampWindowFuture} (expected above 0 and 0 or more)");
        }

        if (m.PingInterval < TimeSpan.FromMilliseconds(100))
        {
            errors.Add($"{key}:pingInterval is {m.PingInterval} (expected 00:00:00.1 or more)");
        }

        if (m.ReconnectMinDelay <= TimeSpan.Zero || m.ReconnectMaxDelay < m.ReconnectMinDelay)
        {
            errors.Add($"{key}:reconnectMinDelay/reconnectMaxDelay are {m.ReconnectMinDelay}/{m.ReconnectMaxDelay} (expected 0 < min ≤ max)");
        }
    }

    private static void TopicLevel(List<string> errors, string key, string value)
    {
        if (!TopicLevelPattern().IsMatch(value))
        {
            errors.Add($"{key} is '{value}' (expected lowercase letters, digits, '-' or '_')");
        }
    }

    [GeneratedRegex("^[a-z0-9][a-z0-9_-]*$")]
    private static partial Regex TopicLevelPattern();
}
