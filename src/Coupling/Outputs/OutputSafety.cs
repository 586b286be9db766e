namespace Coupling.Outputs;

/// <summary>
/// Decides whether a results folder may be written at a place, so that no file the tool did not write is ever deleted,
/// moved or overwritten.
/// </summary>
/// <remarks>
/// <para>The place is refused when it is the current folder or one of its ancestors, an input file itself, or a folder
/// that holds an input (at any depth): replacing it would take the input with it.</para>
/// <para>An existing folder at the place is replaced only when (1) the user asked for it, (2) its <c>manifest.json</c>
/// says it is a results folder of this tool (<see cref="Manifest.Format"/>) and (3) every file in it is one the manifest
/// lists as written by the run (no links, nothing added since). An empty folder may be used as it is.</para>
/// <para>Paths are compared after resolving symbolic links in every existing component, so a link to the recording's
/// folder is recognised as that folder.</para>
/// </remarks>
public static class OutputSafety
{
    /// <summary>Name of the manifest file in a results folder.</summary>
    public const string ManifestName = "manifest.json";

    /// <summary>
    /// Refuses a results folder at <paramref name="target"/> that is the current folder or an ancestor of it, an input, or
    /// a folder holding an input; then checks an existing folder there with <see cref="CheckReplaceable"/>.
    /// </summary>
    /// <param name="target">The results folder.</param>
    /// <param name="inputs">Every file the run reads (recording, events, sidecars, the plan itself).</param>
    /// <param name="replace">Whether the user asked to replace an earlier results folder.</param>
    /// <param name="setting">How the user named the place, for messages (e.g. "plan.yaml: output").</param>
    /// <exception cref="InputException">The place is refused; the message names it and what to do.</exception>
    public static void Check(string target, IEnumerable<string> inputs, bool replace, string setting)
    {
        ArgumentException.ThrowIfNullOrEmpty(target);
        ArgumentNullException.ThrowIfNull(inputs);
        string full = Canonical(target);
        string current = Canonical(Directory.GetCurrentDirectory());
        if (SameOrInside(current, full))
            throw new InputException(current == full
                ? $"{setting}: the results folder '{full}' is the current folder; name a new folder for the results (e.g. 'results')."
                : $"{setting}: the results folder '{full}' holds the current folder '{current}'; name a new folder for the results (e.g. 'results').");
        foreach (string input in inputs)
        {
            string file = Canonical(input);
            if (file == full)
                throw new InputException($"{setting}: the results folder '{full}' is an input of the run; name a new folder for the results.");
            if (SameOrInside(file, full))
                throw new InputException($"{setting}: the results folder '{full}' holds the input '{file}' and would replace it; name a new folder for the results (e.g. 'results' beside the plan).");
        }
        CheckReplaceable(full, replace, setting);
    }

    /// <summary>
    /// Checks that an existing file system entry at <paramref name="target"/> may be replaced by a new results folder, and
    /// returns the files of it to delete then (relative, '/' separated; empty when nothing is there or the folder is empty).
    /// </summary>
    /// <exception cref="InputException">A file is there, or a folder that is not an earlier results folder of this tool, or
    /// one holding files the tool did not write, or <paramref name="replace"/> is false for an earlier results folder.</exception>
    public static IReadOnlyList<string> CheckReplaceable(string target, bool replace, string setting)
    {
        string full = Path.GetFullPath(target);
        if (File.Exists(full))
            throw new InputException($"{setting}: '{full}' is an existing file; the results need a folder. Name a new folder.");
        for (string? up = Path.GetDirectoryName(full); up is not null; up = Path.GetDirectoryName(up))
        {
            if (Directory.Exists(up)) break;
            if (File.Exists(up))
                throw new InputException($"{setting}: '{full}' cannot be made, since '{up}' is a file, not a folder. Name a folder whose parent is a folder.");
        }
        if (!Directory.Exists(full)) return [];
        if (new DirectoryInfo(full).LinkTarget is not null)
            throw new InputException($"{setting}: '{full}' is a link to another folder; it is left as it is. Name a new folder for the results.");
        var present = FilesIn(full, out string? link);
        if (link is not null)
            throw new InputException($"{setting}: the folder '{full}' already exists and holds the link '{link}', which this tool never writes; it is left as it is. Name a new folder, or move it away yourself.");
        if (present.Count == 0 && Directory.GetFileSystemEntries(full).Length == 0) return [];
        var own = OwnFiles(full);
        if (own is null)
            throw new InputException($"{setting}: the folder '{full}' already exists and is not a results folder of this tool (no manifest.json saying so); nothing was written and nothing there was touched. Name a new folder for the results.");
        var foreign = present.Where(f => !own.Contains(f)).Order(StringComparer.Ordinal).ToArray();
        if (foreign.Length > 0)
            throw new InputException($"{setting}: the folder '{full}' holds earlier results but also {foreign.Length} file(s) this tool did not write " +
                $"({string.Join(", ", foreign.Take(5))}{(foreign.Length > 5 ? ", ..." : "")}); it is left as it is. Move those files away, or name a new folder.");
        if (!replace)
            throw new InputException($"{setting}: the folder '{full}' holds earlier results; give --force (or 'overwrite: true' in the plan) to replace them, or name a new folder.");
        return present;
    }

