using System.Buffers.Binary;
using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;

namespace Coupling.Formats;

/// <summary>
/// An n-dimensional array read from or written to a NumPy .npy file, held as doubles in C (row-major) order.
/// </summary>
/// <remarks>
/// Format per the NumPy .npy specification (NEP 1, "A simple file format for NumPy arrays", and the
/// numpy.lib.format documentation): magic bytes \x93NUMPY, a major and minor version byte (1.0, 2.0 or 3.0), a
/// little-endian header length (2 bytes in 1.0, 4 bytes in 2.0 and 3.0), then a Python dict literal with keys
/// 'descr', 'fortran_order' and 'shape', padded with spaces and a newline; the data follow.
/// Readable dtypes: '&lt;f8', '&lt;f4', '&lt;i2', '&lt;i4', '&lt;i8' (little-endian), C or Fortran order.
/// </remarks>
public sealed partial class NpyArray
{
    private static readonly byte[] Magic = [0x93, (byte)'N', (byte)'U', (byte)'M', (byte)'P', (byte)'Y'];

    /// <summary>Creates an array; <paramref name="values"/> holds the product of <paramref name="shape"/> values in C order.</summary>
    public NpyArray(IReadOnlyList<int> shape, double[] values)
    {
        long count = 1;
        foreach (int d in shape)
        {
            ArgumentOutOfRangeException.ThrowIfNegative(d, nameof(shape));
            count *= d;
        }
        if (count != values.Length)
            throw new ArgumentException($"Shape ({string.Join(", ", shape)}) holds {count} values, but {values.Length} were given.", nameof(values));
        Shape = shape.ToArray();
        Values = values;
    }

    /// <summary>The array's dimensions, outermost first (e.g. trials, channels, samples).</summary>
    public IReadOnlyList<int> Shape { get; }

    /// <summary>The values in C order: the last index varies fastest.</summary>
    public double[] Values { get; }

    /// <summary>Reads a .npy file, converting the values to double and Fortran-ordered data to C order.</summary>
    /// <param name="path">The .npy file.</param>
    /// <returns>The array.</returns>
    /// <exception cref="InputException">Wrong magic, unsupported version or dtype, malformed header, truncated data,
    /// or a NaN or infinite value (its index named) unless <paramref name="allowNonFinite"/>.</exception>
    /// <param name="allowNonFinite">Keep NaN and infinite values instead of refusing them, for a caller that leaves them out later.</param>
    public static NpyArray Read(string path, bool allowNonFinite = false)
    {
        var bytes = ReadBytes(path);
        var (shape, dtype, fortran, dataStart) = ParseHeader(path, bytes);
        int itemSize = ItemSize(dtype);
        long count = 1;
        foreach (int d in shape) count *= d;
        long dataBytes = count * itemSize;
        var data = bytes.AsSpan(dataStart, (int)dataBytes);
        var raw = new double[count];
        for (int i = 0; i < count; i++)
        {
            var item = data.Slice(i * itemSize, itemSize);
            raw[i] = dtype switch
            {
                "<f8" => BinaryPrimitives.ReadDoubleLittleEndian(item),
                "<f4" => BinaryPrimitives.ReadSingleLittleEndian(item),
                "<i2" => BinaryPrimitives.ReadInt16LittleEndian(item),
                "<i4" => BinaryPrimitives.ReadInt32LittleEndian(item),
                _ => BinaryPrimitives.ReadInt64LittleEndian(item),
            };
        }
        var values = fortran && shape.Count > 1 ? FortranToC(raw, shape) : raw;
        for (int i = 0; i < values.Length && !allowNonFinite; i++)
            if (!double.IsFinite(values[i]))
                throw new InputException($"{path}: value at index ({string.Join(", ", Unravel(i, shape))}) is {SampleText.NonFinite(values[i])}; samples must be finite numbers (the last index is the sample, the one before it the channel).");
        return new NpyArray(shape, values);
    }

