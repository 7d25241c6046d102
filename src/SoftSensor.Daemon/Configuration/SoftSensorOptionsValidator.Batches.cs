using System.Globalization;
using SoftSensor.Core.Batches;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Configuration;

/// <summary>The keys of <c>reactors:N:batches</c> and the batch tags (roles BatchId, BatchPhaseCode).</summary>
internal sealed partial class SoftSensorOptionsValidator
{
    private static void ValidateBatches(List<string> errors, string key, ReactorOptions r)
    {
        var b = r.Batches;
        string bk = key + ":batches";
        var roles = r.Tags.Values
            .Select(t => Enum.TryParse<SignalRole>(t.Role, ignoreCase: true, out var role) && Enum.IsDefined(role) && !int.TryParse(t.Role, out _) ? role : (SignalRole?)null)
            .OfType<SignalRole>()
            .ToHashSet();
        if (!double.IsNaN(b.FedBatchFeedAboveLPerH))
        {
            if (!(b.FedBatchFeedAboveLPerH >= 0 && double.IsFinite(b.FedBatchFeedAboveLPerH)))
            {
                errors.Add($"{bk}:fedBatchFeedAboveLPerH is {b.FedBatchFeedAboveLPerH} (expected a feed rate of 0 or more L/h, or leave it out)");
            }
            else if (!roles.Contains(SignalRole.FeedRateLPerH))
            {
                errors.Add($"{bk}:fedBatchFeedAboveLPerH is {b.FedBatchFeedAboveLPerH.ToString(CultureInfo.InvariantCulture)} (expected a tag with role FeedRateLPerH to detect the feed from)");
            }
        }

        if (b.FedBatchHold < TimeSpan.Zero || b.FedBatchHold > TimeSpan.FromHours(24))
        {
            errors.Add($"{bk}:fedBatchHold is {b.FedBatchHold} (expected between 00:00:00 and 1.00:00:00)");
        }

        foreach (var (code, phase) in b.PhaseCodes)
        {
            if (!long.TryParse(code, NumberStyles.Integer, CultureInfo.InvariantCulture, out _))
            {
                errors.Add($"{bk}:phaseCodes:{code} is a code '{code}' (expected an integer code as the controller sends it)");
            }

            if (!BatchPhases.TryParse(phase, out _))
            {
                errors.Add($"{bk}:phaseCodes:{code} is '{phase}' (expected one of {BatchPhases.Ids})");
            }
        }

        bool phaseTag = roles.Contains(SignalRole.BatchPhaseCode);
        if (phaseTag && b.PhaseCodes.Count == 0)
        {
            errors.Add($"{bk}:phaseCodes is empty (expected code → phase pairs for the tag with role BatchPhaseCode, e.g. \"2\": \"fed-batch\")");
        }
        else if (!phaseTag && b.PhaseCodes.Count > 0)
        {
            errors.Add($"{bk}:phaseCodes has {b.PhaseCodes.Count} code(s) (expected a tag with role BatchPhaseCode to read them from)");
        }

        foreach (var (tag, t) in r.Tags)
        {
            if (Enum.TryParse<SignalRole>(t.Role, ignoreCase: true, out var role) && SignalRoles.IsBatchRole(role) && (t.Scale != 1 || t.Offset != 0))
            {
                errors.Add($"{key}:tags:{tag}:scale/offset are {t.Scale.ToString(CultureInfo.InvariantCulture)}/{t.Offset.ToString(CultureInfo.InvariantCulture)} (expected 1/0: role {t.Role} is an id or a code, not a measurement)");
            }
        }
    }
}