    /// <summary>
    /// The files <paramref name="folder"/>'s manifest lists as written by the run, when the manifest marks it as a results
    /// folder of this tool (<see cref="Manifest.ResultsFormat"/>); null otherwise (no manifest, unreadable, unmarked, or
    /// listing a path outside the folder).
    /// </summary>
    public static IReadOnlySet<string>? OwnFiles(string folder)
    {
        string path = Path.Combine(folder, ManifestName);
        if (!File.Exists(path)) return null;
        Manifest manifest;
        try { manifest = ManifestReader.Read(path); }
        catch (InputException) { return null; }
        if (manifest.Format != Manifest.ResultsFormat || !manifest.Outputs.Contains(ManifestName)) return null;
        string root = Path.GetFullPath(folder) + Path.DirectorySeparatorChar;
        foreach (string listed in manifest.Outputs)
        {
            if (listed.Length == 0 || Path.IsPathRooted(listed) || listed.Contains('\\')) return null;
            if (!Path.GetFullPath(Path.Combine(folder, listed)).StartsWith(root, StringComparison.Ordinal)) return null;
        }
        return manifest.Outputs.ToHashSet(StringComparer.Ordinal);
    }

    /// <summary>
    /// Deletes from <paramref name="folder"/> the files listed in <paramref name="files"/> (relative, '/' separated), then
    /// every subfolder left empty, then the folder itself when empty. Anything not listed stays where it is.
    /// </summary>
    /// <returns>Whether the folder is gone.</returns>
    public static bool DeleteListed(string folder, IEnumerable<string> files)
    {
        string root = Path.GetFullPath(folder) + Path.DirectorySeparatorChar;
        foreach (string f in files)
        {
            string path = Path.GetFullPath(Path.Combine(folder, f));
            if (!path.StartsWith(root, StringComparison.Ordinal)) continue;
            var info = new FileInfo(path);
            if (info.Exists && info.LinkTarget is null) info.Delete();
        }
        DeleteEmptyFolders(folder);
        return !Directory.Exists(folder);
    }

    /// <summary>Deletes <paramref name="folder"/> and its subfolders bottom-up, each only when empty; links are left alone.</summary>
    internal static void DeleteEmptyFolders(string folder)
    {
        var info = new DirectoryInfo(folder);
        if (!info.Exists || info.LinkTarget is not null) return;
        foreach (var sub in info.EnumerateDirectories()) DeleteEmptyFolders(sub.FullName);
        if (!info.EnumerateFileSystemInfos().Any())
        {
            try { info.Delete(); }
            catch (IOException) { }
        }
    }

    /// <summary>Every file under <paramref name="folder"/> (hidden ones too), relative and '/' separated; stops at the first link.</summary>
    private static List<string> FilesIn(string folder, out string? link)
    {
        var files = new List<string>();
        link = null;
        var pending = new Stack<DirectoryInfo>();
        pending.Push(new DirectoryInfo(folder));
        while (pending.Count > 0)
        {
            foreach (var entry in pending.Pop().EnumerateFileSystemInfos("*", new EnumerationOptions { AttributesToSkip = 0, RecurseSubdirectories = false }))
            {
                string relative = Path.GetRelativePath(folder, entry.FullName).Replace('\\', '/');
                if (entry.LinkTarget is not null) { link = relative; return files; }
                if (entry is DirectoryInfo sub) pending.Push(sub);
                else files.Add(relative);
            }
        }
        return files;
    }

    /// <summary>Whether <paramref name="path"/> is <paramref name="folder"/> or lies inside it (both canonical).</summary>
    private static bool SameOrInside(string path, string folder) =>
        path == folder || path.StartsWith(folder.EndsWith(Path.DirectorySeparatorChar) ? folder : folder + Path.DirectorySeparatorChar, StringComparison.Ordinal);

    /// <summary>The absolute path with every existing symbolic link along it resolved, without a trailing separator.</summary>
    internal static string Canonical(string path)
    {
        string full = Path.GetFullPath(path);
        string root = Path.GetPathRoot(full) ?? "";
        string result = root;
        foreach (string part in full[root.Length..].Split(Path.DirectorySeparatorChar, StringSplitOptions.RemoveEmptyEntries))
        {
            result = Path.Combine(result, part);
            FileSystemInfo info = Directory.Exists(result) ? new DirectoryInfo(result) : new FileInfo(result);
            try
            {
                if (info.Exists && info.LinkTarget is not null && info.ResolveLinkTarget(returnFinalTarget: true) is { } target)
                    result = Path.GetFullPath(target.FullName);
            }
            catch (IOException) { }
        }
        return result.Length > root.Length ? result.TrimEnd(Path.DirectorySeparatorChar) : result;
    }
}
