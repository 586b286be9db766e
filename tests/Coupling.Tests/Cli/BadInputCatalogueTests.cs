using System.Globalization;
using System.Runtime.CompilerServices;
using System.Text;
using Coupling.Cli;
using Coupling.Formats;
using Coupling.Tests.Formats;
using Coupling.Tests.Pipeline;

namespace Coupling.Tests.Cli;

/// <summary>
/// Every case of docs/bad-inputs.md, run through the command line: the exit code and the one-line message must be those
/// the catalogue gives ("{dir}" stands for the case's folder), and the folder must hold afterwards exactly what it held
/// before (nothing written, nothing removed). The catalogue is the expected text, so the docs and the program agree.
/// </summary>
public sealed class BadInputCatalogueTests
{
    private sealed class Case(string folder)
    {
        public string Dir { get; } = folder;

        public string this[string name] => Path.Combine(Dir, name);

        public void Text(string name, string text) => File.WriteAllText(this[name], text);

        /// <summary>The small CSV study (4 channels, 20 trials at 200 Hz) and a plan with <paramref name="planEdit"/> applied.</summary>
        public string[] Study(Func<string, string>? planEdit = null, Func<int, int, double, double>? edit = null, int trials = 20)
        {
            SmallStudy.WriteRecording(Dir, trials: trials, edit: edit);
            string plan = SmallStudy.PlanText(surrogates: 200);
            Text("plan.yaml", planEdit is null ? plan : planEdit(plan));
            return ["run", this["plan.yaml"]];
        }

        public string[] InspectEdf(Action<byte[]> spoil)
        {
            var bytes = Edf();
            spoil(bytes);
            File.WriteAllBytes(this["rec.edf"], bytes);
            return ["inspect", this["rec.edf"]];
        }

        public string[] InspectEdfBuilt(Action<EdfBuilder> change)
        {
            var b = EdfPlus();
            change(b);
            File.WriteAllBytes(this["rec.edf"], b.Build());
            return ["inspect", this["rec.edf"]];
        }

        /// <summary>A plan over rec.edf (two EEG signals, cue events), after <paramref name="spoil"/> changed the file.</summary>
        public string[] RunEdf(Action<EdfBuilder> spoil, string extra = "")
        {
            var b = EdfPlus();
            spoil(b);
            File.WriteAllBytes(this["rec.edf"], b.Build());
            Text("plan.yaml", $"recording: rec.edf\n{extra}conditions: {{ cue: [cue] }}\ntrial: {{ start: 0, end: 0.5 }}\nwindow: {{ start: 0, end: 0.5 }}\n" +
                "bands: { alpha: [8, 12] }\nmeasures: [plv]\nsurrogates: 10\nseed: 1\noutput: results\nfigures: false\n");
            return ["run", this["plan.yaml"]];
        }

        public string[] Npy(byte[] bytes, string labels = "a\nb\n", string planEdit = "")
        {
            File.WriteAllBytes(this["epochs.npy"], bytes);
            Text("labels.txt", labels);
            Text("plan.yaml", "recording: epochs.npy\nsample_rate: 100\nepochs: { first_sample_time: -0.5, labels: labels.txt, channel_labels: [X, Y] }\n" +
                $"conditions: {{ a: [a], b: [b] }}\ntrial: {{ start: -0.2, end: 0.8 }}\nwindow: {{ start: 0, end: 0.5 }}\nbands: {{ alpha: [8, 12] }}\nmeasures: [plv]\nsurrogates: 0\nseed: 1\noutput: results\n{planEdit}");
            return ["run", this["plan.yaml"]];
        }
    }

    private static EdfBuilder EdfPlus()
    {
        var b = new EdfBuilder();
        b.Signals.Add(new("EEG A1", "uV", "-500", "500", "-2048", "2047", 16));
        b.Signals.Add(new("EEG A2", "uV", "-500", "500", "-2048", "2047", 16));
        b.Signals.Add(new("EDF Annotations", "", "-1", "1", "-32768", "32767", 30));
        for (int r = 0; r < 6; r++)
            b.Records.Add([Samples(r, 0), Samples(r, 1), r % 2 == 1 ? Annotation($"+{r}||", $"+{r}.25|cue|") : Annotation($"+{r}||")]);
        return b;
    }

