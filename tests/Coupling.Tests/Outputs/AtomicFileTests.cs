using System.Text;
using System.Text.RegularExpressions;
using Coupling.Outputs;

namespace Coupling.Tests.Outputs;

public class AtomicFileTests
{
    [Fact]
    public void Written_text_arrives_whole_as_utf8_without_a_byte_order_mark_and_leaves_no_temporary_file()
    {
        using var dir = new TempFolder();
        AtomicFile.WriteAllText(dir["a.txt"], "théta\n");
        // UTF-8 of U+00E9 is C3 A9 (RFC 3629); no EF BB BF mark in front.
        Assert.Equal(new byte[] { 0x74, 0x68, 0xC3, 0xA9, 0x74, 0x61, 0x0A }, File.ReadAllBytes(dir["a.txt"]));
        Assert.Equal(["a.txt"], dir.Entries());
    }

    [Fact]
    public void Written_bytes_replace_an_existing_file()
    {
        using var dir = new TempFolder();
        File.WriteAllText(dir["b.bin"], "old contents that are longer");
        AtomicFile.WriteAllBytes(dir["b.bin"], [1, 2, 3]);
        Assert.Equal(new byte[] { 1, 2, 3 }, File.ReadAllBytes(dir["b.bin"]));
        Assert.Equal(["b.bin"], dir.Entries());
    }

    [Fact]
    public void The_temporary_file_is_a_hidden_sibling_and_the_target_appears_only_on_commit()
    {
        using var dir = new TempFolder();
        using var stream = AtomicFile.Create(dir["c.csv"]);
        stream.Write(Encoding.ASCII.GetBytes("x,y\n"));
        Assert.False(File.Exists(dir["c.csv"]));
        Assert.Equal(dir.Path, Path.GetDirectoryName(stream.TemporaryPath));
        Assert.Matches(new Regex(@"^\.c\.csv\.tmp-[0-9a-f]{12}$"), Path.GetFileName(stream.TemporaryPath));
        Assert.True(File.Exists(stream.TemporaryPath));
        stream.Commit();
        Assert.True(stream.IsCommitted);
        Assert.Equal("x,y\n", File.ReadAllText(dir["c.csv"]));
        Assert.Equal(["c.csv"], dir.Entries());
    }

    [Fact]
    public void A_failure_in_the_middle_of_writing_leaves_nothing_behind()
    {
        using var dir = new TempFolder();
        Assert.Throws<InvalidDataException>((Action)(() =>
        {
            using var stream = AtomicFile.Create(dir["d.tsv"]);
            stream.Write(new byte[100_000]);
            throw new InvalidDataException("simulated failure half-way");
        }));
        Assert.Empty(dir.Entries());
    }

    [Fact]
    public void A_failure_in_the_middle_of_writing_keeps_the_old_file_intact()
    {
        using var dir = new TempFolder();
        File.WriteAllText(dir["e.json"], "{\"old\":true}");
        Assert.Throws<InvalidDataException>((Action)(() =>
        {
            using var stream = AtomicFile.Create(dir["e.json"]);
            using var writer = new StreamWriter(stream);
            writer.Write("{\"new\":");
            writer.Flush();
            throw new InvalidDataException("simulated failure half-way");
        }));
        Assert.Equal("{\"old\":true}", File.ReadAllText(dir["e.json"]));
        Assert.Equal(["e.json"], dir.Entries());
    }

    [Fact]
    public void A_commit_that_cannot_rename_deletes_the_temporary_file()
    {
        using var dir = new TempFolder();
        Directory.CreateDirectory(dir["taken"]); // a folder stands where the file should go
        var stream = AtomicFile.Create(dir["taken"]);
        stream.WriteByte(7);
        Assert.ThrowsAny<IOException>(stream.Commit);
        stream.Dispose();
        Assert.Equal(["taken"], dir.Entries());
        Assert.Empty(Directory.EnumerateFileSystemEntries(dir["taken"]));
    }

    [Fact]
    public void A_missing_folder_is_reported_and_nothing_is_created()
    {
        using var dir = new TempFolder();
        Assert.Throws<DirectoryNotFoundException>(() => AtomicFile.WriteAllText(dir["no/such/f.txt"], "x"));
        Assert.Empty(dir.Entries());
    }
}
