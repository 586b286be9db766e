using System.Globalization;

namespace Coupling.Pipeline;

/// <summary>
/// What a run does with samples it cannot analyse: NaN or infinite samples (CSV, NPY), channels whose samples are all
/// equal (flat), and samples clipped at an EDF signal's digital limits (two or more consecutive samples at the digital
/// minimum or maximum: the flat tops of a saturated amplifier; a single sample at a limit is a signal's extreme, not
/// clipping; common practice). The plan key <c>unusable_data</c> chooses one of the policies below.
/// </summary>
public static class UnusableData
{
    /// <summary>Refuse the input, naming the first unusable sample or the flat channel (the default). Clipping is not checked.</summary>
    public const string Refuse = "refuse";

    /// <summary>Leave out flat channels, and every trial (or epoch) whose samples, padding included, hold an unusable sample in an analysed channel.</summary>
    public const string DropTrials = "drop-trials";

    /// <summary>Leave out every channel that is flat or holds an unusable sample anywhere.</summary>
    public const string DropChannels = "drop-channels";

    /// <summary>The policies, as the plan spells them.</summary>
    public static readonly IReadOnlyList<string> Policies = [Refuse, DropTrials, DropChannels];

    /// <summary>Runs of NaN or infinite values in <paramref name="samples"/> as (start, length).</summary>
    public static List<(int Start, int Length)> NonFiniteRuns(ReadOnlySpan<double> samples)
    {
        var runs = new List<(int, int)>();
        int i = 0;
        while (i < samples.Length)
        {
            if (double.IsFinite(samples[i])) { i++; continue; }
            int start = i;
            while (i < samples.Length && !double.IsFinite(samples[i])) i++;
            runs.Add((start, i - start));
        }
        return runs;
    }

    /// <summary>"3 NaN or infinite samples, the first at 1.5 s" for a channel's runs.</summary>
    internal static string Describe(IReadOnlyList<(int Start, int Length)> runs, string kind, double sampleRate) =>
        string.Create(CultureInfo.InvariantCulture,
            $"{runs.Sum(r => r.Length)} {kind} sample(s), the first at {runs[0].Start / sampleRate:0.###} s");
}
