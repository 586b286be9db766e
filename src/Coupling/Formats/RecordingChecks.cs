namespace Coupling.Formats;

/// <summary>Checks on a recording that readers leave to the pipeline.</summary>
public static class RecordingChecks
{
    /// <summary>Labels of channels whose samples are all equal (exact comparison), in channel order.
    /// A channel with no samples counts as flat, since it shows no variation.</summary>
    /// <param name="recording">The recording to check.</param>
    /// <returns>The flat channels' labels; empty when none.</returns>
    public static IReadOnlyList<string> FindFlatChannels(Recording recording)
    {
        var flat = new List<string>();
        for (int c = 0; c < recording.Channels.Count; c++)
        {
            var s = recording.Samples[c].AsSpan();
            if (s.Length == 0 || s.IndexOfAnyExcept(s[0]) < 0)
                flat.Add(recording.Channels[c].Label);
        }
        return flat;
    }
}
