using Coupling.Plans;

namespace Coupling.Tests.Plans;

/// <summary>"Did you mean" hints: the optimal string alignment distance and the choice of the closest allowed word.</summary>
public sealed class SpellingTests
{
    [Theory]
    // kitten -> sitting is the classic Levenshtein example with distance 3 (from memory; Levenshtein 1966);
    // an adjacent transposition counts once (Damerau 1964); the empty string is as far as the other's length.
    [InlineData("kitten", "sitting", 3)]
    [InlineData("wpil", "wpli", 1)]
    [InlineData("surogates", "surrogates", 1)]
    [InlineData("", "abc", 3)]
    [InlineData("plv", "plv", 0)]
    public void Distance_counts_insertions_deletions_substitutions_and_transpositions(string a, string b, int expected) =>
        Assert.Equal(expected, Spelling.Distance(a, b));

    [Fact]
    public void The_closest_allowed_word_is_offered_only_when_it_is_close()
    {
        string[] keys = ["surrogates", "seed", "sample_rate", "figures"];
        Assert.Equal("surrogates", Spelling.Closest("surogates", keys));
        Assert.Equal("seed", Spelling.Closest("Seed", keys));
        Assert.Equal("figures", Spelling.Closest("figure", keys));
        Assert.Null(Spelling.Closest("window_length", keys));
        Assert.Equal("", Spelling.Hint("zzz", keys));
        Assert.Equal(" (did you mean 'seed'?)", Spelling.Hint("sed", keys));
    }
}
