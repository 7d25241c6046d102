using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Alarms;

/// <summary>Where a signal that an alarm rule reads comes from.</summary>
public enum SignalOrigin
{
    /// <summary>An estimate of the cycle, by its <see cref="EstimateNames"/> id.</summary>
    Estimate,
    /// <summary>An aligned input of the cycle, by its <see cref="SignalRole"/> name.</summary>
    Input,
    /// <summary>A raw plant tag, by its tag name.</summary>
    Tag,
}

/// <summary>
/// A reference to a signal, written in configuration as <c>rq</c> or <c>estimate:rq</c> (an
/// estimate), <c>input:OutletO2Percent</c> (an aligned input) or <c>tag:PT-101</c> (a tag).
/// </summary>
public readonly record struct SignalRef(SignalOrigin Origin, string Name)
{
    /// <summary>An estimate reference.</summary>
    public static SignalRef Estimate(string name) => new(SignalOrigin.Estimate, name);

    /// <summary>An input reference.</summary>
    public static SignalRef Input(SignalRole role) => new(SignalOrigin.Input, role.ToString());

    /// <summary>A tag reference.</summary>
    public static SignalRef Tag(string tag) => new(SignalOrigin.Tag, tag);

    /// <summary>Parses the configuration form; the error names the text and what was expected.</summary>
    public static bool TryParse(string? text, out SignalRef value, out string error)
    {
        value = default;
        error = "";
        if (string.IsNullOrWhiteSpace(text))
        {
            error = "a signal is required: an estimate id (e.g. 'rq'), 'input:<SignalRole>' or 'tag:<name>'";
            return false;
        }

        int colon = text.IndexOf(':', StringComparison.Ordinal);
        string prefix = colon < 0 ? "estimate" : text[..colon];
        string name = colon < 0 ? text : text[(colon + 1)..];
        if (name.Length == 0)
        {
            error = $"'{text}' names no signal after '{prefix}:'";
            return false;
        }

        switch (prefix)
        {
            case "estimate":
                value = Estimate(name);
                return true;
            case "tag":
                value = Tag(name);
                return true;
            case "input" when Enum.TryParse<SignalRole>(name, ignoreCase: false, out var role) && Enum.IsDefined(role) && !int.TryParse(name, out _):
                value = Input(role);
                return true;
            case "input":
                error = $"'{text}': '{name}' is not a signal role; expected one of {string.Join(", ", Enum.GetNames<SignalRole>())}";
                return false;
            default:
                error = $"'{text}': unknown prefix '{prefix}'; expected 'estimate:', 'input:' or 'tag:'";
                return false;
        }
    }

    /// <summary>The configuration form.</summary>
    public override string ToString() => Origin switch
    {
        SignalOrigin.Estimate => Name,
        SignalOrigin.Input => "input:" + Name,
        _ => "tag:" + Name,
    };
}
