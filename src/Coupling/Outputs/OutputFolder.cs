namespace Coupling.Outputs;

/// <summary>
/// A results folder built whole before it appears: files are written into a temporary sibling folder
/// (<c>.&lt;name&gt;.tmp-&lt;random&gt;</c> beside the target) and <see cref="Commit"/> renames it to the target
/// name once the whole run has succeeded. Disposing without a commit deletes the temporary folder.
/// </summary>
/// <remarks>
/// <para>An existing folder at the target is replaced only as <see cref="OutputSafety.CheckReplaceable"/> allows: when it
/// is empty, or when replacing was asked for and it is an earlier results folder of this tool holding only files its
/// manifest lists. <see cref="Commit"/> checks this again, renames the old folder aside (<c>.&lt;name&gt;.old-&lt;random&gt;</c>),
/// checks it once more there (moving it back and refusing if anything was added meanwhile), renames the new one into
/// place, then deletes from the old one only the files its manifest lists. If the second rename fails the old folder is
/// renamed back.</para>
/// <para>A run that fails or is stopped before the commit therefore leaves the old results intact and no partial folder
/// under the target name; only a process killed outright can leave a hidden temporary sibling, which
/// <see cref="RemoveLeftovers"/> clears. The temporary folder holds a marker file (<see cref="WorkingMarker"/>) until the
/// commit, so that only folders this class made are ever deleted as leftovers.</para>
/// </remarks>
public sealed class OutputFolder : IDisposable
{
    /// <summary>Name of the marker file a working folder holds until it is committed.</summary>
    public const string WorkingMarker = ".coupling-working";

    private readonly bool _replace;
    private readonly string _setting;

    private OutputFolder(string target, string working, bool replace, string setting)
    {
        TargetPath = target;
        WorkingPath = working;
        _replace = replace;
        _setting = setting;
    }

    /// <summary>Full path the folder gets on <see cref="Commit"/>.</summary>
    public string TargetPath { get; }

    /// <summary>Full path of the temporary folder to write into until the commit.</summary>
    public string WorkingPath { get; }

    /// <summary>Whether <see cref="Commit"/> has put the folder in place.</summary>
    public bool IsCommitted { get; private set; }

    /// <summary>
    /// Starts a results folder for <paramref name="targetPath"/>: checks that whatever is there may be replaced, creates
    /// the parent folder when missing and an empty temporary sibling to write into.
    /// </summary>
    /// <param name="targetPath">The results folder.</param>
    /// <param name="replace">Whether an earlier results folder of this tool at the target may be replaced.</param>
    /// <param name="setting">How the user named the target, for messages; the path itself when null.</param>
    /// <exception cref="InputException">Something is at the target that may not be replaced (see <see cref="OutputSafety.CheckReplaceable"/>).</exception>
    public static OutputFolder Begin(string targetPath, bool replace = false, string? setting = null)
    {
        ArgumentException.ThrowIfNullOrEmpty(targetPath);
        string full = Path.GetFullPath(targetPath.TrimEnd(Path.DirectorySeparatorChar, Path.AltDirectorySeparatorChar));
        setting ??= $"output '{targetPath}'";
        OutputSafety.CheckReplaceable(full, replace, setting);
        string parent = Path.GetDirectoryName(full) ?? throw new ArgumentException($"'{targetPath}' has no parent folder.", nameof(targetPath));
        Directory.CreateDirectory(parent);
        string working = Path.Combine(parent, AtomicFile.TemporaryName(Path.GetFileName(full)));
        Directory.CreateDirectory(working);
        File.WriteAllText(Path.Combine(working, WorkingMarker), "");
        return new OutputFolder(full, working, replace, setting);
    }

    /// <summary>Full path of <paramref name="relativePath"/> inside the working folder, creating its subfolders.</summary>
    /// <exception cref="ArgumentException">The path is rooted or climbs out of the folder.</exception>
    public string PathOf(string relativePath)
    {
        ArgumentException.ThrowIfNullOrEmpty(relativePath);
        ObjectDisposedException.ThrowIf(IsCommitted, this);
        string full = Path.GetFullPath(Path.Combine(WorkingPath, relativePath));
        string root = WorkingPath + Path.DirectorySeparatorChar;
        if (Path.IsPathRooted(relativePath) || !full.StartsWith(root, StringComparison.Ordinal))
            throw new ArgumentException($"'{relativePath}' is not a path inside the output folder.", nameof(relativePath));
        Directory.CreateDirectory(Path.GetDirectoryName(full)!);
        return full;
    }