    /// <summary>Marks the file EDF+D and stamps record r at <paramref name="stamp"/>(r) s, moving the cue of odd records with it.</summary>
    private static void Discontinuous(EdfBuilder b, Func<int, double> stamp)
    {
        b.Reserved = "EDF+D";
        for (int r = 0; r < b.Records.Count; r++)
        {
            string at = stamp(r).ToString(System.Globalization.CultureInfo.InvariantCulture);
            string cue = (stamp(r) + 0.25).ToString(System.Globalization.CultureInfo.InvariantCulture);
            b.Records[r][2] = r % 2 == 1 ? Annotation($"+{at}||", $"+{cue}|cue|") : Annotation($"+{at}||");
        }
    }

    private static short[] Samples(int record, int channel) =>
        Enumerable.Range(0, 16).Select(k => (short)(1000 * Math.Sin(0.7 * (16 * record + k) + channel * 1.3 + k * k * 0.01 * channel))).ToArray();

    /// <summary>One record's annotation signal: TALs written with '|' for 0x14 and '~' for 0x15, each closed by 0x00.</summary>
    private static byte[] Annotation(params string[] tals)
    {
        var bytes = new byte[60];
        int at = 0;
        foreach (var tal in tals)
        {
            var b = EdfBuilder.Tal(tal);
            b.CopyTo(bytes, at);
            at += b.Length;
        }
        return bytes;
    }

    private static byte[] Edf() => EdfPlus().Build();

    private static void Put(byte[] b, int offset, string text, int width) => Encoding.Latin1.GetBytes(text.PadRight(width)[..width]).CopyTo(b, offset);

    private static byte[] NpyBytes(string descr, string shape, byte[] data)
    {
        string dict = "{'descr': '" + descr + "', 'fortran_order': False, 'shape': (" + shape + "), }";
        dict = dict.PadRight(117) + "\n";
        var header = new List<byte> { 0x93, (byte)'N', (byte)'U', (byte)'M', (byte)'P', (byte)'Y', 1, 0, (byte)dict.Length, 0 };
        header.AddRange(Encoding.ASCII.GetBytes(dict));
        return [.. header, .. data];
    }

    private static byte[] Doubles(int count, Func<int, double> value)
    {
        var data = new byte[8 * count];
        for (int i = 0; i < count; i++) BitConverter.TryWriteBytes(data.AsSpan(8 * i), value(i));
        return data;
    }

    private static double Noise(int i) => Math.Sin(i * 12.9898) * 43758.5453 % 1;

