namespace Coupling.Outputs;

/// <summary>
/// A results folder built whole before it appears: files are written into a temporary sibling folder
/// (<c>.&lt;name&gt;.tmp-&lt;random&gt;</c> beside the target) and <see cref="Commit"/> renames it to the target
/// name once the whole run has succeeded. Disposing without a commit deletes the temporary folder.
/// </summary>
/// <remarks>
/// When the target already exists it is replaced only on success: <see cref="Commit"/> first renames the old
/// folder aside (<c>.&lt;name&gt;.old-&lt;random&gt;</c>), renames the new one into place, then deletes the old
/// one. If the second rename fails the old folder is renamed back. A run that fails or is stopped before the
/// commit therefore leaves the old results intact and no partial folder under the target name; only a
/// process killed outright can leave a hidden temporary sibling, which <see cref="RemoveLeftovers"/> clears.
/// </remarks>
public sealed class OutputFolder : IDisposable
{
    private OutputFolder(string target, string working)
    {
        TargetPath = target;
        WorkingPath = working;
    }

    /// <summary>Full path the folder gets on <see cref="Commit"/>.</summary>
    public string TargetPath { get; }

    /// <summary>Full path of the temporary folder to write into until the commit.</summary>
    public string WorkingPath { get; }

    /// <summary>Whether <see cref="Commit"/> has put the folder in place.</summary>
    public bool IsCommitted { get; private set; }

    /// <summary>
    /// Starts a results folder for <paramref name="targetPath"/>: creates the parent folder when missing and
    /// an empty temporary sibling to write into.
    /// </summary>
    /// <exception cref="InputException"><paramref name="targetPath"/> is an existing file.</exception>
    public static OutputFolder Begin(string targetPath)
    {
        ArgumentException.ThrowIfNullOrEmpty(targetPath);
        string full = Path.GetFullPath(targetPath.TrimEnd(Path.DirectorySeparatorChar, Path.AltDirectorySeparatorChar));
        if (File.Exists(full))
            throw new InputException($"Output folder '{targetPath}' is an existing file; expected a folder path.");
        string parent = Path.GetDirectoryName(full) ?? throw new ArgumentException($"'{targetPath}' has no parent folder.", nameof(targetPath));
        Directory.CreateDirectory(parent);
        string working = Path.Combine(parent, AtomicFile.TemporaryName(Path.GetFileName(full)));
        Directory.CreateDirectory(working);
        return new OutputFolder(full, working);
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
    /// Puts the finished folder in place under <see cref="TargetPath"/>, replacing an existing one (see remarks
    /// of the type). Call once, after every file has been written.
    /// </summary>
    /// <exception cref="InvalidOperationException">Already committed, or the working folder is gone.</exception>
    public void Commit()
    {
        if (IsCommitted) throw new InvalidOperationException($"Output folder '{TargetPath}' is already committed.");
        if (!Directory.Exists(WorkingPath))
            throw new InvalidOperationException($"Working folder '{WorkingPath}' no longer exists.");
        string? aside = null;
        if (Directory.Exists(TargetPath))
        {
            aside = Path.Combine(Path.GetDirectoryName(TargetPath)!, $".{Path.GetFileName(TargetPath)}.old-{AtomicFile.RandomSuffix()}");
            Directory.Move(TargetPath, aside);
        }
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
        if (aside is not null) TryDelete(aside);
    }

    /// <summary>Deletes the working folder and everything in it unless the folder was committed.</summary>
    public void Dispose()
    {
        if (!IsCommitted) TryDelete(WorkingPath);
    }

    /// <summary>
    /// Deletes hidden temporary and set-aside siblings of <paramref name="targetPath"/> left by killed runs.
    /// A set-aside older folder is put back instead when the target itself is missing (a run killed between setting
    /// the old results aside and renaming the new ones in), so earlier results are never lost.
    /// Not to be called while another run is writing to the same target.
    /// </summary>
    /// <returns>The number of folders removed.</returns>
    public static int RemoveLeftovers(string targetPath)
    {
        string full = Path.GetFullPath(targetPath.TrimEnd(Path.DirectorySeparatorChar, Path.AltDirectorySeparatorChar));
        string? parent = Path.GetDirectoryName(full);
        if (parent is null || !Directory.Exists(parent)) return 0;
        string name = Path.GetFileName(full);
        int removed = 0;
        if (!Directory.Exists(full) && !File.Exists(full))
        {
            string? aside = Directory.EnumerateDirectories(parent, $".{name}.old-*").OrderBy(d => Directory.GetLastWriteTimeUtc(d)).LastOrDefault();
            if (aside is not null) Directory.Move(aside, full);
        }
        foreach (string pattern in new[] { $".{name}.tmp-*", $".{name}.old-*" })
            foreach (string dir in Directory.EnumerateDirectories(parent, pattern))
                if (TryDelete(dir)) removed++;
        return removed;
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