    /// <summary>
    /// Puts the finished folder in place under <see cref="TargetPath"/>, replacing an existing one only as allowed (see
    /// remarks of the type). Call once, after every file has been written.
    /// </summary>
    /// <exception cref="InvalidOperationException">Already committed, or the working folder is gone.</exception>
    /// <exception cref="InputException">The target has changed since <see cref="Begin"/> so that it may no longer be replaced.</exception>
    public void Commit()
    {
        if (IsCommitted) throw new InvalidOperationException($"Output folder '{TargetPath}' is already committed.");
        if (!Directory.Exists(WorkingPath))
            throw new InvalidOperationException($"Working folder '{WorkingPath}' no longer exists.");
        string? aside = null;
        IReadOnlyList<string> old = [];
        if (Directory.Exists(TargetPath) || File.Exists(TargetPath))
        {
            OutputSafety.CheckReplaceable(TargetPath, _replace, _setting);
            aside = Path.Combine(Path.GetDirectoryName(TargetPath)!, $".{Path.GetFileName(TargetPath)}.old-{AtomicFile.RandomSuffix()}");
            Directory.Move(TargetPath, aside);
            try { old = OutputSafety.CheckReplaceable(aside, _replace, _setting); }
            catch
            {
                Directory.Move(aside, TargetPath);
                throw;
            }
        }
        File.Delete(Path.Combine(WorkingPath, WorkingMarker));
        try
        {
            Directory.Move(WorkingPath, TargetPath);
        }
        catch
        {
            if (aside is not null) Directory.Move(aside, TargetPath);
            throw;
        }
        IsCommitted = true;
        if (aside is not null) TryDeleteListed(aside, old);
    }

    /// <summary>Deletes the working folder and everything in it unless the folder was committed.</summary>
    public void Dispose()
    {
        if (!IsCommitted) TryDelete(WorkingPath);
    }

    /// <summary>
    /// Clears what killed runs left beside <paramref name="targetPath"/>, touching nothing else: hidden working folders of
    /// this class (named <c>.&lt;name&gt;.tmp-</c> and 12 hex digits, holding <see cref="WorkingMarker"/>) are deleted; a
    /// set-aside earlier results folder (<c>.&lt;name&gt;.old-</c> and 12 hex digits) is put back when the target itself is
    /// missing (a run killed between setting it aside and renaming the new one in), and otherwise has the files its
    /// manifest lists deleted, and only when it holds nothing else. Any other folder, including one that only looks like
    /// a leftover, stays as it is. Not to be called while another run is writing to the same target.
    /// </summary>
    /// <returns>The number of folders removed.</returns>
    public static int RemoveLeftovers(string targetPath)
    {
        string full = Path.GetFullPath(targetPath.TrimEnd(Path.DirectorySeparatorChar, Path.AltDirectorySeparatorChar));
        string? parent = Path.GetDirectoryName(full);
        if (parent is null || !Directory.Exists(parent)) return 0;
        string name = Path.GetFileName(full);
        var asides = Leftovers(parent, $".{name}.old-").Where(d => OwnResults(d) is not null).ToList();
        if (!Directory.Exists(full) && !File.Exists(full))
        {
            string? newest = asides.OrderBy(Directory.GetLastWriteTimeUtc).LastOrDefault();
            if (newest is not null)
            {
                Directory.Move(newest, full);
                asides.Remove(newest);
            }
        }
        int removed = 0;
        foreach (string dir in Leftovers(parent, $".{name}.tmp-"))
            if (File.Exists(Path.Combine(dir, WorkingMarker)) && TryDelete(dir)) removed++;
        foreach (string dir in asides)
            if (OwnResults(dir) is { } files && TryDeleteListed(dir, files)) removed++;
        return removed;
    }

    /// <summary>Folders (not links) in <paramref name="parent"/> named <paramref name="prefix"/> and 12 lowercase hex digits.</summary>
    private static IEnumerable<string> Leftovers(string parent, string prefix) =>
        Directory.EnumerateDirectories(parent, prefix + "*")
            .Where(d =>
            {
                string n = Path.GetFileName(d);
                return n.Length == prefix.Length + 12 && n.StartsWith(prefix, StringComparison.Ordinal)
                    && n[prefix.Length..].All(c => char.IsAsciiDigit(c) || c is >= 'a' and <= 'f')
                    && new DirectoryInfo(d).LinkTarget is null;
            })
            .ToList();

    /// <summary>The files of an earlier results folder that holds nothing else, or null.</summary>
    private static IReadOnlyList<string>? OwnResults(string folder)
    {
        try { return OutputSafety.CheckReplaceable(folder, replace: true, folder); }
        catch (InputException) { return null; }
    }

    private static bool TryDeleteListed(string folder, IEnumerable<string> files)
    {
        try { return OutputSafety.DeleteListed(folder, files); }
        catch (IOException) { return false; }
        catch (UnauthorizedAccessException) { return false; }
    }

    private static bool TryDelete(string folder)
    {
        try
        {
            if (Directory.Exists(folder)) Directory.Delete(folder, recursive: true);
            return true;
        }
        catch (IOException) { return false; }
        catch (UnauthorizedAccessException) { return false; }
    }
}
