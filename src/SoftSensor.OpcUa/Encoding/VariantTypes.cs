namespace SoftSensor.OpcUa.Encoding;

/// <summary>The CLR type that represents each built-in type in a <see cref="Variant"/>.</summary>
public static class VariantTypes
{
    public static Type ClrType(BuiltInType type) => type switch
    {
        BuiltInType.Boolean => typeof(bool),
        BuiltInType.SByte => typeof(sbyte),
        BuiltInType.Byte => typeof(byte),
        BuiltInType.Int16 => typeof(short),
        BuiltInType.UInt16 => typeof(ushort),
        BuiltInType.Int32 => typeof(int),
        BuiltInType.UInt32 => typeof(uint),
        BuiltInType.Int64 => typeof(long),
        BuiltInType.UInt64 => typeof(ulong),
        BuiltInType.Float => typeof(float),
        BuiltInType.Double => typeof(double),
        BuiltInType.String => typeof(string),
        BuiltInType.DateTime => typeof(DateTime),
        BuiltInType.Guid => typeof(Guid),
        BuiltInType.ByteString => typeof(byte[]),
        BuiltInType.XmlElement => typeof(XmlElement),
        BuiltInType.NodeId => typeof(NodeId),
        BuiltInType.ExpandedNodeId => typeof(ExpandedNodeId),
        BuiltInType.StatusCode => typeof(StatusCode),
        BuiltInType.QualifiedName => typeof(QualifiedName),
        BuiltInType.LocalizedText => typeof(LocalizedText),
        BuiltInType.ExtensionObject => typeof(ExtensionObject),
        BuiltInType.DataValue => typeof(DataValue),
        BuiltInType.Variant => typeof(Variant),
        BuiltInType.DiagnosticInfo => typeof(DiagnosticInfo),
        _ => typeof(object),
    };

    /// <summary>The number of elements dimensions describe; -1 when one is negative, saturated above Int32.MaxValue.</summary>
    public static long ElementCount(IReadOnlyList<int> dimensions)
    {
        long product = 1;
        foreach (int d in dimensions)
        {
            if (d < 0)
            {
                return -1;
            }

            product = Math.Min(product * d, int.MaxValue + 1L);
        }

        return product;
    }
}
