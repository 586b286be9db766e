using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using System.Text.Json.Serialization;
using Coupling.Outputs;
using Coupling.Plans;
using Coupling.Statistics;

namespace Coupling.Pipeline;

/// <summary>
/// The results of a run kept per work unit (condition x band, contrast x band) while it runs, so that a run that was
/// stopped can be resumed: the units already done are loaded rather than computed again.
/// </summary>
/// <remarks>
/// <para>The units live in a folder beside the results folder with a fixed name, <c>.&lt;name&gt;.unfinished</c>: a
/// state file (<see cref="StateName"/>, holding a marker, the plan's hash and every input's SHA-256) and one file per
/// finished unit under <c>units/</c>, each written atomically (<see cref="AtomicFile"/>) with the same hashes in its
/// header, so a unit file is either whole or absent. Doubles are stored as their IEEE 754 bits, so a resumed run gives
/// the same bytes as one run whole.</para>
/// <para>A run whose plan (every key as parsed except <c>threads</c> and <c>overwrite</c>; comments and layout of the
/// plan file do not count) or input files differ from the unfinished
/// one's is refused unless asked to start over, which deletes the old units. The folder is made when the first unit is
/// saved and deleted (its own files only) after the results folder is in place. A folder at that place that this class
/// did not make is never touched.</para>
/// </remarks>
public sealed class UnfinishedRun
{
    /// <summary>Name of the state file in the folder.</summary>
    public const string StateName = "state.json";

    /// <summary>Marker the state file carries.</summary>
    public const string StateFormat = "coupling-unfinished-1";

    private const string UnitFolder = "units";
    private const string UnitExtension = ".unit";
    private static readonly byte[] Magic = "CPLUNIT1"u8.ToArray();
    private static readonly byte[] Trailer = "END."u8.ToArray();

