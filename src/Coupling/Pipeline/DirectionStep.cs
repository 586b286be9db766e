using Coupling.Measures;
using Coupling.Plans;
using Coupling.Results;
using Coupling.Spectral;
using Coupling.Statistics;
using Coupling.Trials;

namespace Coupling.Pipeline;

/// <summary>Direction of the pairs significant in any measure of one condition x band (plan key <c>direction: true</c>).</summary>
internal static class DirectionStep
{
    public static IEnumerable<PairDirection> Run(TrialSet trials, NarrowbandSet narrowband, Band band, TimeRange window,
        IReadOnlyList<PairResult> results, int draws, ulong seed)
    {
        int channels = trials.ChannelCount, pairs = PairIndex.Count(channels);
        var significant = Enumerable.Range(0, pairs).Where(k => results.Any(r => r.Significant[k])).ToArray();
        if (significant.Length == 0) return [];
        var samples = NarrowbandExtractor.WindowSamples(trials, window, 1);
        var window_ = new double[trials.TrialCount * channels * samples.Length];
        for (int n = 0; n < trials.TrialCount; n++)
            for (int c = 0; c < channels; c++)
            {
                var x = trials.Trial(n, c);
                for (int s = 0; s < samples.Length; s++) window_[(n * channels + c) * samples.Length + s] = x[samples[s]];
            }
        var (spectra, frequencies) = PhaseSlopeIndex.Spectra(window_, channels, trials.TrialCount, trials.SampleRate, band.Low, band.High);
        var list = significant.Select(k => PairIndex.Channels(k, channels)).ToArray();
        var (psi, p) = PhaseSlopeIndex.Test(spectra, trials.TrialCount, frequencies.Length, list, draws, seed);
        double centre = (band.Low + band.High) / 2;
        return significant.Select((k, i) =>
        {
            var (a, b) = list[i];
            double phase = CoherencyPhase.Of(narrowband, a, b);
            string leader = double.IsNaN(phase) || phase == 0 || Math.Abs(phase) == Math.PI ? "none" : phase > 0 ? trials.Channels[a] : trials.Channels[b];
            return new PairDirection(trials.Condition, band.Name, trials.Channels[a], trials.Channels[b],
                results.Where(r => r.Significant[k]).Select(r => r.Measure).ToArray(), phase,
                CoherencyPhase.LagMilliseconds(phase, centre), leader, psi[i], p[i]);
        }).ToArray();
    }
}
