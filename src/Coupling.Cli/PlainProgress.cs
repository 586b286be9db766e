using System.Diagnostics;
using System.Globalization;
using Coupling.Pipeline;

namespace Coupling.Cli;

/// <summary>
/// Progress as plain lines, for output that is not a terminal (a log, a pipe, a test's writer): a line when a stage
/// starts and one when it finishes, with its time; verbose adds a line at most every <see cref="VerboseInterval"/> with
/// the time taken and an estimate of the time left.
/// </summary>
internal sealed class PlainProgress(TextWriter writer, bool verbose) : IProgress<RunProgress>
{
    /// <summary>Least time between two verbose lines of one stage.</summary>
    public static readonly TimeSpan VerboseInterval = TimeSpan.FromSeconds(1);

    private readonly object _gate = new();
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private readonly HashSet<string> _past = new(StringComparer.Ordinal);
    private string? _stage;
    private TimeSpan _stageStart;
    private TimeSpan _lastLine;
    private int _done = -1;

    public void Report(RunProgress value)
    {
        lock (_gate)
        {
            var now = _clock.Elapsed;
            if (value.Stage != _stage)
            {
                // Reports are posted from worker threads and may arrive late: a stage already left is not shown again.
                if (_past.Contains(value.Stage)) return;
                if (_stage is not null) _past.Add(_stage);
                _stage = value.Stage;
                _stageStart = now;
                _lastLine = now;
                _done = value.Done;
                writer.WriteLine(value.Total > 0 ? $"{value.Stage}: {value.Done}/{value.Total}" : value.Stage);
                writer.Flush();
                return;
            }
            if (value.Done <= _done) return;
            _done = value.Done;
            var elapsed = now - _stageStart;
            bool finished = value.Total > 0 && value.Done >= value.Total;
            if (finished)
                writer.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{value.Stage}: {value.Done}/{value.Total} ({elapsed.TotalSeconds:0.0} s)"));
            else if (verbose && now - _lastLine >= VerboseInterval && value.Total > 0)
            {
                double left = elapsed.TotalSeconds * (value.Total - value.Done) / Math.Max(1, value.Done);
                writer.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"{value.Stage}: {value.Done}/{value.Total} ({elapsed.TotalSeconds:0.0} s, about {left:0} s left)"));
            }
            else return;
            _lastLine = now;
            writer.Flush();
        }
    }
}