    private static readonly JsonSerializerOptions PlanJson = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.KebabCaseLower) },
    };

    private readonly RunState _state;
    private readonly List<string> _resumed = [];
    private readonly object _gate = new();
    private bool _stateWritten;

    private UnfinishedRun(string folder, RunState state)
    {
        FolderPath = folder;
        _state = state;
    }

    /// <summary>Full path of the folder holding the units.</summary>
    public string FolderPath { get; }

    /// <summary>Names of the units loaded rather than computed, in the order they were asked for.</summary>
    public IReadOnlyList<string> Resumed
    {
        get { lock (_gate) return _resumed.ToArray(); }
    }

    /// <summary>The folder that keeps the units of a run writing to <paramref name="output"/>: <c>.&lt;name&gt;.unfinished</c> beside it.</summary>
    public static string FolderFor(string output)
    {
        string full = Path.GetFullPath(output.TrimEnd(Path.DirectorySeparatorChar, Path.AltDirectorySeparatorChar));
        return Path.Combine(Path.GetDirectoryName(full) ?? full, $".{Path.GetFileName(full)}.unfinished");
    }

    /// <summary>
    /// Opens the units of <paramref name="plan"/>'s run: those of an interrupted earlier run of the same plan and inputs
    /// are kept for loading; none yet when there is no such folder.
    /// </summary>
    /// <param name="plan">The plan about to run.</param>
    /// <param name="restart">Discard the units of any earlier run and compute everything again.</param>
    /// <exception cref="InputException">The folder holds units of another plan or other inputs and <paramref name="restart"/>
    /// is false; or something is at the folder's place that this class did not make.</exception>
    public static UnfinishedRun Open(Plan plan, bool restart = false)
    {
        ArgumentNullException.ThrowIfNull(plan);
        string folder = FolderFor(plan.Output);
        var state = new RunState(StateFormat, PlanHash(plan),
            PlanInputs.Files(plan).Where(f => f != plan.Source && File.Exists(f)).Select(InputFileRecord.Of).ToArray());
        var run = new UnfinishedRun(folder, state);
        if (!Directory.Exists(folder) && !File.Exists(folder)) return run;

        var units = run.OwnFiles(out var foreign);
        if (foreign is not null)
            throw new InputException($"{plan.Source}: output: '{folder}' is where this tool keeps the units of an unfinished run, but it holds '{foreign}', which this tool did not write; it is left as it is. Move it away and run again.");
        if (restart)
        {
            run.Delete(units);
            return run;
        }
        RunState? earlier = ReadState(Path.Combine(folder, StateName));
        string? change = earlier is null ? "its state file is missing or unreadable" : Difference(earlier, state);
        if (change is null) return run;
        bool anyUnit = units.Any(u => u.EndsWith(UnitExtension, StringComparison.Ordinal));
        if (anyUnit)
            throw new InputException($"{plan.Source}: output: an unfinished earlier run to '{plan.Output}' is kept in '{folder}', but {change}; " +
                "give --restart to discard it and start over, or restore the earlier plan and inputs to resume it.");
        return run;
    }

    /// <summary>The manifest's name of the unit of condition <paramref name="condition"/> in band <paramref name="band"/>.</summary>
    public static string ConditionUnit(string condition, string band) => $"condition {condition} / band {band}";

    /// <summary>The manifest's name of the unit of contrast <paramref name="contrast"/> in band <paramref name="band"/>.</summary>
    public static string ContrastUnit(string contrast, string band) => $"contrast {contrast} / band {band}";

    /// <summary>Names of the units kept in the folder for this plan and inputs (read back, not just listed), in plan order.</summary>
    public IReadOnlyList<string> KeptUnits(Plan plan)
    {
        ArgumentNullException.ThrowIfNull(plan);
        // A unit of a correction that needs the draws holds each test's outcome after it (CorrectedCondition).
        bool corrected = FamilyCorrection.NeedsDraws(plan.Correction) && plan.Surrogates > 0;
        bool KeptCondition(string path) => corrected
            ? Load(path, null, r => (ReadSurrogate(r), ReadOutcome(r))) is not null
            : Load(path, null, ReadSurrogate) is not null;
        bool KeptContrast(string path) => corrected
            ? Load(path, null, r => (ReadContrast(r), ReadOutcome(r))) is not null
            : Load(path, null, ReadContrast) is not null;
        var kept = new List<string>();
        for (int ci = 0; ci < plan.Conditions.Count; ci++)
            for (int bi = 0; bi < plan.Bands.Count; bi++)
                if (KeptCondition(UnitPath($"condition-{ci}-band-{bi}")))
                    kept.Add(ConditionUnit(plan.Conditions[ci].Name, plan.Bands[bi].Name));
        for (int ki = 0; ki < plan.Contrasts.Count; ki++)
            for (int bi = 0; bi < plan.Bands.Count; bi++)
                if (KeptContrast(UnitPath($"contrast-{ki}-band-{bi}")))
                    kept.Add(ContrastUnit(plan.Contrasts[ki].Name, plan.Bands[bi].Name));
        return kept;
    }

    /// <summary>
    /// The surrogate test of condition <paramref name="condition"/> in band <paramref name="band"/>: loaded when an earlier
    /// run saved it, else computed by <paramref name="compute"/> and saved.
    /// </summary>
    /// <param name="condition">Index of the condition in the plan.</param>
    /// <param name="band">Index of the band in the plan.</param>
    /// <param name="label">How the unit is named in the manifest (<see cref="ConditionUnit"/>).</param>
    /// <param name="compute">Computes the unit.</param>
    public IReadOnlyList<SurrogateResult> Condition(int condition, int band, string label, Func<IReadOnlyList<SurrogateResult>> compute) =>
        Unit($"condition-{condition}-band-{band}", label, ReadSurrogate, WriteSurrogate, compute);

    /// <summary>
    /// As <see cref="Condition"/>, for a correction that needs the draws themselves (<see cref="FamilyCorrection.NeedsDraws"/>):
    /// the unit keeps each measure's test together with its corrected outcome, which the draws decided.
    /// </summary>
    public IReadOnlyList<(SurrogateResult Test, FamilyOutcome Outcome)> CorrectedCondition(int condition, int band, string label,
        Func<IReadOnlyList<(SurrogateResult Test, FamilyOutcome Outcome)>> compute) =>
        Unit<(SurrogateResult Test, FamilyOutcome Outcome)>($"condition-{condition}-band-{band}", label, r => (ReadSurrogate(r), ReadOutcome(r)),
            (w, t) => { WriteSurrogate(w, t.Test); WriteOutcome(w, t.Outcome); }, compute);

    /// <summary>
    /// The label-permutation test of contrast <paramref name="contrast"/> in band <paramref name="band"/>: loaded when an
    /// earlier run saved it, else computed by <paramref name="compute"/> and saved.
    /// </summary>
    public IReadOnlyList<ContrastResult> Contrast(int contrast, int band, string label, Func<IReadOnlyList<ContrastResult>> compute) =>
        Unit($"contrast-{contrast}-band-{band}", label, ReadContrast, WriteContrast, compute);

    /// <summary>As <see cref="Contrast"/>, with each measure's corrected outcome (see <see cref="CorrectedCondition"/>).</summary>
    public IReadOnlyList<(ContrastResult Test, FamilyOutcome Outcome)> CorrectedContrast(int contrast, int band, string label,
        Func<IReadOnlyList<(ContrastResult Test, FamilyOutcome Outcome)>> compute) =>
        Unit<(ContrastResult Test, FamilyOutcome Outcome)>($"contrast-{contrast}-band-{band}", label, r => (ReadContrast(r), ReadOutcome(r)),
            (w, t) => { WriteContrast(w, t.Test); WriteOutcome(w, t.Outcome); }, compute);

    /// <summary>The unit <paramref name="name"/>: loaded when an earlier run saved it, else computed and saved.</summary>
    private IReadOnlyList<T> Unit<T>(string name, string label, Func<BinaryReader, T> read, Action<BinaryWriter, T> write,
        Func<IReadOnlyList<T>> compute)
    {
        ArgumentNullException.ThrowIfNull(compute);
        string path = UnitPath(name);
        var loaded = Load(path, label, read);
        if (loaded is not null) return loaded;
        var results = compute();
        Save(path, w => { foreach (var r in results) write(w, r); }, results.Count);
        return results;
    }

    /// <summary>Deletes the folder's own files and then the folder when empty; call once the results folder is in place.</summary>
    public void Remove()
    {
        if (!Directory.Exists(FolderPath)) return;
        var units = OwnFiles(out var foreign);
        Delete(units);
        if (foreign is null) OutputSafety.DeleteEmptyFolders(FolderPath);
    }

    /// <summary>SHA-256 of the plan as parsed, with <c>threads</c> and <c>overwrite</c> (which do not change results) left out.</summary>
    public static string PlanHash(Plan plan)
    {
        ArgumentNullException.ThrowIfNull(plan);
        string json = JsonSerializer.Serialize(plan with { Threads = 0, Overwrite = false }, PlanJson);
        return Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(json)));
    }

    private string UnitPath(string name) => Path.Combine(FolderPath, UnitFolder, name + UnitExtension);

    private string Stamp => _state.PlanSha256 + ":" + string.Join(",", _state.Inputs.Select(i => i.Sha256));

    private T[]? Load<T>(string path, string? label, Func<BinaryReader, T> read)
    {
        if (!File.Exists(path)) return null;
        try
        {
            using var stream = File.OpenRead(path);
            using var reader = new BinaryReader(stream, Encoding.UTF8);
            if (!reader.ReadBytes(Magic.Length).AsSpan().SequenceEqual(Magic) || reader.ReadString() != Stamp) return null;
            int count = reader.ReadInt32();
            if (count < 0 || count > 1024) return null;
            var items = new T[count];
            for (int i = 0; i < count; i++) items[i] = read(reader);
            if (!reader.ReadBytes(Trailer.Length).AsSpan().SequenceEqual(Trailer) || stream.Position != stream.Length) return null;
            if (label is not null) lock (_gate) _resumed.Add(label);
            return items;
        }
        catch (Exception e) when (e is IOException or InvalidDataException or ArgumentException or FormatException or InputException)
        {
            return null;
        }
    }

    private void Save(string path, Action<BinaryWriter> write, int count)
    {
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        string state = Path.Combine(FolderPath, StateName);
        if (!_stateWritten)
        {
            AtomicFile.WriteAllText(state, JsonSerializer.Serialize(_state, StateJson) + "\n");
            _stateWritten = true;
        }
        using var stream = AtomicFile.Create(path);
        using (var writer = new BinaryWriter(stream, Encoding.UTF8, leaveOpen: true))
        {
            writer.Write(Magic);
            writer.Write(Stamp);
            writer.Write(count);
            write(writer);
            writer.Write(Trailer);
        }
        stream.Commit();
    }

    private static void WriteSurrogate(BinaryWriter w, SurrogateResult r)
    {
        w.Write(Measures.MeasureCatalog.Key(r.Measure));
        w.Write(r.Draws);
        foreach (var a in new[] { r.Observed, r.NullMean, r.NullSd }) WriteDoubles(w, a);
        WriteInts(w, r.Exceedances);
        WriteDoubles(w, r.P);
        WriteDoubles(w, r.Z);
    }

    private static SurrogateResult ReadSurrogate(BinaryReader r) => new(
        Measures.MeasureCatalog.Parse(r.ReadString()), r.ReadInt32(), ReadDoubles(r), ReadDoubles(r), ReadDoubles(r), ReadInts(r), ReadDoubles(r), ReadDoubles(r));

    private static void WriteContrast(BinaryWriter w, ContrastResult r)
    {
        w.Write(Measures.MeasureCatalog.Key(r.Measure));
        w.Write(r.Draws);
        foreach (var a in new[] { r.ValueA, r.ValueB, r.Difference, r.NullMean, r.NullSd }) WriteDoubles(w, a);
        WriteInts(w, r.Exceedances);
        WriteDoubles(w, r.P);
        WriteDoubles(w, r.Z);
    }

    private static ContrastResult ReadContrast(BinaryReader r) => new(
        Measures.MeasureCatalog.Parse(r.ReadString()), r.ReadInt32(), ReadDoubles(r), ReadDoubles(r), ReadDoubles(r), ReadDoubles(r), ReadDoubles(r),
        ReadInts(r), ReadDoubles(r), ReadDoubles(r));

    private static void WriteOutcome(BinaryWriter w, FamilyOutcome o)
    {
        w.Write(o.Method.ToString());
        w.Write(BitConverter.DoubleToInt64Bits(o.Level));
        WriteDoubles(w, o.P);
        w.Write(o.PSource.Length);
        foreach (string source in o.PSource) w.Write(source);
        WriteDoubles(w, o.PCorrected);
        WriteInts(w, o.Significant.Select(b => b ? 1 : 0).ToArray());
        WriteInts(w, o.Component);
        WriteInts(w, o.ComponentExtent);
        WriteDoubles(w, o.ComponentP);
    }

    private static FamilyOutcome ReadOutcome(BinaryReader r)
    {
        if (!Enum.TryParse<CorrectionMethod>(r.ReadString(), out var method)) throw new InvalidDataException("unknown correction method");
        double level = BitConverter.Int64BitsToDouble(r.ReadInt64());
        var p = ReadDoubles(r);
        int sources = r.ReadInt32();
        if (sources < 0 || sources > r.BaseStream.Length - r.BaseStream.Position) throw new InvalidDataException("unit array length out of range");
        var pSource = new string[sources];
        for (int i = 0; i < sources; i++) pSource[i] = r.ReadString();
        return new FamilyOutcome(method, level, p, pSource, ReadDoubles(r), ReadInts(r).Select(v => v != 0).ToArray(),
            ReadInts(r), ReadInts(r), ReadDoubles(r));
    }

    /// <summary>Writes the length, then each double's IEEE 754 bits (exact, NaN payloads included).</summary>
    private static void WriteDoubles(BinaryWriter w, double[] values)
    {
        w.Write(values.Length);
        foreach (double v in values) w.Write(BitConverter.DoubleToInt64Bits(v));
    }

    private static double[] ReadDoubles(BinaryReader r)
    {
        int n = r.ReadInt32();
        if (n < 0 || n > (r.BaseStream.Length - r.BaseStream.Position) / 8) throw new InvalidDataException("unit array length out of range");
        var values = new double[n];
        for (int i = 0; i < n; i++) values[i] = BitConverter.Int64BitsToDouble(r.ReadInt64());
        return values;
    }

    private static void WriteInts(BinaryWriter w, int[] values)
    {
        w.Write(values.Length);
        foreach (int v in values) w.Write(v);
    }

    private static int[] ReadInts(BinaryReader r)
    {
        int n = r.ReadInt32();
        if (n < 0 || n > (r.BaseStream.Length - r.BaseStream.Position) / 4) throw new InvalidDataException("unit array length out of range");
        var values = new int[n];
        for (int i = 0; i < n; i++) values[i] = r.ReadInt32();
        return values;
    }

    /// <summary>
    /// The files of the folder this class writes (state, units, and the hidden temporary files of interrupted atomic
    /// writes), relative; <paramref name="foreign"/> names the first entry it did not write, or is null.
    /// </summary>
    private List<string> OwnFiles(out string? foreign)
    {
        foreign = null;
        var own = new List<string>();
        if (File.Exists(FolderPath) || new DirectoryInfo(FolderPath).LinkTarget is not null)
        {
            foreign = FolderPath;
            return own;
        }
        foreach (var entry in new DirectoryInfo(FolderPath).EnumerateFileSystemInfos("*", new EnumerationOptions { AttributesToSkip = 0 }))
        {
            if (entry is FileInfo && entry.LinkTarget is null && (entry.Name == StateName || IsTemporaryOf(entry.Name, StateName))) own.Add(entry.Name);
            else if (entry is DirectoryInfo units && entry.Name == UnitFolder && entry.LinkTarget is null)
            {
                foreach (var u in units.EnumerateFileSystemInfos("*", new EnumerationOptions { AttributesToSkip = 0 }))
                {
                    if (u is not FileInfo || u.LinkTarget is not null || !IsUnitEntry(u.Name)) { foreign ??= Path.Combine(FolderPath, UnitFolder, u.Name); continue; }
                    own.Add(Path.Combine(UnitFolder, u.Name));
                }
            }
            else foreign ??= entry.FullName;
        }
        return own;
    }

    /// <summary>A unit file's name, or the temporary name of one being written.</summary>
    private static bool IsUnitEntry(string name)
    {
        if (IsUnitName(name)) return true;
        int tmp = name.LastIndexOf(".tmp-", StringComparison.Ordinal);
        return name.StartsWith('.') && tmp > 1 && IsUnitName(name[1..tmp]) && IsTemporaryOf(name, name[1..tmp]);
    }

    private static bool IsUnitName(string name)
    {
        if (!name.EndsWith(UnitExtension, StringComparison.Ordinal)) return false;
        var parts = name[..^UnitExtension.Length].Split('-');
        return parts.Length == 4 && parts[0] is "condition" or "contrast" && parts[2] == "band"
            && parts[1].Length > 0 && parts[1].All(char.IsAsciiDigit) && parts[3].Length > 0 && parts[3].All(char.IsAsciiDigit);
    }

    /// <summary>Whether <paramref name="name"/> is <see cref="AtomicFile"/>'s temporary name for <paramref name="of"/>.</summary>
    private static bool IsTemporaryOf(string name, string of)
    {
        string prefix = $".{of}.tmp-";
        return name.Length == prefix.Length + 12 && name.StartsWith(prefix, StringComparison.Ordinal)
            && name[prefix.Length..].All(c => char.IsAsciiDigit(c) || c is >= 'a' and <= 'f');
    }

    private void Delete(IEnumerable<string> own)
    {
        foreach (string f in own) File.Delete(Path.Combine(FolderPath, f));
    }

    private static RunState? ReadState(string path)
    {
        try
        {
            var state = File.Exists(path) ? JsonSerializer.Deserialize<RunState>(File.ReadAllText(path), StateJson) : null;
            return state?.Format == StateFormat ? state : null;
        }
        catch (Exception e) when (e is IOException or JsonException) { return null; }
    }

    /// <summary>What differs between the earlier run's state and this one's, in words; null when nothing does.</summary>
    private static string? Difference(RunState earlier, RunState now)
    {
        if (earlier.PlanSha256 != now.PlanSha256) return "the plan has changed since";
        var before = earlier.Inputs.ToDictionary(i => i.Path, StringComparer.Ordinal);
        foreach (var input in now.Inputs)
            if (!before.TryGetValue(input.Path, out var old) || old.Sha256 != input.Sha256)
                return $"the input '{input.Path}' has changed since";
        if (earlier.Inputs.Count != now.Inputs.Count) return "the set of input files has changed since";
        return null;
    }

    private static readonly JsonSerializerOptions StateJson = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        WriteIndented = true,
    };

    private sealed record RunState(string Format, string PlanSha256, IReadOnlyList<InputFileRecord> Inputs);
}
