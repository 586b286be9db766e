namespace Coupling.Cli;

/// <summary>How much a command prints while it runs.</summary>
internal enum Verbosity
{
    /// <summary>No progress; only the results folder, warnings and errors.</summary>
    Quiet,

    /// <summary>Progress (bars on a terminal, a line per stage otherwise) and a summary.</summary>
    Normal,

    /// <summary>As normal, plus what will run before it starts and progress lines with times while stages run.</summary>
    Verbose,
}
