using System.Numerics;
using Coupling.Measures;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Spectral;
using Coupling.Statistics;

namespace Coupling.Benchmarks;

/// <summary>
/// How far results move when the narrowband values are stored in single precision (each value rounded to the
/// nearest float, all arithmetic still in double): the error any single-precision kernel would have at the least.
/// Runs the plan's full surrogate test on both and compares values, p-values and significance after correction.
/// </summary>
public static class Precision
{
    public static void Run(string planPath, int draws, TextWriter output)
    {
        var plan = PlanReader.Read(planPath);
        var input = InputLoader.Load(plan);
        var decompositions = plan.Bands
            .Select(b => BandDecompositions.Create(plan.Decomposition.Method, b, input.SampleRate,
                new BandDecompositionOptions(plan.Decomposition.TransitionHz, plan.Decomposition.AttenuationDb, plan.Decomposition.Cycles)))
            .ToArray();
        int pad = decompositions.Max(d => d.PadSamples);
        var measures = plan.Measures;
        var maxValue = new double[measures.Count];
        var maxRelative = new double[measures.Count];
        var maxP = new double[measures.Count];
        var flips = new int[measures.Count];
        var tests = new int[measures.Count];
        for (int ci = 0; ci < plan.Conditions.Count; ci++)
        {
            var (trials, _) = input.TrialsWithoutEvoked(plan.Conditions[ci], plan.Trial, pad, plan.SubtractEvoked);
            for (int bi = 0; bi < decompositions.Length; bi++)
            {
                int step = plan.Decomposition.TimeStep ?? TimeStep.Default(decompositions[bi].Info, input.SampleRate);
                var set = NarrowbandExtractor.Extract(trials, decompositions[bi], plan.Window, step);
                var rounded = set.Data.Select(z => new Complex((float)z.Real, (float)z.Imaginary)).ToArray();
                var single = new NarrowbandSet(set.Band, set.Channels, set.TrialCount, set.Times, rounded);
                ulong seed = Seeds.For(plan.Seed, ci, bi);
                var exact = SurrogateTest.Run(set, measures, draws, seed, "x");
                var approx = SurrogateTest.Run(single, measures, draws, seed, "x");
                for (int k = 0; k < measures.Count; k++)
                {
                    var qa = FalseDiscoveryRate.BenjaminiHochberg(exact[k].P);
                    var qb = FalseDiscoveryRate.BenjaminiHochberg(approx[k].P);
                    for (int p = 0; p < qa.Length; p++)
                    {
                        double d = Math.Abs(exact[k].Observed[p] - approx[k].Observed[p]);
                        maxValue[k] = Math.Max(maxValue[k], d);
                        maxRelative[k] = Math.Max(maxRelative[k], d / Math.Max(Math.Abs(exact[k].Observed[p]), 1e-300));
                        maxP[k] = Math.Max(maxP[k], Math.Abs(exact[k].P[p] - approx[k].P[p]));
                        if ((qa[p] <= plan.Q) != (qb[p] <= plan.Q)) flips[k]++;
                        tests[k]++;
                    }
                }
            }
        }
        output.WriteLine($"single-precision storage of the narrowband values, {planPath}, {draws} surrogates");
        output.WriteLine($"  {"measure",-15} {"max |dvalue|",12} {"max rel.",10} {"max |dp|",9} {"significance changed",21}");
        for (int k = 0; k < measures.Count; k++)
            output.WriteLine($"  {MeasureCatalog.Key(measures[k]),-15} {maxValue[k],12:G3} {maxRelative[k],10:G3} {maxP[k],9:G3} {flips[k],12} of {tests[k]}");
    }
}
