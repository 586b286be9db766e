using System.Globalization;
using Coupling.Plans;

namespace Coupling.Cli;

/// <summary>A plan file and the command-line options that replace some of its keys.</summary>
/// <param name="PlanPath">The plan file.</param>
/// <param name="Output">Results folder (absolute) replacing the plan's <c>output</c>, or null.</param>
/// <param name="Surrogates">Replaces the plan's <c>surrogates</c>, or null.</param>
/// <param name="Seed">Replaces the plan's <c>seed</c>, or null.</param>
/// <param name="Force">Sets the plan's <c>overwrite</c>.</param>
internal sealed record PlanOverrides(string PlanPath, string? Output, int? Surrogates, ulong? Seed, bool Force)
{
    /// <summary>Reads the plan and applies the options; the surrogate count is checked as the plan key would be.</summary>
    public Plan Read()
    {
        var plan = PlanReader.Read(PlanPath);
        if (Surrogates is { } n)
        {
            if (n < PlanReader.MinSurrogates || n > PlanReader.MaxSurrogates)
                throw new InputException(string.Create(CultureInfo.InvariantCulture,
                    $"--surrogates: {n} is not a whole number from {PlanReader.MinSurrogates} to {PlanReader.MaxSurrogates}."));
            plan = plan with { Surrogates = n };
        }
        if (Seed is { } seed) plan = plan with { Seed = seed };
        if (Output is { } output) plan = plan with { Output = Path.GetFullPath(output) };
        if (Force) plan = plan with { Overwrite = true };
        return plan;
    }
}