    /// <summary>The shape, dtype and order of a .npy file, checked against its length, without converting the values.</summary>
    /// <param name="path">The .npy file.</param>
    /// <returns>Dimensions (outermost first), the dtype text (e.g. '&lt;f8') and whether the data are in Fortran order.</returns>
    /// <exception cref="InputException">Wrong magic, unsupported version or dtype, malformed header or truncated data.</exception>
    public static (IReadOnlyList<int> Shape, string DataType, bool FortranOrder) ReadHeader(string path)
    {
        var (shape, dtype, fortran, _) = ParseHeader(path, ReadBytes(path));
        return (shape, dtype, fortran);
    }

    private static byte[] ReadBytes(string path)
    {
        try
        {
            return File.ReadAllBytes(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw FileErrors.Reading(path, ".npy file", e);
        }
    }

    private static int ItemSize(string dtype) => dtype switch { "<f8" or "<i8" => 8, "<f4" or "<i4" => 4, _ => 2 };

    private static (List<int> Shape, string DataType, bool Fortran, int DataStart) ParseHeader(string path, byte[] bytes)
    {
        if (bytes.Length < 10 || !bytes.AsSpan(0, 6).SequenceEqual(Magic))
            throw new InputException($"{path}: not a .npy file (expected the magic bytes \\x93NUMPY at byte 0).");
        int major = bytes[6];
        int headerLength, dataStart;
        if (major == 1)
        {
            headerLength = BinaryPrimitives.ReadUInt16LittleEndian(bytes.AsSpan(8, 2));
            dataStart = 10 + headerLength;
        }
        else if (major is 2 or 3)
        {
            if (bytes.Length < 12) throw new InputException($"{path}: truncated .npy header.");
            uint len = BinaryPrimitives.ReadUInt32LittleEndian(bytes.AsSpan(8, 4));
            if (len > int.MaxValue - 12) throw new InputException($"{path}: header length {len} at byte 8 is too large.");
            headerLength = (int)len;
            dataStart = 12 + headerLength;
        }
        else
            throw new InputException($"{path}: .npy version {major}.{bytes[7]} at byte 6; expected 1.0, 2.0 or 3.0.");
        if (bytes.Length < dataStart)
            throw new InputException($"{path}: truncated .npy file: the header says {headerLength} header bytes but the file has {bytes.Length} bytes.");
        var headerBytes = bytes.AsSpan(dataStart - headerLength, headerLength);
        string header = major == 3 ? Encoding.UTF8.GetString(headerBytes) : Encoding.Latin1.GetString(headerBytes);

        var descr = DescrPattern().Match(header);
        var order = OrderPattern().Match(header);
        var shapeMatch = ShapePattern().Match(header);
        if (!descr.Success || !order.Success || !shapeMatch.Success)
            throw new InputException($"{path}: .npy header '{header.Trim()}' lacks 'descr', 'fortran_order' or 'shape'.");
        string dtype = descr.Groups[1].Value;
        int itemSize = dtype switch
        {
            "<f8" or "<i8" => 8,
            "<f4" or "<i4" => 4,
            "<i2" => 2,
            _ => throw new InputException($"{path}: .npy dtype '{dtype}' is not supported; expected '<f8', '<f4', '<i2', '<i4' or '<i8'."),
        };
        bool fortran = order.Groups[1].Value == "True";
        var shape = new List<int>();
        foreach (var part in shapeMatch.Groups[1].Value.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
        {
            if (!int.TryParse(part, NumberStyles.None, CultureInfo.InvariantCulture, out int d))
                throw new InputException($"{path}: .npy shape ({shapeMatch.Groups[1].Value}) holds '{part}'; expected non-negative integers.");
            shape.Add(d);
        }
        long count = 1;
        foreach (int d in shape) count = Math.Min(count * d, (long)Array.MaxLength + 1); // no overflow however many dimensions
        if (count > Array.MaxLength)
            throw new InputException($"{path}: .npy array of {count} values is too large.");
        long dataBytes = count * itemSize;
        if (bytes.Length - dataStart < dataBytes)
            throw new InputException($"{path}: truncated .npy file: shape ({string.Join(", ", shape)}) of '{dtype}' needs {dataBytes} data bytes, the file holds {bytes.Length - dataStart}.");

        return (shape, dtype, fortran, dataStart);
    }

    /// <summary>Writes the array as a version 1.0 .npy file of little-endian doubles ('&lt;f8') in C order,
    /// atomically (to <c>path + ".tmp"</c>, then renamed), with the header padded so the data start at a multiple of 64 bytes.</summary>
    /// <param name="path">The file to create or replace.</param>
    /// <param name="shape">Dimensions, outermost first.</param>
    /// <param name="values">Values in C order; their count must equal the product of <paramref name="shape"/>.</param>
    public static void Write(string path, IReadOnlyList<int> shape, double[] values)
    {
        var array = new NpyArray(shape, values);
        string dims = shape.Count == 1 ? $"{shape[0]}," : string.Join(", ", array.Shape);
        string dict = "{'descr': '<f8', 'fortran_order': False, 'shape': (" + dims + "), }";
        int total = 10 + dict.Length + 1;
        int padded = (total + 63) / 64 * 64;
        string header = dict + new string(' ', padded - total) + "\n";
        if (header.Length > ushort.MaxValue) throw new ArgumentException("Shape too long for a version 1.0 header.", nameof(shape));
        var bytes = new byte[10 + header.Length + 8L * values.Length];
        Magic.CopyTo(bytes, 0);
        bytes[6] = 1;
        bytes[7] = 0;
        BinaryPrimitives.WriteUInt16LittleEndian(bytes.AsSpan(8, 2), (ushort)header.Length);
        Encoding.Latin1.GetBytes(header).CopyTo(bytes, 10);
        int start = 10 + header.Length;
        for (int i = 0; i < values.Length; i++)
            BinaryPrimitives.WriteDoubleLittleEndian(bytes.AsSpan(start + 8 * i, 8), values[i]);
        string tmp = path + ".tmp";
        try
        {
            File.WriteAllBytes(tmp, bytes);
            File.Move(tmp, path, overwrite: true);
        }
        catch
        {
            try { File.Delete(tmp); } catch (IOException) { }
            throw;
        }
    }

    private static double[] FortranToC(double[] raw, IReadOnlyList<int> shape)
    {
        int n = shape.Count;
        var fStride = new long[n];
        fStride[0] = 1;
        for (int k = 1; k < n; k++) fStride[k] = fStride[k - 1] * shape[k - 1];
        var index = new int[n];
        var result = new double[raw.Length];
        long f = 0;
        for (int i = 0; i < result.Length; i++)
        {
            result[i] = raw[f];
            // Advance the C-order multi-index (last axis fastest), keeping the Fortran offset in step.
            for (int k = n - 1; k >= 0; k--)
            {
                index[k]++;
                f += fStride[k];
                if (index[k] < shape[k]) break;
                f -= fStride[k] * index[k];
                index[k] = 0;
            }
        }
        return result;
    }

    private static int[] Unravel(long flat, IReadOnlyList<int> shape)
    {
        var index = new int[shape.Count];
        for (int k = shape.Count - 1; k >= 0; k--)
        {
            index[k] = (int)(flat % shape[k]);
            flat /= shape[k];
        }
        return index;
    }

    [GeneratedRegex(@"'descr'\s*:\s*'([^']*)'")]
    private static partial Regex DescrPattern();

    [GeneratedRegex(@"'fortran_order'\s*:\s*(True|False)")]
    private static partial Regex OrderPattern();

    [GeneratedRegex(@"'shape'\s*:\s*\(([^)]*)\)")]
    private static partial Regex ShapePattern();
}
