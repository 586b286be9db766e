using System.Text.Json.Nodes;
using Coupling.Figures;
using Coupling.Measures;
using Coupling.Outputs;

namespace Coupling.Pipeline;

/// <summary>Writes the frequency- and time-resolved results into the results folder (docs/outputs.md, "Spectra").</summary>
/// <remarks>
/// Tables under <c>spectrum/</c>: <c>spectrum.tsv</c>, with <c>spectrum.time</c> <c>time_frequency.tsv</c>, with
/// <c>spectrum.cluster_test</c> <c>clusters.tsv</c> and <c>cluster_cells.tsv</c>. Figures (when the plan draws them)
/// under <c>figures/spectrum/</c>, for the figure pair only: per measure the spectrum of every condition, per condition
/// x measure the time-frequency map (the change from baseline when there is one), and the cluster test's map.
/// </remarks>
public static class SpectrumWriter
{
    /// <summary>The manifest's <c>cluster_test.evoked</c> when the trials were tested as recorded.</summary>
    public const string EvokedKept = "kept";

    /// <summary>The manifest's <c>cluster_test.evoked</c> when each group of every labelling had its own trial mean removed
    /// inside the test (docs/methods.md, section 12).</summary>
    public const string EvokedRemovedPerGroup = "removed per group in every labelling";

    /// <summary>Writes everything; returns the paths written, relative to the folder, with '/' separators.</summary>
    /// <param name="spectrum">The results.</param>
    /// <param name="figures">Whether figures are drawn.</param>
    /// <param name="pathOf">Maps a relative path to its place in the folder being written.</param>
    public static IReadOnlyList<string> Write(SpectrumAnalysis spectrum, bool figures, Func<string, string> pathOf)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        var written = new List<string>();
        Directory.CreateDirectory(pathOf("spectrum"));
        TimeFrequencyTableWriter.WriteSpectrum(spectrum.Spectrum, pathOf("spectrum/spectrum.tsv"));
        written.Add("spectrum/spectrum.tsv");
        if (spectrum.TimeCourse.Count > 0)
        {
            TimeFrequencyTableWriter.WriteTimeCourse(spectrum.TimeCourse, pathOf("spectrum/time_frequency.tsv"));
            written.Add("spectrum/time_frequency.tsv");
        }
        if (spectrum.ClusterTest is { } test)
        {
            ClusterTableWriter.WriteClusters(test, pathOf("spectrum/clusters.tsv"));
            ClusterTableWriter.WriteCells(test, pathOf("spectrum/cluster_cells.tsv"));
            written.Add("spectrum/clusters.tsv");
            written.Add("spectrum/cluster_cells.tsv");
        }
        if (!figures) return written;

        Directory.CreateDirectory(pathOf("figures/spectrum"));
        var pair = spectrum.FigurePair;
        string pairName = $"{OutputNames.Sanitise(pair.A)}-{OutputNames.Sanitise(pair.B)}";
        bool Shown(TimeFrequency.TimeFrequencyValues v) => v.ChannelA == pair.A && v.ChannelB == pair.B;
        // Every figure as PNG and SVG, like the other figures of a run.
        void Draw(string stem, Action<string[]> save)
        {
            string[] files = [$"figures/spectrum/{stem}.png", $"figures/spectrum/{stem}.svg"];
            save(files.Select(pathOf).ToArray());
            written.AddRange(files);
        }
        foreach (var measure in spectrum.Spec.Measures.Select(MeasureCatalog.Key))
            Draw($"{pairName}_{OutputNames.Sanitise(measure)}_spectrum",
                paths => SpectrumFigure.Save(spectrum.Spectrum.Where(v => Shown(v) && v.Measure == measure).ToArray(), paths));
        foreach (var values in spectrum.TimeCourse.Where(Shown))
            Draw($"{pairName}_{OutputNames.Sanitise(values.Condition)}_{OutputNames.Sanitise(values.Measure)}_time_frequency",
                paths => TimeFrequencyFigure.Save(values, paths, change: values.Change is not null));
        if (spectrum.ClusterTest is { } result)
            Draw($"{OutputNames.Sanitise(result.ChannelA)}-{OutputNames.Sanitise(result.ChannelB)}_{OutputNames.Sanitise(result.Measure)}_{OutputNames.Sanitise(result.ConditionA)}-vs-{OutputNames.Sanitise(result.ConditionB)}_clusters",
                paths => TimeFrequencyFigure.SaveClusters(result, paths));
        return written;
    }

    /// <summary>What the manifest records of the spectrum settings actually used.</summary>
    public static JsonObject ManifestNode(SpectrumAnalysis spectrum)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        var spec = spectrum.Spec;
        var node = new JsonObject
        {
            ["method"] = spec.Method,
            ["frequencies_hz"] = new JsonArray(spec.Frequencies.Select(f => (JsonNode)JsonValue.Create(f)!).ToArray()),
            ["pad_samples"] = spectrum.PadSamples,
            ["figure_pair"] = new JsonArray(spectrum.FigurePair.A, spectrum.FigurePair.B),
        };
        if (spec.Method == "morlet") node["cycles"] = spec.Cycles;
        else
        {
            node["half_bandwidth_hz"] = spec.HalfBandwidthHz;
            node["tapers_per_window"] = new JsonArray(spectrum.TapersPerWindow!.Select(k => (JsonNode)JsonValue.Create(k)!).ToArray());
        }
        if (spectrum.TimeCourse.Count > 0)
            node["time_bins_s"] = new JsonArray(spectrum.TimeCourse[0].Times.Select(t => (JsonNode)JsonValue.Create(t)!).ToArray());
        if (spectrum.ClusterTest is { } test)
            node["cluster_test"] = new JsonObject
            {
                ["seed"] = spectrum.ClusterSeed,
                ["draws"] = test.Draws,
                ["threshold"] = test.Threshold,
                ["z_threshold"] = test.ZThreshold,
                ["trials"] = new JsonArray(test.TrialsA, test.TrialsB),
                ["evoked"] = test.EvokedRemoved ? EvokedRemovedPerGroup : EvokedKept,
            };
        return node;
    }
}
