namespace Coupling.Statistics;

/// <summary>
/// Sees every draw of a resampling test as it is made: draw index and the values of every (measure, pair) cell. Called
/// from worker threads, each draw once, in no particular order; an implementation keeps its result independent of that
/// order (e.g. writes per-draw results at the draw's index) so runs stay bit-identical across thread counts.
/// </summary>
internal interface IDrawObserver
{
    /// <summary>Takes draw <paramref name="draw"/>'s values (valid only during the call).</summary>
    void Observe(int draw, ReadOnlySpan<double> values);
}
