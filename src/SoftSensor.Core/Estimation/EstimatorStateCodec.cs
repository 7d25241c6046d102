using System.Buffers.Binary;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// A versioned little-endian binary layout of <see cref="EstimatorState"/>: magic "SSES", layout
/// version, the scalars, the batch's initial conditions (version 2; version 1 states, which have
/// none, still read), the filtered inorganic carbon of the CER correction (version 3, in a slot
/// reserved before), then the history ring (oldest first), then the pathway stage's energy
/// parameters and its statistic window (version 4). Doubles are stored bit for bit, so a
/// resumed run continues exactly where the saved one stopped. The caller does the file I/O.
/// </summary>
public static class EstimatorStateCodec
{
    /// <summary>Layout version written by this code.</summary>
    public const ushort Version = 4;

    private const uint Magic = 0x53455353; // "SSES" read little-endian
    private const int HeaderBytes = 4 + 2 + 1 + (8 * 3) + (8 * 6) + (8 * 7) + 8 + 4 + 4;
    private const int InitialBytes = 1 + (8 * 4);
    private const int EntryBytes = 8 + (8 * 7) + (8 * 7);
    private const int PathwayBytes = 1 + (8 * 4) + (4 * 3) + (Flux.PathwayState.WindowCapacity * (8 + 4));

    /// <summary>Bytes needed for <paramref name="state"/>.</summary>
    public static int SizeOf(EstimatorState state) => HeaderBytes + InitialBytes + (state.History.Count * EntryBytes) + PathwayBytes;

    /// <summary>Writes <paramref name="state"/> into a new array.</summary>
    public static byte[] Encode(EstimatorState state)
    {
        var bytes = new byte[SizeOf(state)];
        var w = new SpanWriter(bytes);
        w.U32(Magic);
        w.U16(Version);
        w.Byte(state.Initialised ? (byte)1 : (byte)0);
        w.I64(state.TimeTicks);
        w.I64(state.Cycles);
        w.I64(state.OfflineSamplesApplied);
        w.F64(state.VolumeL);
        w.F64(state.RemovedTotalL);
        w.F64(state.PendingRemovalL);
        w.F64(state.MuSmoothedPerH);
        w.F64(state.SubstrateG);
        w.F64(state.SubstrateFedG);
        w.States(state.Observers);
        w.F64(state.TicMmolPerL); // version 3; reserved (0) before
        w.I32(state.History.Capacity);
        w.I32(state.History.Count);
        var initial = state.Initial.GetValueOrDefault();
        w.Byte(state.Initial is null ? (byte)0 : (byte)1);
        w.F64(initial.VolumeL);
        w.F64(initial.BiomassGPerL);
        w.F64(initial.BiomassSigmaGPerL);
        w.F64(initial.SubstrateGPerL);
        for (int i = 0; i < state.History.Count; i++)
        {
            ref var e = ref state.History[i];
            w.I64(e.TimeTicks);
            w.Inputs(e.Inputs);
            w.States(e.States);
        }

        var p = state.Pathway;
        w.Byte(p.Initialised ? (byte)1 : (byte)0);
        w.F64(p.PoRatio);
        w.F64(p.PoVariance);
        w.F64(p.MaintenanceAtp);
        w.F64(p.MaintenanceVariance);
        w.I32(p.GatedCycles);
        w.I32(p.Next);
        w.I32(p.Filled);
        for (int i = 0; i < Flux.PathwayState.WindowCapacity; i++)
        {
            w.F64(p.Innovations[i]);
            w.I32(p.InnovationDof[i]);
        }

        return bytes;
    }

