using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.Json.Serialization;
using Coupling.Artefacts;
using Coupling.Figures;
using Coupling.Graphs;
using Coupling.Outputs;
using Coupling.Plans;
using Coupling.Reports;
using Coupling.Results;

namespace Coupling.Pipeline;

/// <summary>Writes the results folder of a run: tables, matrices, graphs, figures, manifest and report.</summary>
/// <remarks>
/// Everything is written into a temporary sibling folder that is renamed into place only when all of it is written
/// (<see cref="OutputFolder"/>): a stopped or failed run leaves no partial results and keeps an older folder.
/// Layout (docs/outputs.md): report.html, manifest.json, edges.tsv, nodes.tsv, graphs.tsv, flags.tsv, matrices/, graphs/, figures/, and with
/// contrasts in the plan contrasts.tsv, matrices/contrasts/ and figures/contrasts/.
/// </remarks>
public static class ResultsWriter
{
    private static readonly JsonSerializerOptions PlanJson = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.KebabCaseLower) },
    };

    /// <summary>Writes everything; returns the results folder's path.</summary>
    public static string Write(Plan plan, LoadedInput input, Analysis analysis, RunContext context, IProgress<RunProgress>? progress)
    {
        OutputFolder.RemoveLeftovers(plan.Output);
        using var folder = OutputFolder.Begin(plan.Output, plan.Overwrite, $"{plan.Source}: output");
        var written = new List<string>();
        string Rel(string path) => Path.GetRelativePath(folder.WorkingPath, path).Replace('\\', '/');

        Directory.CreateDirectory(folder.PathOf("matrices"));
        Directory.CreateDirectory(folder.PathOf("graphs"));
        if (plan.Figures) Directory.CreateDirectory(folder.PathOf("figures"));

        EdgeTableWriter.Write(analysis.Results, folder.PathOf("edges.tsv"));
        written.Add("edges.tsv");

        var graphs = new List<(string, string, string, ChannelGraph)>();
        int done = 0, total = analysis.Results.Count;
        foreach (var r in analysis.Results)
        {
            progress?.Report(new RunProgress("writing results", done++, total));
            written.AddRange(MatrixCsvWriter.Write(r, folder.PathOf("matrices")).Select(Rel));
            var graph = ChannelGraphs.Build(r);
            graphs.Add((r.Condition, r.Band, r.Measure, graph));
            string stem = OutputNames.Stem(r);
            GraphMlWriter.Write(graph, r, folder.PathOf($"graphs/{stem}.graphml"));
            written.Add($"graphs/{stem}.graphml");
            if (plan.Figures)
            {
                foreach (var (kind, save) in Figures(r, null, plan.Surrogates > 0))
                {
                    if (kind == "network" && plan.Surrogates == 0) continue; // values only: no significant pairs to draw a network of
                    string[] files = [$"figures/{stem}_{kind}.png", $"figures/{stem}_{kind}.svg"];
                    save(files.Select(folder.PathOf).ToArray());
                    written.AddRange(files);
                }
            }
        }
        progress?.Report(new RunProgress("writing results", total, total));
        NodeTableWriter.Write(graphs, folder.PathOf("nodes.tsv"));
        written.Add("nodes.tsv");
        GraphTableWriter.Write(graphs, folder.PathOf("graphs.tsv"));
        written.Add("graphs.tsv");

        if (analysis.Contrasts.Count > 0)
        {
            ContrastTableWriter.Write(analysis.Contrasts, folder.PathOf("contrasts.tsv"));
            written.Add("contrasts.tsv");
            Directory.CreateDirectory(folder.PathOf("matrices/contrasts"));
            if (plan.Figures) Directory.CreateDirectory(folder.PathOf("figures/contrasts"));
            foreach (var c in analysis.Contrasts)
            {
                var difference = c.AsDifference();
                written.AddRange(MatrixCsvWriter.Write(difference, folder.PathOf("matrices/contrasts")).Select(Rel));
                if (plan.Figures)
                {
                    string stem = OutputNames.Stem(difference);
                    string label = $"{difference.Measure} difference";
                    foreach (var (kind, save) in Figures(difference, label, plan.Surrogates > 0))
                    {
                        if (kind == "network" && plan.Surrogates == 0) continue;
                        string[] files = [$"figures/contrasts/{stem}_{kind}.png", $"figures/contrasts/{stem}_{kind}.svg"];
                        save(files.Select(folder.PathOf).ToArray());
                        written.AddRange(files);
                    }
                }
            }
        }

        if (analysis.Spectrum is not null) written.AddRange(SpectrumWriter.Write(analysis.Spectrum, plan.Figures, folder.PathOf));

        if (analysis.Directions is not null)
        {
            DirectionTableWriter.Write(analysis.Directions, folder.PathOf("directions.tsv"));
            written.Add("directions.tsv");
        }

        var flags = ArtefactFlags.Find(analysis.Results, analysis.Signals ?? [], plan.SubtractEvoked);
        FlagTableWriter.Write(flags, folder.PathOf("flags.tsv"));
        written.Add("flags.tsv");
        if (plan.Figures && analysis.Results.Count > 0)
        {
            OverviewFigure.Save(analysis.Results, folder.PathOf($"figures/{HtmlReport.OverviewFile}"));
            OverviewFigure.Save(analysis.Results, folder.PathOf($"figures/{Path.ChangeExtension(HtmlReport.OverviewFile, ".svg")}"));
            written.Add($"figures/{HtmlReport.OverviewFile}");
            written.Add($"figures/{Path.ChangeExtension(HtmlReport.OverviewFile, ".svg")}");
            if (analysis.SurrogateExample is { } example)
            {
                SurrogateFigure.Save(example, folder.PathOf($"figures/{HtmlReport.SurrogateFile}"));
                written.Add($"figures/{HtmlReport.SurrogateFile}");
                written.Add($"figures/{Path.ChangeExtension(HtmlReport.SurrogateFile, ".svg")}");
            }
        }
        written.Add("report.html");

        var manifest = new Manifest
        {
            Format = Manifest.ResultsFormat,
            Tool = ToolInfo.Current(),
            Started = context.Started,
            Finished = DateTimeOffset.UtcNow,
            CommandLine = context.CommandLine is null ? [] : [context.CommandLine],
            Inputs = PlanInputs.Files(plan).Select(InputFileRecord.Of).ToArray(),
            Plan = JsonSerializer.SerializeToNode(plan, PlanJson),
            Seed = plan.Seed,
            Decompositions = analysis.Decompositions,
            Conditions = analysis.Conditions.Select(c => new ConditionTrials(c.Condition, c.Trials, c.Dropped)).ToArray(),
            TimeSteps = plan.Bands.Select((b, i) => new BandTimeStep(b.Name, analysis.TimeSteps[i], analysis.TimeSteps[i] / input.SampleRate)).ToArray(),
            Outputs = written.Append("manifest.json").ToArray(),
            ResumedUnits = context.ResumedUnits ?? [],
            Extra = new JsonObject
            {
                ["sample_rate_hz"] = input.SampleRate,
                ["channels"] = new JsonArray(input.Channels.Select(c => (JsonNode)JsonValue.Create(c.Label)!).ToArray()),
                ["pad_samples"] = analysis.PadSamples,
                ["threads"] = context.Threads,
                ["analysis_seconds"] = context.Elapsed.TotalSeconds,
                ["input_notes"] = new JsonArray(input.Notes.Select(n => (JsonNode)JsonValue.Create(n)!).ToArray()),
                ["correction"] = CorrectionText.Manifest(plan.Correction, plan.Q),
                ["warnings"] = new JsonArray(analysis.Warnings.Select(n => (JsonNode)JsonValue.Create(n)!).ToArray()),
            },
        };
        if (analysis.Spectrum is not null) manifest.Extra!["spectrum"] = SpectrumWriter.ManifestNode(analysis.Spectrum);
        var report = new ReportContent(plan, manifest, analysis, input.Source, input.SampleRate, input.Channels.Select(c => c.Label).ToArray(),
            input.Notes, flags, ArtefactFlags.Unchecked(plan.Measures.Select(Measures.MeasureCatalog.Key).ToArray(), plan.SubtractEvoked));
        HtmlReport.Write(report, folder.WorkingPath, folder.PathOf("report.html"));
        ManifestWriter.Write(manifest, folder.PathOf("manifest.json"));
        folder.Commit();
        return folder.TargetPath;
    }

    /// <summary>The figures of a result: name part and a writer taking the paths (PNG and SVG) to write. Values without
    /// a test (surrogates: 0) have no significant pairs to draw a network of, so they get the matrix only.</summary>
    private static (string Kind, Action<string[]> Save)[] Figures(PairResult r, string? label, bool tested) => tested
        ? [("matrix", paths => MatrixFigure.Save(r, paths, valueLabel: label)), ("network", paths => NetworkFigure.Save(r, paths, valueLabel: label))]
        : [("matrix", paths => MatrixFigure.Save(r, paths, valueLabel: label))];
}
