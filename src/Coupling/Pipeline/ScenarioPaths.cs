namespace Coupling.Pipeline;

/// <summary>The files of a written scenario.</summary>
/// <param name="Folder">The folder holding them.</param>
/// <param name="Recording">The EDF+ recording with its events as annotations.</param>
/// <param name="Truth">truth.json.</param>
/// <param name="Plan">A ready plan that analyses the recording into <c>results/</c> beside it.</param>
public sealed record ScenarioPaths(string Folder, string Recording, string Truth, string Plan);