    /// <summary>Reads a state; false with a reason when the bytes are not a state of this layout.</summary>
    public static bool TryDecode(ReadOnlySpan<byte> bytes, out EstimatorState? state, out string? error)
    {
        state = null;
        if (bytes.Length < HeaderBytes)
        {
            error = $"state is {bytes.Length} bytes; expected at least {HeaderBytes}";
            return false;
        }

        var r = new SpanReader(bytes);
        uint magic = r.U32();
        ushort version = r.U16();
        if (magic != Magic || version is < 1 or > Version)
        {
            error = $"state has magic 0x{magic:X8} version {version}; expected 0x{Magic:X8} version 1 to {Version}";
            return false;
        }

        bool initialised = r.Byte() == 1;
        long time = r.I64(), cycles = r.I64(), samples = r.I64();
        double volume = r.F64(), removed = r.F64(), pending = r.F64(), mu = r.F64(), substrate = r.F64(), fed = r.F64();
        var observers = r.States();
        double tic = r.F64();
        int capacity = r.I32(), count = r.I32();
        int initialBytes = version >= 2 ? InitialBytes : 0;
        int pathwayBytes = version >= 4 ? PathwayBytes : 0;
        if (capacity < 2 || count < 0 || count > capacity || bytes.Length != HeaderBytes + initialBytes + ((long)count * EntryBytes) + pathwayBytes)
        {
            error = $"state history has capacity {capacity}, count {count} in {bytes.Length} bytes; the layout does not add up";
            return false;
        }

        var s = new EstimatorState(capacity)
        {
            Initialised = initialised, TimeTicks = time, Cycles = cycles, OfflineSamplesApplied = samples,
            VolumeL = volume, RemovedTotalL = removed, PendingRemovalL = pending, MuSmoothedPerH = mu,
            SubstrateG = substrate, SubstrateFedG = fed, Observers = observers,
            TicMmolPerL = version >= 3 ? tic : double.NaN,
        };
        if (version >= 2)
        {
            bool hasInitial = r.Byte() == 1;
            var initial = new BatchInitialConditions(r.F64(), r.F64(), r.F64(), r.F64());
            s.Initial = hasInitial ? initial : null;
        }

        for (int i = 0; i < count; i++)
        {
            var e = new HistoryEntry { TimeTicks = r.I64(), Inputs = r.Inputs(), States = r.States() };
            s.History.Push(e);
        }

        if (version >= 4)
        {
            var p = s.Pathway;
            p.Initialised = r.Byte() == 1;
            p.PoRatio = r.F64();
            p.PoVariance = r.F64();
            p.MaintenanceAtp = r.F64();
            p.MaintenanceVariance = r.F64();
            p.GatedCycles = r.I32();
            p.Next = r.I32();
            p.Filled = r.I32();
            for (int i = 0; i < Flux.PathwayState.WindowCapacity; i++)
            {
                p.Innovations[i] = r.F64();
                p.InnovationDof[i] = r.I32();
            }

            if (p.Next is < 0 or >= Flux.PathwayState.WindowCapacity || p.Filled is < 0 or > Flux.PathwayState.WindowCapacity)
            {
                error = $"state pathway window has next {p.Next}, filled {p.Filled}; expected 0 to {Flux.PathwayState.WindowCapacity}";
                return false;
            }
        }

        state = s;
        error = null;
        return true;
    }

    private ref struct SpanWriter(Span<byte> span)
    {
        private readonly Span<byte> _span = span;
        private int _at;

        public void Byte(byte v) => _span[_at++] = v;
        public void U16(ushort v) { BinaryPrimitives.WriteUInt16LittleEndian(_span[_at..], v); _at += 2; }
        public void U32(uint v) { BinaryPrimitives.WriteUInt32LittleEndian(_span[_at..], v); _at += 4; }
        public void I32(int v) { BinaryPrimitives.WriteInt32LittleEndian(_span[_at..], v); _at += 4; }
        public void I64(long v) { BinaryPrimitives.WriteInt64LittleEndian(_span[_at..], v); _at += 8; }
        public void F64(double v) { BinaryPrimitives.WriteDoubleLittleEndian(_span[_at..], v); _at += 8; }

        public void Inputs(in ObserverInputs u)
        {
            F64(u.DtH); F64(u.GrowthGPerLh); F64(u.GrowthSigmaGPerLh); F64(u.VolumeL);
            F64(u.RemovedFraction); F64(u.OurMmolPerLh); F64(u.OurSigmaMmolPerLh);
        }

        public void States(in ObserverStates s)
        {
            F64(s.BiomassG); F64(s.BiomassVarG2); F64(s.EkfBiomassG); F64(s.EkfMuPerH);
            F64(s.EkfP00); F64(s.EkfP01); F64(s.EkfP11);
        }
    }

    private ref struct SpanReader(ReadOnlySpan<byte> span)
    {
        private readonly ReadOnlySpan<byte> _span = span;
        private int _at;

        public byte Byte() => _span[_at++];
        public ushort U16() { var v = BinaryPrimitives.ReadUInt16LittleEndian(_span[_at..]); _at += 2; return v; }
        public uint U32() { var v = BinaryPrimitives.ReadUInt32LittleEndian(_span[_at..]); _at += 4; return v; }
        public int I32() { var v = BinaryPrimitives.ReadInt32LittleEndian(_span[_at..]); _at += 4; return v; }
        public long I64() { var v = BinaryPrimitives.ReadInt64LittleEndian(_span[_at..]); _at += 8; return v; }
        public double F64() { var v = BinaryPrimitives.ReadDoubleLittleEndian(_span[_at..]); _at += 8; return v; }

        public ObserverInputs Inputs() => new()
        {
            DtH = F64(), GrowthGPerLh = F64(), GrowthSigmaGPerLh = F64(), VolumeL = F64(),
            RemovedFraction = F64(), OurMmolPerLh = F64(), OurSigmaMmolPerLh = F64(),
        };

        public ObserverStates States() => new()
        {
            BiomassG = F64(), BiomassVarG2 = F64(), EkfBiomassG = F64(), EkfMuPerH = F64(),
            EkfP00 = F64(), EkfP01 = F64(), EkfP11 = F64(),
        };
    }
}
