using System.Text.Json;
using Coupling.Formats;

namespace Coupling.Tests.Formats;

public class NpyArrayTests
{
    // Fixtures written by numpy 1.24.2 (Debian python3-numpy) with np.save / np.lib.format.write_array;
    // see Fixtures/Formats/README.md. The .npy layout is NEP 1 / numpy.lib.format.
    public static TheoryData<string> Cases() => new() { "f8_c", "f8_fortran", "f4_c", "f4_fortran", "i2_c", "i4_fortran", "i8_c", "f8_1d", "f8_v2" };

    [Theory]
    [MemberData(nameof(Cases))]
    public void Numpy_written_file_reads_to_the_same_shape_and_C_order_values(string name)
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(Fixtures.Path("npy_expected.json")));
        var expected = doc.RootElement.GetProperty(name);
        var array = NpyArray.Read(Fixtures.Path($"npy_{name}.npy"));
        Assert.Equal(expected.GetProperty("shape").EnumerateArray().Select(e => e.GetInt32()), array.Shape);
        // Every dtype here converts to double exactly (float32 and the integers are subsets of double),
        // so the values must be equal, not merely close.
        Assert.Equal(expected.GetProperty("values").EnumerateArray().Select(e => e.GetDouble()), array.Values);
    }

    [Fact]
    public void Fortran_fixture_really_is_stored_in_Fortran_order()
    {
        // Guards the test above: the file bytes differ from the C-order file of the same array.
        var c = File.ReadAllBytes(Fixtures.Path("npy_f8_c.npy"));
        var f = File.ReadAllBytes(Fixtures.Path("npy_f8_fortran.npy"));
        Assert.NotEqual(c[128..], f[128..]);
        Assert.Equal(NpyArray.Read(Fixtures.Path("npy_f8_c.npy")).Values, NpyArray.Read(Fixtures.Path("npy_f8_fortran.npy")).Values);
    }

    [Fact]
    public void Written_file_reads_back_and_starts_its_data_on_a_64_byte_boundary()
    {
        using var tmp = new TempFolder();
        string path = tmp.File("a.npy");
        var values = Enumerable.Range(0, 30).Select(i => Math.Sqrt(i) - 2.5).ToArray();
        NpyArray.Write(path, [2, 3, 5], values);
        var back = NpyArray.Read(path);
        Assert.Equal(new[] { 2, 3, 5 }, back.Shape);
        Assert.Equal(values, back.Values);
        // numpy.lib.format (numpy 1.24.2, ARRAY_ALIGN = 64): magic, version, length and header together fill a multiple of 64 bytes.
        Assert.Equal(0, (new FileInfo(path).Length - 8 * values.Length) % 64);
        Assert.False(File.Exists(path + ".tmp"));
    }

    [Fact]
    public void NaN_in_a_file_is_reported_with_its_index()
    {
        using var tmp = new TempFolder();
        string path = tmp.File("nan.npy");
        var values = new double[12];
        values[7] = double.NaN; // C order, shape (2, 6): flat 7 = 1 * 6 + 1, i.e. index (1, 1)
        NpyArray.Write(path, [2, 6], values);
        var e = Assert.Throws<InputException>(() => NpyArray.Read(path));
        Assert.Contains(path, e.Message);
        Assert.Contains("(1, 1)", e.Message);
    }

    [Fact]
    public void Unsupported_dtype_and_truncated_data_are_refused()
    {
        using var tmp = new TempFolder();
        var bytes = File.ReadAllBytes(Fixtures.Path("npy_f8_c.npy"));
        string path = tmp.File("x.npy");
        File.WriteAllBytes(path, bytes[..^8]);
        Assert.Contains("truncated", Assert.Throws<InputException>(() => NpyArray.Read(path)).Message);

        var text = System.Text.Encoding.Latin1.GetString(bytes).Replace("'<f8'", "'>f8'");
        File.WriteAllBytes(path, System.Text.Encoding.Latin1.GetBytes(text));
        Assert.Contains("'>f8' is not supported", Assert.Throws<InputException>(() => NpyArray.Read(path)).Message);

        File.WriteAllBytes(path, "not an array"u8.ToArray());
        Assert.Contains("magic", Assert.Throws<InputException>(() => NpyArray.Read(path)).Message);
    }
}
