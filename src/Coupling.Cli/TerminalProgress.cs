using System.Diagnostics;
using Coupling.Pipeline;

namespace Coupling.Cli;

/// <summary>Shows run progress on a terminal: one line per stage, updated in place when the writer is a terminal.</summary>
internal sealed class TerminalProgress(TextWriter writer, bool interactive) : IProgress<RunProgress>
{
    private readonly object _gate = new();
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private string? _stage;
    private long _lastDraw;
    private int _lastDone = -1;

    public void Report(RunProgress value)
    {
        lock (_gate)
        {
            bool newStage = value.Stage != _stage;
            if (newStage)
            {
                if (_stage is not null && interactive) writer.WriteLine();
                _stage = value.Stage;
                _lastDone = -1;
            }
            if (!newStage && value.Done <= _lastDone) return;
            _lastDone = value.Done;
            long now = _clock.ElapsedMilliseconds;
            bool finished = value.Total > 0 && value.Done >= value.Total;
            if (!newStage && !finished && now - _lastDraw < 200) return;
            _lastDraw = now;
            string text = value.Total > 0 ? $"{value.Stage}: {value.Done}/{value.Total}" : value.Stage;
            if (interactive) writer.Write($"\r{text,-70}");
            else if (newStage || finished) writer.WriteLine(text);
            writer.Flush();
        }
    }

    public void End()
    {
        lock (_gate)
        {
            if (interactive && _stage is not null) writer.WriteLine();
            _stage = null;
        }
    }
}
