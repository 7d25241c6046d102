using System.Buffers.Binary;
using System.Text;

namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// Reads the primitive UA Binary encodings of Part 6 §5.2.2 (the mirror of
/// <see cref="UaBinaryWriter"/>). Every read checks the remaining length and the
/// <see cref="DecodeLimits"/>; bad input raises <see cref="UaDecodeException"/> and nothing else.
/// </summary>
public sealed class UaBinaryReader
{
    private static readonly UTF8Encoding StrictUtf8 = new(encoderShouldEmitUTF8Identifier: false, throwOnInvalidBytes: true);
    private readonly ReadOnlyMemory<byte> data;
    private int position;
    private int depth;

    public UaBinaryReader(ReadOnlyMemory<byte> data, DecodeLimits? limits = null)
    {
        this.data = data;
        Limits = limits ?? DecodeLimits.Default;
    }

    /// <summary>The limits in force.</summary>
    public DecodeLimits Limits { get; }

    /// <summary>Offset of the next byte to read.</summary>
    public int Position => position;

    /// <summary>Bytes left to read.</summary>
    public int Remaining => data.Length - position;

    public bool ReadBoolean() => ReadByte() != 0;

    public byte ReadByte() => Take(1)[0];

    public sbyte ReadSByte() => unchecked((sbyte)Take(1)[0]);

    public short ReadInt16() => BinaryPrimitives.ReadInt16LittleEndian(Take(2));

    public ushort ReadUInt16() => BinaryPrimitives.ReadUInt16LittleEndian(Take(2));

    public int ReadInt32() => BinaryPrimitives.ReadInt32LittleEndian(Take(4));

    public uint ReadUInt32() => BinaryPrimitives.ReadUInt32LittleEndian(Take(4));

    public long ReadInt64() => BinaryPrimitives.ReadInt64LittleEndian(Take(8));

    public ulong ReadUInt64() => BinaryPrimitives.ReadUInt64LittleEndian(Take(8));

    public float ReadFloat() => BinaryPrimitives.ReadSingleLittleEndian(Take(4));

    public double ReadDouble() => BinaryPrimitives.ReadDoubleLittleEndian(Take(8));

    public DateTime ReadDateTime() => UaDateTime.FromTicks(ReadInt64());

    public Guid ReadGuid() => new(Take(16));

    /// <summary>A UTF-8 String; length -1 gives null (Part 6 §5.2.2.4).</summary>
    public string? ReadString()
    {
        int count = ReadLength(Limits.MaxStringLengthBytes, "String");
        if (count < 0)
        {
            return null;
        }

        var bytes = Take(count);
        try
        {
            return StrictUtf8.GetString(bytes);
        }
        catch (DecoderFallbackException e)
        {
            throw new UaDecodeException($"String at offset {position - count} is not valid UTF-8.", e);
        }
    }

    /// <summary>A ByteString; length -1 gives null (Part 6 §5.2.2.7).</summary>
    public byte[]? ReadByteString()
    {
        int count = ReadLength(Limits.MaxStringLengthBytes, "ByteString");
        return count < 0 ? null : Take(count).ToArray();
    }

    /// <summary>Raw bytes with no length prefix.</summary>
    public ReadOnlyMemory<byte> ReadRaw(int count)
    {
        if (count < 0 || count > Remaining)
        {
            throw new UaDecodeException($"Need {count} bytes at offset {position}, {Remaining} left.");
        }

        var slice = data.Slice(position, count);
        position += count;
        return slice;
    }

    /// <summary>An array: Int32 count (-1 null, given back as null) then the elements.</summary>
    public T[]? ReadArray<T>(Func<UaBinaryReader, T> readItem)
    {
        int count = ReadLength(Limits.MaxArrayLength, "array");
        if (count < 0)
        {
            return null;
        }

        // Every element takes at least one byte: a count beyond the bytes left is a corrupt frame.
        if (count > Remaining)
        {
            throw new UaDecodeException($"Array of {count} elements at offset {position} exceeds the {Remaining} bytes left.");
        }

        var items = new T[count];
        for (int i = 0; i < count; i++)
        {
            items[i] = readItem(this);
        }

        return items;
    }

    /// <summary>An array given back empty when null, for fields where null and empty mean the same.</summary>
    public T[] ReadArrayOrEmpty<T>(Func<UaBinaryReader, T> readItem) => ReadArray(readItem) ?? [];

    /// <summary>Enters a nested structure (Variant in Variant, DiagnosticInfo inner info); throws past the depth limit.</summary>
    public void EnterNested()
    {
        depth++;
        if (depth > Limits.MaxNestingDepth)
        {
            throw new UaDecodeException($"Nesting deeper than {Limits.MaxNestingDepth} levels at offset {position}.");
        }
    }

    /// <summary>Leaves a nested structure.</summary>
    public void LeaveNested() => depth--;

    /// <summary>Reads an Int32 length: -1 (or any negative, Part 6 §5.2.2.4) is null; above the limit throws.</summary>
    private int ReadLength(int limit, string what)
    {
        int count = ReadInt32();
        if (count < 0)
        {
            return -1;
        }

        if (count > limit)
        {
            throw new UaDecodeException($"{what} length {count} at offset {position - 4} exceeds the limit {limit}.");
        }

        return count;
    }

    private ReadOnlySpan<byte> Take(int count)
    {
        if (count > Remaining)
        {
            throw new UaDecodeException($"Message truncated: need {count} bytes at offset {position}, {Remaining} left.");
        }

        var span = data.Span.Slice(position, count);
        position += count;
        return span;
    }
}
