using Coupling.Formats;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Trials;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// A condition's trials without its evoked response, as the run, the spectrum and the surrogate figure cut them: the
/// trials as <see cref="LoadedInput.Trials"/> cuts them, minus their trial mean per channel and sample (common practice:
/// the induced part is the trial minus the evoked average), bit for bit what cutting and then
/// <see cref="EvokedRemoval.SubtractInPlace(TrialSet)"/> gives.
/// </summary>
public sealed class LoadedInputTests
{
    private const int Epochs = 7, Channels = 3, Samples = 60;
    private static readonly ConditionSpec Go = new("go", ["go"]);
    private static readonly TimeRange Span = new(0.0, 0.4);

    /// <summary>Seven epochs of uniform noise plus a response the same in every epoch, five of them labelled "go".</summary>
    private static LoadedInput Input()
    {
        var random = new Random(11);
        var data = new double[Epochs * Channels * Samples];
        for (int e = 0; e < Epochs; e++)
            for (int c = 0; c < Channels; c++)
                for (int s = 0; s < Samples; s++)
                    data[(e * Channels + c) * Samples + s] = 2 * random.NextDouble() - 1 + (c + 1) * Math.Sin(2 * Math.PI * 10 * s / 100.0);
        ChannelInfo[] channels = [new("A", "EEG", "uV"), new("B", "EEG", "uV"), new("C", "EEG", "uV")];
        return LoadedInput.FromEpochs("epochs.npy", 100, channels, data, Epochs, Samples, -0.1,
            ["go", "stop", "go", "go", "stop", "go", "go"]);
    }

    [Fact]
    public void Trials_without_evoked_are_the_cut_trials_less_their_mean_bit_for_bit_and_the_mean_is_returned()
    {
        var expected = Input().Trials(Go, Span, 5);
        var expectedMean = EvokedRemoval.Mean(expected);
        EvokedRemoval.SubtractInPlace(expected);

        var (trials, mean) = Input().TrialsWithoutEvoked(Go, Span, 5, subtractEvoked: true);

        Assert.Equal(5, trials.TrialCount);
        Assert.Equal(expected.Data, trials.Data);
        Assert.NotNull(mean);
        Assert.Equal(1, mean.TrialCount);
        Assert.Equal(expectedMean.Data, mean.Data);
        Assert.Equal(trials.SampleCount, mean.SampleCount);
        Assert.Equal(trials.PadSamples, mean.PadSamples);
        // The subtraction did happen: the cut trials differ from what is returned.
        Assert.NotEqual(Input().Trials(Go, Span, 5).Data, trials.Data);
    }

    [Fact]
    public void Without_subtraction_the_trials_are_as_cut_and_no_mean_is_returned()
    {
        var (trials, mean) = Input().TrialsWithoutEvoked(Go, Span, 5, subtractEvoked: false);

        Assert.Equal(Input().Trials(Go, Span, 5).Data, trials.Data);
        Assert.Null(mean);
    }

    [Fact]
    public void A_condition_without_trials_has_nothing_removed()
    {
        var (trials, mean) = Input().TrialsWithoutEvoked(new ConditionSpec("rest", ["rest"]), Span, 5, subtractEvoked: true);

        Assert.Equal(0, trials.TrialCount);
        Assert.Null(mean);
    }
}
