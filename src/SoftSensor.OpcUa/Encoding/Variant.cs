namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// A value of any built-in type, a one-dimensional array of one, or a multi-dimensional array
/// with its dimensions (Part 6 §5.2.2.16). Scalars hold the CLR type of <see cref="BuiltInType"/>
/// (double for Double, string for String, byte[] for ByteString...); arrays hold a CLR array of it.
/// </summary>
public sealed class Variant
{
    private Variant(BuiltInType type, object? value, bool isArray, int[]? dimensions)
    {
        Type = type;
        Value = value;
        IsArray = isArray;
        Dimensions = dimensions;
    }

    public static Variant Null { get; } = new(BuiltInType.Null, null, false, null);

    public BuiltInType Type { get; }

    public object? Value { get; }

    public bool IsArray { get; }

    /// <summary>Dimensions of a multi-dimensional array (null for scalars and plain arrays).</summary>
    public int[]? Dimensions { get; }

    public bool IsNull => Type == BuiltInType.Null;

    /// <summary>A scalar; the value's CLR type must match <paramref name="type"/>.</summary>
    public static Variant Scalar(BuiltInType type, object? value)
    {
        if (type == BuiltInType.Variant)
        {
            throw new ArgumentException("A Variant may hold Variants only in an array (Part 6 §5.2.2.16).", nameof(type));
        }

        CheckType(type, value);
        return new Variant(type, value, false, null);
    }

    /// <summary>An array, optionally with dimensions whose product equals its length.</summary>
    public static Variant Array(BuiltInType type, Array values, int[]? dimensions = null)
    {
        ArgumentNullException.ThrowIfNull(values);
        if (values.GetType().GetElementType() != VariantTypes.ClrType(type))
        {
            throw new ArgumentException($"Array of {values.GetType().GetElementType()?.Name} does not hold {type}.", nameof(values));
        }

        if (dimensions is not null && VariantTypes.ElementCount(dimensions) != values.Length)
        {
            throw new ArgumentException($"Dimensions [{string.Join(",", dimensions)}] do not multiply to the length {values.Length}.", nameof(dimensions));
        }

        return new Variant(type, values, true, dimensions);
    }

    public static Variant From(double value) => new(BuiltInType.Double, value, false, null);

    public static Variant From(float value) => new(BuiltInType.Float, value, false, null);

    public static Variant From(int value) => new(BuiltInType.Int32, value, false, null);

    public static Variant From(uint value) => new(BuiltInType.UInt32, value, false, null);

    public static Variant From(bool value) => new(BuiltInType.Boolean, value, false, null);

    public static Variant From(string? value) => new(BuiltInType.String, value, false, null);

    public static Variant From(DateTime value) => new(BuiltInType.DateTime, value, false, null);

    /// <summary>The value as a double when it is a numeric scalar (Boolean as 0/1); null otherwise.</summary>
    public double? AsDouble() => IsArray ? null : Value switch
    {
        double d => d,
        float f => f,
        sbyte or byte or short or ushort or int or uint or long or ulong => Convert.ToDouble(Value, System.Globalization.CultureInfo.InvariantCulture),
        bool b => b ? 1.0 : 0.0,
        _ => null,
    };

    public override string ToString() => IsArray ? $"{Type}[{((Array)Value!).Length}]" : Value switch
    {
        null => "null",
        double d => d.ToString("R", System.Globalization.CultureInfo.InvariantCulture),
        float f => f.ToString("R", System.Globalization.CultureInfo.InvariantCulture),
        DateTime t => t.ToString("O", System.Globalization.CultureInfo.InvariantCulture),
        byte[] b => Convert.ToBase64String(b),
        IFormattable x => x.ToString(null, System.Globalization.CultureInfo.InvariantCulture),
        _ => Value.ToString() ?? string.Empty,
    };

    private static void CheckType(BuiltInType type, object? value)
    {
        var expected = VariantTypes.ClrType(type);
        if (value is null ? expected.IsValueType && type != BuiltInType.Null : !expected.IsInstanceOfType(value))
        {
            throw new ArgumentException($"Value of type {value?.GetType().Name ?? "null"} does not hold {type}.", nameof(value));
        }
    }
}
