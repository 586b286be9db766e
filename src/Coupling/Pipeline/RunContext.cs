namespace Coupling.Pipeline;

/// <summary>Facts about the run itself that go into the manifest.</summary>
/// <param name="Started">When the run started (UTC).</param>
/// <param name="Elapsed">Time taken by the analysis before writing.</param>
/// <param name="CommandLine">The command line, if known.</param>
/// <param name="Threads">Worker threads asked for (0: all cores).</param>
/// <param name="ResumedUnits">Work units loaded from an interrupted earlier run rather than computed; null or empty for none.</param>
public sealed record RunContext(DateTimeOffset Started, TimeSpan Elapsed, string? CommandLine, int Threads, IReadOnlyList<string>? ResumedUnits = null);
