namespace Coupling.Formats;

/// <summary>Argument checks shared by the <see cref="ISampleSource"/> implementations.</summary>
internal static class SampleSegment
{
    /// <summary>Throws unless <c>0 &lt;= first</c>, <c>first + length &lt;= sampleCount</c> and the target holds channels x length values.</summary>
    public static void Check(int first, int length, int sampleCount, int channels, int targetLength)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(first);
        ArgumentOutOfRangeException.ThrowIfNegative(length);
        if ((long)first + length > sampleCount)
            throw new ArgumentOutOfRangeException(nameof(length), $"Samples {first}..{(long)first + length - 1} run past the {sampleCount} samples of the source.");
        if ((long)channels * length != targetLength)
            throw new ArgumentOutOfRangeException(nameof(targetLength), $"The target holds {targetLength} values; {channels} channels x {length} samples need {(long)channels * length}.");
    }
}