    /// <summary>Each case writes its files into the folder and returns the command line.</summary>
    private static readonly Dictionary<string, Func<Case, string[]>> Setups = new(StringComparer.Ordinal)
    {
        // EDF / EDF+ headers (Kemp et al. 1992, Table 1; byte offsets for three signals)
        ["edf-shorter-than-its-header"] = c => { File.WriteAllBytes(c["rec.edf"], Edf()[..100]); return ["inspect", c["rec.edf"]]; },
        ["edf-record-count-not-a-number"] = c => c.InspectEdf(b => Put(b, 236, "12x4", 8)),
        ["edf-header-size-wrong"] = c => c.InspectEdf(b => Put(b, 184, "512", 8)),
        ["edf-no-signals"] = c => c.InspectEdf(b => Put(b, 252, "0", 4)),
        ["edf-non-ascii-header-byte"] = c => c.InspectEdf(b => b[20] = 0xE9),
        ["edf-digital-range-inverted"] = c => c.InspectEdf(b => { Put(b, 616, "2047", 8); Put(b, 640, "-2048", 8); }),
        ["edf-physical-range-empty"] = c => c.InspectEdf(b => Put(b, 568, "500", 8)),
        ["edf-no-samples-per-record"] = c => c.InspectEdf(b => Put(b, 904, "0", 8)),
        ["edf-bad-start-date"] = c => c.InspectEdf(b => Put(b, 168, "17/05/21", 8)),
        ["edf-negative-record-duration"] = c => c.InspectEdf(b => Put(b, 244, "-1", 8)),
        // EDF data records
        ["edf-truncated"] = c => { File.WriteAllBytes(c["rec.edf"], Edf()[..^100]); return ["inspect", c["rec.edf"]]; },
        ["edf-lying-record-count"] = c => c.InspectEdf(b => Put(b, 236, "99999999", 8)),
        // EDF+D (Kemp and Olivan 2003, section 2.2.4): the records' time stamps place them; 0..3 s and 4..7 s leave a gap.
        ["edf-discontinuous-gap"] = c => c.RunEdf(b => Discontinuous(b, r => r < 3 ? r : r + 1)),
        ["edf-discontinuous-overlap"] = c => c.RunEdf(b => Discontinuous(b, r => r < 3 ? r : r - 0.5)),
        ["edf-unknown-channel"] = c => c.RunEdf(_ => { }, "channels: [EEG A1, EEG A9]\n"),
        // EDF+ annotations (Kemp and Olivan 2003, section 2.2)
        ["annotation-not-closed"] = c => c.InspectEdfBuilt(b => b.Records[1][2] = Enumerable.Repeat((byte)'+', 60).ToArray()),
        ["annotation-bad-onset"] = c => c.InspectEdfBuilt(b => b.Records[1][2] = Annotation("+1||", "+1,25|cue|")),
        ["annotation-bad-duration"] = c => c.InspectEdfBuilt(b => b.Records[1][2] = Annotation("+1||", "+1.25~x|cue|")),
        ["annotation-no-time-keeping"] = c => c.InspectEdfBuilt(b => b.Records[2][2] = new byte[60]),
        // events.tsv and channels.tsv (BIDS)
        ["events-missing-column"] = c => { var a = c.Study(); c.Text("rec_events.tsv", "onset\tduration\ttype\n3\t0\tgo\n"); return a; },
        ["events-onset-not-a-number"] = c => { var a = c.Study(); c.Text("rec_events.tsv", "onset\tduration\ttrial_type\n3\t0\tgo\nsoon\t0\tgo\n"); return a; },
        ["events-negative-duration"] = c => { var a = c.Study(); c.Text("rec_events.tsv", "onset\tduration\ttrial_type\n3\t-1\tgo\n"); return a; },
        ["events-wrong-cell-count"] = c => { var a = c.Study(); c.Text("rec_events.tsv", "onset\tduration\ttrial_type\n3\t0\n"); return a; },
        ["events-file-missing"] = c => c.Study(p => p.Replace("events: rec_events.tsv", "events: rec_event.tsv")),
        ["channels-missing-column"] = c => { var a = c.Study(); c.Text("rec_channels.tsv", "name\ttype\nA\tEEG\n"); return a; },
        ["channels-bad-status"] = c => { var a = c.Study(); c.Text("rec_channels.tsv", "name\ttype\tunits\tstatus\nA\tEEG\tuV\tbroken\n"); return a; },
        // CSV
        ["csv-semicolons"] = c => { var a = c.Study(); c.Text("rec.csv", "A;B;C;D\n1;2;3;4\n"); return a; },
        ["csv-nan"] = c => c.Study(edit: (ch, s, v) => ch == 1 && s == 300 ? double.NaN : v),
        ["csv-infinity"] = c => c.Study(edit: (ch, s, v) => ch == 1 && s == 300 ? double.PositiveInfinity : v),
        ["csv-inf-text"] = c => { var a = c.Study(); c.Text("rec.csv", "A,B,C,D\n1,2,3,4\n1,-inf,3,4\n"); return a; },
        ["csv-decimal-commas"] = c => { var a = c.Study(); c.Text("rec.csv", "A;B;C;D\n1,5;2;3;4\n"); return a; },
        ["csv-tabs"] = c => { var a = c.Study(); c.Text("rec.csv", "A\tB\tC\tD\n1\t2\t3\t4\n"); return a; },
        ["csv-missing-cell"] = c => { var a = c.Study(); c.Text("rec.csv", "A,B,C,D\n1,2,3,4\n1,2,3\n"); return a; },
        ["csv-repeated-label"] = c => { var a = c.Study(); c.Text("rec.csv", "A,B,A,D\n1,2,3,4\n"); return a; },
        ["csv-flat-channel"] = c => c.Study(edit: (ch, s, v) => ch == 2 ? 5.0 : v),
        ["csv-without-sample-rate"] = c => c.Study(p => p.Replace("sample_rate: 200\n", "")),
        // NPY epochs
        ["npy-not-npy"] = c => c.Npy(Encoding.ASCII.GetBytes("trial,channel,sample\n")),
        ["npy-big-endian"] = c => c.Npy(NpyBytes(">f8", "2, 2, 100", Doubles(400, Noise))),
        ["npy-truncated"] = c => c.Npy(NpyBytes("<f8", "2, 2, 100", Doubles(300, Noise))),
        ["npy-two-dimensions"] = c => c.Npy(NpyBytes("<f8", "2, 200", Doubles(400, Noise))),
        ["npy-nan"] = c => c.Npy(NpyBytes("<f8", "2, 2, 100", Doubles(400, i => i == 150 ? double.NaN : Noise(i)))),
        ["npy-labels-count"] = c => c.Npy(NpyBytes("<f8", "2, 2, 100", Doubles(400, Noise)), labels: "a\nb\na\n"),
        // plans
        ["plan-missing"] = c => ["run", c["plan.yaml"]],
        ["plan-a-folder"] = c => ["run", c.Dir],
        ["plan-not-yaml"] = c => { c.Text("plan.yaml", "recording: [rec.csv\n"); return ["run", c["plan.yaml"]]; },
        ["plan-misspelt-key"] = c => c.Study(p => p.Replace("surrogates:", "surogates:")),
        ["plan-misspelt-measure"] = c => c.Study(p => p.Replace("[plv, wpli, aec]", "[plv, wpil, aec]")),
        ["plan-band-above-nyquist"] = c => c.Study(p => p.Replace("{ alpha: [8, 12] }", "{ alpha: [8, 12], high: [90, 110] }")),
        ["plan-window-outside-trial"] = c => c.Study(p => p.Replace("end: 0.75", "end: 0.4")),
        ["plan-unknown-event-label"] = c => c.Study(p => p.Replace("{ go: [go] }", "{ go: [og] }")),
        ["plan-all-trials-past-the-end"] = c =>
        {
            var a = c.Study();
            c.Text("rec_events.tsv", "onset\tduration\ttrial_type\n" + string.Concat(Enumerable.Range(0, 5).Select(n => $"{100 + n}\t0\tgo\n")));
            return a;
        },
        ["plan-three-trials"] = c => c.Study(trials: 3),
        ["plan-seed-missing"] = c => c.Study(p => p.Replace("seed: 42\n", "")),
        ["plan-recording-missing"] = c => c.Study(p => p.Replace("recording: rec.csv", "recording: rec2.csv")),
        ["plan-surrogates-negative"] = c => c.Study(p => p.Replace("surrogates: 200", "surrogates: -5")),
        ["plan-truncated-recording-choice"] = c => c.Study(p => p + "\ntruncated_recording: keep\n"),
        ["plan-unusable-data-choice"] = c => c.Study(p => p + "\nunusable_data: drop\n"),
        ["plan-unusable-data-leaves-one-channel"] = c => c.Study(p => p + "\nunusable_data: drop-channels\n", edit: (ch, s, v) => ch >= 1 && s == 10 ? double.NaN : v),
        // command-line options
        ["cli-unknown-command"] = _ => ["simulat"],
        ["cli-misspelt-option"] = c => ["run", c["plan.yaml"], "--thread", "2"],
        ["cli-not-a-number"] = c => ["simulate", "--trials", "many", "--output", c["sim"]],
        ["cli-demo-negative-surrogates"] = c => ["demo", "--surrogates", "-1", "--output", c["demo"]],
        ["cli-simulate-one-trial"] = c => ["simulate", "--trials", "1", "--output", c["sim"]],
        ["cli-inspect-unknown-extension"] = c => { c.Text("rec.txt", "1,2\n"); return ["inspect", c["rec.txt"]]; },
        ["cli-inspect-csv-without-rate"] = c => { c.Text("rec.csv", "A,B\n1,2\n"); return ["inspect", c["rec.csv"]]; },
        ["cli-inspect-bad-rate"] = c => { c.Text("rec.csv", "A,B\n1,2\n"); return ["inspect", c["rec.csv"], "--rate", "-5"]; },
        // output that cannot be written
        ["output-under-a-file"] = c => c.Study(p => p.Replace("output: results", "output: rec_events.tsv/results").Replace("surrogates: 200", "surrogates: 0")),
    };

