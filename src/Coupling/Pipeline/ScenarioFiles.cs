using System.Globalization;
using System.Text;
using Coupling.Formats;
using Coupling.Measures;
using Coupling.Outputs;
using Coupling.Simulation;

namespace Coupling.Pipeline;

/// <summary>Writes the simulated scenario as files a researcher would have: an EDF+ recording, BIDS sidecars, truth and a plan.</summary>
public static class ScenarioFiles
{
    /// <summary>The seed of the built-in demo scenario.</summary>
    public const int DefaultSeed = 1;

    /// <summary>Surrogate draws in the written plan: enough that one true pair among the 45 of ten channels can pass
    /// the Benjamini-Hochberg step at q = 0.05 in a two-sided test too (its smallest p, 2/(M+1), must be at most
    /// 0.05/45, so M ≥ 1799).</summary>
    public const int DefaultSurrogates = 2000;

    /// <summary>
    /// Simulates the scenario and writes, into <paramref name="folder"/>: <c>scenario.edf</c> (EDF+ with the events as
    /// annotations), <c>scenario_channels.tsv</c> and <c>scenario_electrodes.tsv</c> (BIDS sidecars: types, units,
    /// positions), <c>truth.json</c> and <c>plan.yaml</c>. Each file is written atomically.
    /// </summary>
    public static ScenarioPaths Write(string folder, ScenarioOptions options, int surrogates = DefaultSurrogates)
    {
        Directory.CreateDirectory(folder);
        var scenario = Simulator.Generate(options);
        var rec = scenario.Recording;
        string edf = Path.Combine(folder, "scenario.edf");
        EdfWriter.Write(rec, edf);

        var channels = new StringBuilder("name\ttype\tunits\n");
        var electrodes = new StringBuilder("name\tx\ty\tz\n");
        foreach (var c in rec.Channels)
        {
            channels.Append($"{c.Label}\t{c.Type}\t{c.Unit}\n");
            electrodes.Append(c.Position is { } p
                ? string.Create(CultureInfo.InvariantCulture, $"{c.Label}\t{p.X:R}\t{p.Y:R}\t{p.Z:R}\n")
                : $"{c.Label}\tn/a\tn/a\tn/a\n");
        }
        AtomicFile.WriteAllText(Path.Combine(folder, "scenario_channels.tsv"), channels.ToString());
        AtomicFile.WriteAllText(Path.Combine(folder, "scenario_electrodes.tsv"), electrodes.ToString());

        string truth = Path.Combine(folder, "truth.json");
        TruthFile.Write(scenario.Truth, truth);
        string plan = Path.Combine(folder, "plan.yaml");
        AtomicFile.WriteAllText(plan, PlanText(scenario.Truth, surrogates));
        return new ScenarioPaths(folder, edf, truth, plan);
    }

    /// <summary>The plan that analyses the scenario with every measure, in the scenario's bands, trial span and window.</summary>
    public static string PlanText(GroundTruth truth, int surrogates)
    {
        var inv = CultureInfo.InvariantCulture;
        var sb = new StringBuilder();
        sb.AppendLine("# Plan for the simulated scenario (see truth.json for what is built in).");
        sb.AppendLine("recording: scenario.edf");
        sb.AppendLine("conditions:");
        foreach (var c in truth.Conditions) sb.AppendLine($"  {c.Name}: [{c.EventLabel}]");
        if (truth.Conditions.Count >= 2)
            sb.AppendLine($"contrasts: [[{truth.Conditions[0].Name}, {truth.Conditions[1].Name}]]");
        sb.AppendLine(string.Create(inv, $"trial: {{ start: {truth.TrialStart:R}, end: {truth.TrialEnd:R} }}"));
        sb.AppendLine(string.Create(inv, $"window: {{ start: {truth.WindowStart:R}, end: {truth.WindowEnd:R} }}"));
        sb.AppendLine("evoked: keep          # the stimulus-locked pair is left in on purpose: trial shuffling must not call it coupling");
        sb.AppendLine("bands:");
        foreach (var b in truth.Bands) sb.AppendLine(string.Create(inv, $"  {b.Name}: [{b.Low:R}, {b.High:R}]"));
        sb.AppendLine("decomposition:");
        sb.AppendLine("  method: fir-hilbert");
        sb.AppendLine("  time_step: auto");
        sb.AppendLine($"measures: [{string.Join(", ", MeasureCatalog.All.Select(MeasureCatalog.Key))}]");
        sb.AppendLine(string.Create(inv, $"surrogates: {surrogates}"));
        sb.AppendLine(string.Create(inv, $"seed: {truth.Seed}"));
        sb.AppendLine("correction: { method: benjamini-hochberg, q: 0.05 }");
        sb.AppendLine("output: results");
        sb.AppendLine("figures: true");
        return sb.ToString();
    }
}
