using Coupling.Plans;

namespace Coupling.Pipeline;

/// <summary>The files a plan's run reads: the plan itself, the recording, events, epoch labels and sidecars found beside the recording.</summary>
public static class PlanInputs
{
    /// <summary>
    /// Every input file of <paramref name="plan"/> that exists or is named by it, in a fixed order (plan, recording, events,
    /// epoch labels, sidecars of the recording), without duplicates; absolute paths as the plan holds them.
    /// </summary>
    public static IReadOnlyList<string> Files(Plan plan)
    {
        ArgumentNullException.ThrowIfNull(plan);
        var files = new List<string>();
        if (File.Exists(plan.Source)) files.Add(plan.Source);
        files.Add(plan.Recording);
        if (plan.Events is not null) files.Add(plan.Events);
        if (plan.Epochs is not null) files.Add(plan.Epochs.LabelsFile);
        if (!Path.GetExtension(plan.Recording).Equals(".npy", StringComparison.OrdinalIgnoreCase) && File.Exists(plan.Recording))
        {
            var s = Formats.RecordingSidecars.FindBesides(plan.Recording);
            files.AddRange(new[] { s.Events, s.Channels, s.Electrodes }.OfType<string>());
        }
        return files.Distinct(StringComparer.Ordinal).ToArray();
    }

    /// <summary>
    /// Refuses, before anything is computed, a results folder that is the current folder, holds an input of the plan or is
    /// one, or that exists and may not be replaced (see <see cref="Outputs.OutputSafety"/>).
    /// </summary>
    /// <exception cref="InputException">The plan's output may not be written; the message names the folder and what to do.</exception>
    public static void CheckOutput(Plan plan)
    {
        ArgumentNullException.ThrowIfNull(plan);
        Outputs.OutputSafety.Check(plan.Output, Files(plan), plan.Overwrite, $"{plan.Source}: output");
    }
}