    public static TheoryData<string> Ids => new(Setups.Keys);

    private sealed record Entry(string Id, int Exit, string Message);

    private static IReadOnlyDictionary<string, Entry> Catalogue([CallerFilePath] string caller = "")
    {
        string doc = Path.GetFullPath(Path.Combine(Path.GetDirectoryName(caller)!, "..", "..", "..", "docs", "bad-inputs.md"));
        var entries = new Dictionary<string, Entry>(StringComparer.Ordinal);
        foreach (var line in File.ReadAllLines(doc))
        {
            if (!line.StartsWith("| `", StringComparison.Ordinal)) continue;
            var cells = line.Split(" | ");
            // | `id` | what is wrong | exit | `message` |
            string id = cells[0].Trim('|', ' ', '`');
            int exit = int.Parse(cells[2].Trim(), CultureInfo.InvariantCulture);
            string message = string.Join(" | ", cells[3..]).TrimEnd(' ', '|').Trim();
            entries.Add(id, new Entry(id, exit, message.Trim('`')));
        }
        return entries;
    }

    [Fact]
    public void The_catalogue_lists_at_least_30_cases_and_each_has_a_test()
    {
        var catalogue = Catalogue();
        Assert.True(catalogue.Count >= 30, $"{catalogue.Count} cases");
        Assert.Equal(Setups.Keys.Order(StringComparer.Ordinal), catalogue.Keys.Order(StringComparer.Ordinal));
    }

