using System.Globalization;
using System.Text;

namespace Coupling.Tests.Formats;

/// <summary>
/// Builds EDF bytes field by field, straight from the layout tables of Kemp et al. (1992) and the EDF+ TAL
/// rules of Kemp and Olivan (2003), independently of the library's writer.
/// </summary>
internal sealed class EdfBuilder
{
    public sealed record Signal(string Label, string Dimension, string PhysMin, string PhysMax, string DigMin, string DigMax, int PerRecord);

    public string Reserved { get; set; } = "EDF+C";

    /// <summary>Write BDF: version field 0xFF "BIOSEMI" and 24-bit samples (records then give int[] values).</summary>
    public bool Bdf { get; set; }
    public string Duration { get; set; } = "1";
    public string StartDate { get; set; } = "17.05.21";
    public string StartTime { get; set; } = "13.45.10";
    public string? RecordCountText { get; set; }
    public List<Signal> Signals { get; } = new();

    /// <summary>Per record: per signal, the digital values (ordinary signals) or raw bytes (annotation signals).</summary>
    public List<object[]> Records { get; } = new();

    public static byte[] Tal(string body) => Encoding.UTF8.GetBytes(body.Replace("|", "\u0014").Replace("~", "\u0015") + "\0");

    public byte[] Build()
    {
        var sb = new StringBuilder();
        void F(string s, int w) => sb.Append(s.PadRight(w)[..w]);
        int ns = Signals.Count;
        F("0", 8); F("X X X X", 80); F("Startdate X X X X", 80); F(StartDate, 8); F(StartTime, 8);
        F((256 * (ns + 1)).ToString(CultureInfo.InvariantCulture), 8); F(Reserved, 44);
        F(RecordCountText ?? Records.Count.ToString(CultureInfo.InvariantCulture), 8); F(Duration, 8);
        F(ns.ToString(CultureInfo.InvariantCulture), 4);
        foreach (var s in Signals) F(s.Label, 16);
        foreach (var _ in Signals) F("", 80);
        foreach (var s in Signals) F(s.Dimension, 8);
        foreach (var s in Signals) F(s.PhysMin, 8);
        foreach (var s in Signals) F(s.PhysMax, 8);
        foreach (var s in Signals) F(s.DigMin, 8);
        foreach (var s in Signals) F(s.DigMax, 8);
        foreach (var _ in Signals) F("", 80);
        foreach (var s in Signals) F(s.PerRecord.ToString(CultureInfo.InvariantCulture), 8);
        foreach (var _ in Signals) F("", 32);
        var bytes = new List<byte>(Encoding.ASCII.GetBytes(sb.ToString()));
        if (Bdf)
        {
            bytes[0] = 0xFF;
            for (int k = 0; k < 7; k++) bytes[1 + k] = (byte)"BIOSEMI"[k];
        }
        int width = Bdf ? 3 : 2;
        foreach (var record in Records)
            for (int i = 0; i < ns; i++)
            {
                var block = new byte[width * Signals[i].PerRecord];
                if (record[i] is short[] values)
                    for (int k = 0; k < values.Length; k++) { block[2 * k] = (byte)(values[k] & 0xFF); block[2 * k + 1] = (byte)((values[k] >> 8) & 0xFF); }
                else if (record[i] is int[] wide)
                    for (int k = 0; k < wide.Length; k++)
                        for (int b = 0; b < 3; b++) block[3 * k + b] = (byte)((wide[k] >> (8 * b)) & 0xFF);
                else
                    ((byte[])record[i]).CopyTo(block, 0);
                bytes.AddRange(block);
            }
        return bytes.ToArray();
    }
}
