namespace Coupling.Pipeline;

/// <summary>Progress of a run, for a terminal or log: the stage, and how far along it is.</summary>
/// <param name="Stage">What is being done, e.g. "cue / theta: surrogates".</param>
/// <param name="Done">Units done in this stage.</param>
/// <param name="Total">Units in this stage (0 when the stage has no count).</param>
public sealed record RunProgress(string Stage, int Done, int Total);
