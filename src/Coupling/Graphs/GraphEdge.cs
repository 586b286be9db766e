namespace Coupling.Graphs;

/// <summary>One significant channel pair of a <see cref="ChannelGraph"/>, with its statistics.</summary>
/// <param name="A">Index of the first channel (A &lt; B).</param>
/// <param name="B">Index of the second channel.</param>
/// <param name="Pair">Pair index in <see cref="Measures.PairIndex"/> order.</param>
/// <param name="Value">Observed value, signed as stored in the result.</param>
/// <param name="Weight">Edge weight: |<paramref name="Value"/>|.</param>
/// <param name="Z">Surrogate z-score.</param>
/// <param name="P">Uncorrected p-value.</param>
/// <param name="PCorrected">Corrected p-value.</param>
public sealed record GraphEdge(int A, int B, int Pair, double Value, double Weight, double Z, double P, double PCorrected);
