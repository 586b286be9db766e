using Coupling.Formats;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Spectral;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// Input already cut into epochs (NPY, trials x channels x samples) is analysed as the continuous recording it was
/// cut from: when every epoch covers the trial span and its padding, both routes see the same samples and give
/// the same edge table, byte for byte.
/// </summary>
public sealed class EpochsInputTests
{
    [Fact]
    public void Epochs_cut_from_a_recording_give_the_same_edges_as_the_recording()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        const string channels = "[D, A, B]"; // a reordered subset: both routes must select and order alike
        File.WriteAllText(folder["plan.yaml"], SmallStudy.PlanText(channels: channels));
        var continuous = AnalysisRunner.Run(PlanReader.Read(folder["plan.yaml"]));
        byte[] expected = File.ReadAllBytes(Path.Combine(continuous.OutputFolder, "edges.tsv"));

        // Cut epochs from onset - 2.5 s to onset + 3 s of all four channels; they must cover span and padding.
        int pad = BandDecompositions.Create("fir-hilbert", new Band("alpha", 8, 12), SmallStudy.Rate).PadSamples;
        Assert.True(0.25 * SmallStudy.Rate + pad <= 2.5 * SmallStudy.Rate && 0.75 * SmallStudy.Rate + pad <= 3 * SmallStudy.Rate,
            $"padding of {pad} samples does not fit in the epochs");
        var rec = CsvRecording.Read(folder["rec.csv"], SmallStudy.Rate);
        var onsets = EventsTsv.Read(folder["rec_events.tsv"]).Select(e => e.Onset).ToArray();
        int length = (int)(5.5 * SmallStudy.Rate), cc = rec.Channels.Count;
        var data = new double[onsets.Length * cc * length];
        for (int e = 0; e < onsets.Length; e++)
            for (int c = 0; c < cc; c++)
                rec.Samples[c].AsSpan((int)Math.Round((onsets[e] - 2.5) * SmallStudy.Rate), length).CopyTo(data.AsSpan((e * cc + c) * length, length));
        NpyArray.Write(folder["epochs.npy"], [onsets.Length, cc, length], data);
        File.WriteAllLines(folder["labels.txt"], onsets.Select(_ => "go"));
        string plan = SmallStudy.PlanText(channels: channels)
            .Replace("recording: rec.csv", "recording: epochs.npy")
            .Replace("events: rec_events.tsv", "epochs: { first_sample_time: -2.5, labels: labels.txt, channel_labels: [A, B, C, D] }")
            .Replace("output: results", "output: results-epochs");
        File.WriteAllText(folder["plan.yaml"], plan);
        var epochs = AnalysisRunner.Run(PlanReader.Read(folder["plan.yaml"]));

        Assert.Equal(expected, File.ReadAllBytes(Path.Combine(epochs.OutputFolder, "edges.tsv")));
        Assert.Equal(["D", "A", "B"], epochs.Results[0].Channels);
        Assert.Equal(20, Assert.Single(epochs.Conditions).Trials);
    }
}
