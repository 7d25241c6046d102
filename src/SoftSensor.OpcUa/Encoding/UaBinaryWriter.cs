using System.Buffers.Binary;

namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// Writes the primitive UA Binary encodings of Part 6 §5.2.2: little-endian integers and IEEE 754
/// floats, Boolean as one byte, String and ByteString as an Int32 length (-1 for null) followed by
/// the bytes, DateTime as Int64 100 ns ticks since 1601-01-01 UTC, Guid as Data1 (UInt32), Data2,
/// Data3 (UInt16) little-endian and Data4 as eight bytes, arrays as an Int32 count then the elements.
/// </summary>
public sealed class UaBinaryWriter
{
    private byte[] buffer;
    private int length;

    public UaBinaryWriter(int initialCapacity = 256) => buffer = new byte[Math.Max(16, initialCapacity)];

    /// <summary>Number of bytes written so far.</summary>
    public int Length => length;

    /// <summary>The bytes written so far.</summary>
    public ReadOnlySpan<byte> WrittenSpan => buffer.AsSpan(0, length);

    /// <summary>A copy of the bytes written so far.</summary>
    public byte[] ToArray() => WrittenSpan.ToArray();

    public void WriteBoolean(bool value) => WriteByte(value ? (byte)1 : (byte)0);

    public void WriteByte(byte value) => Take(1)[0] = value;

    public void WriteSByte(sbyte value) => Take(1)[0] = unchecked((byte)value);

    public void WriteInt16(short value) => BinaryPrimitives.WriteInt16LittleEndian(Take(2), value);

    public void WriteUInt16(ushort value) => BinaryPrimitives.WriteUInt16LittleEndian(Take(2), value);

    public void WriteInt32(int value) => BinaryPrimitives.WriteInt32LittleEndian(Take(4), value);

    public void WriteUInt32(uint value) => BinaryPrimitives.WriteUInt32LittleEndian(Take(4), value);

    public void WriteInt64(long value) => BinaryPrimitives.WriteInt64LittleEndian(Take(8), value);

    public void WriteUInt64(ulong value) => BinaryPrimitives.WriteUInt64LittleEndian(Take(8), value);

    public void WriteFloat(float value) => BinaryPrimitives.WriteSingleLittleEndian(Take(4), value);

    public void WriteDouble(double value) => BinaryPrimitives.WriteDoubleLittleEndian(Take(8), value);

    /// <summary>A UTF-8 string with an Int32 byte count; null as length -1 (Part 6 §5.2.2.4).</summary>
    public void WriteString(string? value)
    {
        if (value is null)
        {
            WriteInt32(-1);
            return;
        }

        int count = System.Text.Encoding.UTF8.GetByteCount(value);
        WriteInt32(count);
        System.Text.Encoding.UTF8.GetBytes(value, Take(count));
    }

    /// <summary>A ByteString: Int32 length then the bytes; null as -1 (Part 6 §5.2.2.7).</summary>
    public void WriteByteString(ReadOnlySpan<byte> value, bool isNull = false)
    {
        if (isNull)
        {
            WriteInt32(-1);
            return;
        }

        WriteInt32(value.Length);
        value.CopyTo(Take(value.Length));
    }

    /// <summary>A ByteString from an array; a null array is written as length -1.</summary>
    public void WriteByteString(byte[]? value) => WriteByteString(value, value is null);

    /// <summary>Raw bytes with no length prefix.</summary>
    public void WriteRaw(ReadOnlySpan<byte> value) => value.CopyTo(Take(value.Length));

    /// <summary>DateTime per Part 6 §5.2.2.5 (see <see cref="UaDateTime"/>).</summary>
    public void WriteDateTime(DateTime value) => WriteInt64(UaDateTime.ToTicks(value));

    /// <summary>Guid per Part 6 §5.2.2.6: same layout as .NET's little-endian byte form.</summary>
    public void WriteGuid(Guid value) => value.TryWriteBytes(Take(16));

    /// <summary>An array: Int32 count (-1 for null) then each element.</summary>
    public void WriteArray<T>(IReadOnlyList<T>? items, Action<UaBinaryWriter, T> writeItem)
    {
        if (items is null)
        {
            WriteInt32(-1);
            return;
        }

        WriteInt32(items.Count);
        for (int i = 0; i < items.Count; i++)
        {
            writeItem(this, items[i]);
        }
    }

    /// <summary>Overwrites a UInt32 already written at <paramref name="offset"/> (message sizes).</summary>
    public void PatchUInt32(int offset, uint value) => BinaryPrimitives.WriteUInt32LittleEndian(buffer.AsSpan(offset, 4), value);

    private Span<byte> Take(int count)
    {
        if (length + count > buffer.Length)
        {
            Array.Resize(ref buffer, Math.Max(buffer.Length * 2, length + count));
        }

        var span = buffer.AsSpan(length, count);
        length += count;
        return span;
    }
}
