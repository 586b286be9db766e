using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics.X86;

namespace Coupling.Measures;

/// <summary>
/// A zero-filled array of doubles whose first element sits on a 64-byte boundary (one cache line), so that the
/// vector loads of the pairwise kernels never straddle two lines. Allocated on the pinned heap, so it never moves.
/// </summary>
internal sealed class AlignedArray
{
    private const int LineBytes = 64;

    public AlignedArray(long length)
    {
        Length = length;
        _data = GC.AllocateArray<double>(checked((int)(length + LineBytes / sizeof(double))), pinned: true);
        long address = Marshal.UnsafeAddrOfPinnedArrayElement(_data, 0).ToInt64();
        _offset = (int)(((LineBytes - (address & (LineBytes - 1))) & (LineBytes - 1)) / sizeof(double));
    }

    private readonly double[] _data;
    private readonly int _offset;

    /// <summary>Number of usable elements.</summary>
    public long Length { get; }

    /// <summary>Element <paramref name="index"/> (bounds-checked against the underlying array).</summary>
    public ref double this[long index] => ref _data[checked((int)(_offset + index))];

    /// <summary>Reference to element 0.</summary>
    public ref double Start => ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(_data), _offset);

    /// <summary>The usable elements from <paramref name="start"/> on, <paramref name="length"/> long.</summary>
    public Span<double> Slice(long start, int length) => _data.AsSpan(checked((int)(_offset + start)), length);

    /// <summary>
    /// Asks the processor to bring elements <paramref name="start"/> to <paramref name="start"/> + <paramref name="length"/>
    /// into its second-level cache, one prefetch per 64-byte line. Only a hint: it changes no value, and it does nothing
    /// on processors without the instruction. The kernels read rows of a time point in the order of a random trial
    /// permutation, which the hardware prefetchers cannot predict; asking for the next time point's rows while the
    /// current one is computed keeps those reads from waiting on main memory.
    /// </summary>
    public unsafe void Prefetch(long start, long length)
    {
        if (!Sse.IsSupported || length <= 0) return;
        if (start < 0 || start + length > Length) throw new ArgumentOutOfRangeException(nameof(start));
        // The array is pinned, so the address stays valid.
        double* first = (double*)Unsafe.AsPointer(ref Start) + start;
        for (long i = 0; i < length; i += LineBytes / sizeof(double)) Sse.Prefetch1(first + i);
    }

    /// <summary>Sets every element to zero.</summary>
    public void Clear() => Array.Clear(_data);
}
