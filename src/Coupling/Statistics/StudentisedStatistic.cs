namespace Coupling.Statistics;

/// <summary>
/// The statistic that makes pairs with different null distributions comparable for the family-wise corrections: per
/// (measure, pair) cell, T(v) = (v − c)/s for an upper-tail test and |v − c|/s for a two-sided one, where c and s are the
/// mean and standard deviation (divisor M) of the M + 1 values made of the M surrogate draws and the observed value.
/// </summary>
/// <remarks>
/// Centring at the null's own mean makes a two-sided test of a signed measure ask "how far from what the shuffles give",
/// not "how far from zero", so a null shifted away from 0 (a lagged evoked response, a shared envelope) does not make
/// every pair extreme. Scaling by the null's spread puts pairs whose surrogates spread differently (different amplitude,
/// different trial counts) on one scale, so no single noisy pair dominates the maximum (Nichols and Holmes 2002, Hum Brain
/// Mapp 15:1-25, section "pseudo t-statistics" and the discussion of non-homogeneous variance). Centre and scale use the
/// observed value together with the draws, a function symmetric in all M + 1 values, so under exchangeability the
/// observed statistic is one more draw and the maximum-statistic test stays exact.
/// </remarks>
internal sealed class StudentisedStatistic
{
    private readonly double[] _centre, _scale;
    private readonly bool[] _twoSided;

    /// <param name="observed">Observed value per cell.</param>
    /// <param name="nullMean">Mean of the M draws per cell.</param>
    /// <param name="nullSd">Sample standard deviation (divisor M − 1) of the M draws per cell.</param>
    /// <param name="draws">M.</param>
    /// <param name="twoSided">Whether each cell is tested two-sided.</param>
    public StudentisedStatistic(ReadOnlySpan<double> observed, ReadOnlySpan<double> nullMean, ReadOnlySpan<double> nullSd,
        int draws, ReadOnlySpan<bool> twoSided)
    {
        int cells = observed.Length;
        _centre = new double[cells];
        _scale = new double[cells];
        _twoSided = twoSided.ToArray();
        double m = draws;
        for (int i = 0; i < cells; i++)
        {
            double x = observed[i], mean = nullMean[i];
            double squares = draws > 1 ? nullSd[i] * nullSd[i] * (m - 1) : 0;
            double delta = x - mean;
            // Chan, Golub and LeVeque (1983), Am Stat 37:242: merging one value into a summary of M.
            _centre[i] = mean + delta / (m + 1);
            _scale[i] = Math.Sqrt((squares + delta * delta * m / (m + 1)) / m);
        }
    }

    /// <summary>Number of cells.</summary>
    public int Cells => _centre.Length;

    /// <summary>T of value <paramref name="v"/> in cell <paramref name="cell"/>; NaN where v is NaN or the scale is not positive.</summary>
    public double Of(int cell, double v)
    {
        double s = _scale[cell];
        if (!(s > 0) || double.IsNaN(v)) return double.NaN;
        double t = (v - _centre[cell]) / s;
        return _twoSided[cell] ? Math.Abs(t) : t;
    }
}
