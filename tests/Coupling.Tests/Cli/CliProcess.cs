using System.Diagnostics;

namespace Coupling.Tests.Cli;

/// <summary>The command-line program started as a process of its own (the built Coupling.Cli.dll beside the tests, run by dotnet).</summary>
internal sealed class CliProcess : IDisposable
{
    private readonly Process _process;
    private readonly List<string> _errorLines = [];

    public CliProcess(string workingFolder, params string[] args)
    {
        var start = new ProcessStartInfo(Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } host ? host : "dotnet")
        {
            WorkingDirectory = workingFolder,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        start.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "Coupling.Cli.dll"));
        foreach (var a in args) start.ArgumentList.Add(a);
        _process = new Process { StartInfo = start };
        _process.ErrorDataReceived += (_, e) => { if (e.Data is not null) lock (_errorLines) _errorLines.Add(e.Data); };
        _process.OutputDataReceived += (_, _) => { };
        _process.Start();
        _process.BeginErrorReadLine();
        _process.BeginOutputReadLine();
    }

    /// <summary>Lines written to stderr so far.</summary>
    public int ErrorLineCount
    {
        get { lock (_errorLines) return _errorLines.Count; }
    }

    public string ErrorText
    {
        get { lock (_errorLines) return string.Join("\n", _errorLines); }
    }

    public bool HasExited => _process.HasExited;

    public int ExitCode => _process.ExitCode;

    /// <summary>Kills the process outright (SIGKILL on Unix) and waits for it to be gone.</summary>
    public void Kill()
    {
        try { _process.Kill(entireProcessTree: false); }
        catch (InvalidOperationException) { }
        _process.WaitForExit();
    }

    public void WaitForExit() => _process.WaitForExit();

    public void Dispose()
    {
        if (!_process.HasExited) Kill();
        _process.Dispose();
    }
}
