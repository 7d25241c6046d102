namespace SoftSensor.Core.Alarms;

/// <summary>Checks alarm rules; every problem is reported, each naming the rule, the field and the value.</summary>
public static class AlarmRuleValidation
{
    /// <summary>The problems of one rule (empty when it is usable).</summary>
    public static IReadOnlyList<string> Validate(AlarmRule rule)
    {
        var errors = new List<string>();
        string at = $"alarm rule '{rule.Id}'";
        if (rule.Id.Length == 0 || !rule.Id.All(c => c is (>= 'a' and <= 'z') or (>= '0' and <= '9') or '_' or '-' or '.'))
        {
            errors.Add($"{at}: id must be non-empty lowercase letters, digits, '_', '-' or '.'");
        }

        if (string.IsNullOrEmpty(rule.Source.Name))
        {
            errors.Add($"{at}: source is required");
        }

        switch (rule.Kind)
        {
            case AlarmConditionKind.High or AlarmConditionKind.HighHigh or AlarmConditionKind.Low or AlarmConditionKind.LowLow:
                RequireFinite(errors, at, "limit", rule.Limit);
                break;
            case AlarmConditionKind.Window:
                RequireFinite(errors, at, "low", rule.Low);
                RequireFinite(errors, at, "high", rule.High);
                if (double.IsFinite(rule.Low) && double.IsFinite(rule.High) && rule.High - rule.Low <= 2 * rule.Deadband)
                {
                    errors.Add($"{at}: window [{rule.Low}, {rule.High}] must be wider than twice the deadband {rule.Deadband}");
                }

                break;
            case AlarmConditionKind.RateOfChange:
                RequirePositive(errors, at, "limit", rule.Limit);
                RequirePositiveSpan(errors, at, "rateWindow", rule.RateWindow);
                break;
            case AlarmConditionKind.Deviation:
                RequirePositive(errors, at, "limit", rule.Limit);
                if (rule.Reference is null && !double.IsFinite(rule.Setpoint))
                {
                    errors.Add($"{at}: a deviation needs a finite setpoint or a reference signal");
                }

                break;
            case AlarmConditionKind.AboveReference:
                if (rule.Reference is null)
                {
                    errors.Add($"{at}: reference is required for kind AboveReference");
                }

                RequireNonNegative(errors, at, "marginFraction", rule.MarginFraction);
                RequireNonNegative(errors, at, "marginAbsolute", rule.MarginAbsolute);
                break;
            case AlarmConditionKind.FlatLine:
                RequirePositive(errors, at, "limit", rule.Limit);
                RequirePositiveSpan(errors, at, "rateWindow", rule.RateWindow);
                break;
            case AlarmConditionKind.BadQuality or AlarmConditionKind.Inconsistent:
                break;
            default:
                errors.Add($"{at}: unknown kind {(int)rule.Kind}");
                break;
        }

        RequireNonNegative(errors, at, "deadband", rule.Deadband);
        if (rule.OnDelay < TimeSpan.Zero)
        {
            errors.Add($"{at}: onDelay is {rule.OnDelay}, expected zero or more");
        }

        if (rule.OffDelay < TimeSpan.Zero)
        {
            errors.Add($"{at}: offDelay is {rule.OffDelay}, expected zero or more");
        }

        if (!Enum.IsDefined(rule.Priority))
        {
            errors.Add($"{at}: priority {(int)rule.Priority} is not one of {string.Join(", ", Enum.GetNames<AlarmPriority>())}");
        }

        if (rule.Gate is not null && !double.IsFinite(rule.GateAbove))
        {
            errors.Add($"{at}: gateAbove is {rule.GateAbove}, expected a finite number");
        }

        return errors;
    }

    /// <summary>The problems of a rule set, including duplicate ids.</summary>
    public static IReadOnlyList<string> Validate(IEnumerable<AlarmRule> rules)
    {
        var errors = new List<string>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var rule in rules)
        {
            if (!seen.Add(rule.Id))
            {
                errors.Add($"alarm rule '{rule.Id}': id used twice");
            }

            errors.AddRange(Validate(rule));
        }

        return errors;
    }

    private static void RequireFinite(List<string> errors, string at, string field, double value)
    {
        if (!double.IsFinite(value))
        {
            errors.Add($"{at}: {field} is {value}, expected a finite number");
        }
    }

    private static void RequirePositive(List<string> errors, string at, string field, double value)
    {
        if (!(value > 0) || !double.IsFinite(value))
        {
            errors.Add($"{at}: {field} is {value}, expected a finite number above zero");
        }
    }

    private static void RequireNonNegative(List<string> errors, string at, string field, double value)
    {
        if (!(value >= 0) || !double.IsFinite(value))
        {
            errors.Add($"{at}: {field} is {value}, expected a finite number, zero or more");
        }
    }

    private static void RequirePositiveSpan(List<string> errors, string at, string field, TimeSpan value)
    {
        if (value <= TimeSpan.Zero)
        {
            errors.Add($"{at}: {field} is {value}, expected a duration above zero");
        }
    }
}
