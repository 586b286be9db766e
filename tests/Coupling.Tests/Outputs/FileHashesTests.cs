using System.Text;
using Coupling.Outputs;

namespace Coupling.Tests.Outputs;

public class FileHashesTests
{
    // Expected digests: NIST FIPS 180-2 (2002), Appendix B.1 ("abc"), B.2 (448-bit message) and B.3
    // (one million 'a'); the empty-message digest is the well-known SHA-256 of zero bytes. All four agree with
    // GNU coreutils sha256sum on this machine.
    [Theory]
    [InlineData("abc", 1, "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad")]
    [InlineData("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq", 1, "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1")]
    [InlineData("a", 1_000_000, "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0")]
    [InlineData("", 0, "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855")]
    public void Sha256_of_a_file_matches_the_published_test_vectors(string text, int repeat, string expected)
    {
        using var dir = new TempFolder();
        File.WriteAllBytes(dir["f.bin"], Encoding.ASCII.GetBytes(string.Concat(Enumerable.Repeat(text, repeat))));
        Assert.Equal(expected, FileHashes.Sha256(dir["f.bin"]));
    }

    [Fact]
    public void A_file_larger_than_the_read_buffer_hashes_like_its_contents()
    {
        // 3 MiB + 7 bytes spans several 1 MiB reads; compare with the one-shot hash of the same bytes.
        using var dir = new TempFolder();
        var bytes = new byte[3 * (1 << 20) + 7];
        for (int i = 0; i < bytes.Length; i++) bytes[i] = (byte)(i * 31 + (i >> 11));
        File.WriteAllBytes(dir["big.bin"], bytes);
        Assert.Equal(Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(bytes)), FileHashes.Sha256(dir["big.bin"]));
    }

    [Fact]
    public void A_missing_file_is_reported_by_name()
    {
        using var dir = new TempFolder();
        var e = Assert.Throws<InputException>(() => FileHashes.Sha256(dir["absent.edf"]));
        Assert.Contains("absent.edf", e.Message);
    }

    [Fact]
    public void An_input_record_holds_size_and_hash()
    {
        using var dir = new TempFolder();
        File.WriteAllText(dir["abc.txt"], "abc");
        var rec = InputFileRecord.Of(dir["abc.txt"]);
        Assert.Equal(3, rec.Bytes);
        Assert.Equal("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", rec.Sha256); // FIPS 180-2 B.1
    }
}