    [Theory]
    [MemberData(nameof(Ids))]
    public void A_catalogued_bad_input_gets_its_message_and_exit_code(string id)
    {
        using var folder = new Pipeline.TempFolder();
        var args = Setups[id](new Case(folder.Path));
        var before = Snapshot(folder.Path);
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CommandLine.Run(args, output, error);
        string err = error.ToString().ReplaceLineEndings("\n");
        var lines = err.Split('\n', StringSplitOptions.RemoveEmptyEntries).Where(l => !l.StartsWith("coupling: warning: ", StringComparison.Ordinal)).ToArray();
        string received = Assert.Single(lines, l => l.StartsWith("coupling: ", StringComparison.Ordinal))["coupling: ".Length..]
            .Replace(folder.Path, "{dir}", StringComparison.Ordinal);
        var expected = Catalogue().TryGetValue(id, out var e) ? e : null;
        Assert.True(expected is not null, $"'{id}' is not in docs/bad-inputs.md; it gives: exit {code}, `{received}`");
        Assert.True(expected.Exit == code && expected.Message == received,
            $"'{id}': expected exit {expected.Exit}, `{expected.Message}`\n received exit {code}, `{received}`");
        Assert.Equal(before, Snapshot(folder.Path));
    }

    /// <summary>Every file and folder under <paramref name="root"/> (hidden ones too) with its size and last write time.</summary>
    private static string[] Snapshot(string root) =>
        Directory.Exists(root)
            ? Directory.EnumerateFileSystemEntries(root, "*", SearchOption.AllDirectories)
                .Select(p => File.Exists(p) ? $"{Path.GetRelativePath(root, p)} {new FileInfo(p).Length} {File.GetLastWriteTimeUtc(p).Ticks}" : Path.GetRelativePath(root, p) + "/")
                .Order(StringComparer.Ordinal).ToArray()
            : [];
}
