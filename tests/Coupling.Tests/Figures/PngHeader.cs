using System.Buffers.Binary;
using System.Text;

namespace Coupling.Tests.Figures;

/// <summary>
/// Reads the size of a PNG file from its header, checking the structure on the way: the 8-byte signature, the
/// IHDR chunk first with length 13 and a correct CRC, and an IEND chunk last. Per the PNG specification
/// (ISO/IEC 15948:2004; W3C PNG 2nd ed.), sections 5.2 (signature), 5.3 (chunk layout), 11.2.2 (IHDR) and
/// Annex D (CRC-32, polynomial 0xEDB88320 reflected).
/// </summary>
internal static class PngHeader
{
    private static readonly byte[] Signature = [0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A];

    public static (int Width, int Height) Read(string path)
    {
        byte[] bytes = File.ReadAllBytes(path);
        if (bytes.Length < 8 + 25 + 12) throw new InvalidDataException("too short for a PNG");
        if (!bytes.AsSpan(0, 8).SequenceEqual(Signature)) throw new InvalidDataException("no PNG signature");
        uint length = BinaryPrimitives.ReadUInt32BigEndian(bytes.AsSpan(8, 4));
        string type = Encoding.ASCII.GetString(bytes, 12, 4);
        if (type != "IHDR" || length != 13) throw new InvalidDataException($"first chunk is {type} of {length} bytes, expected IHDR of 13");
        uint crc = BinaryPrimitives.ReadUInt32BigEndian(bytes.AsSpan(16 + 13, 4));
        if (crc != Crc32(bytes.AsSpan(12, 4 + 13))) throw new InvalidDataException("IHDR CRC mismatch");
        var end = bytes.AsSpan(bytes.Length - 12);
        if (BinaryPrimitives.ReadUInt32BigEndian(end) != 0 || Encoding.ASCII.GetString(end.Slice(4, 4)) != "IEND")
            throw new InvalidDataException("file does not end with IEND");
        int width = (int)BinaryPrimitives.ReadUInt32BigEndian(bytes.AsSpan(16, 4));
        int height = (int)BinaryPrimitives.ReadUInt32BigEndian(bytes.AsSpan(20, 4));
        return (width, height);
    }

    /// <summary>CRC-32 exactly as the sample code of PNG Annex D, bit by bit.</summary>
    public static uint Crc32(ReadOnlySpan<byte> data)
    {
        uint c = 0xFFFFFFFFu;
        foreach (byte b in data)
        {
            c ^= b;
            for (int k = 0; k < 8; k++) c = (c & 1) != 0 ? 0xEDB88320u ^ (c >> 1) : c >> 1;
        }
        return c ^ 0xFFFFFFFFu;
    }
}
