using Coupling.Pipeline;
using Spectre.Console;

namespace Coupling.Cli;

/// <summary>
/// Progress on a terminal with Spectre.Console: one bar per running task (a condition x band, a contrast x band, reading
/// input, writing results) with its elapsed time and an estimate of the time left; finished tasks are cleared.
/// </summary>
internal sealed class BarProgress : IProgress<RunProgress>
{
    private readonly object _gate = new();
    private readonly ProgressContext _context;
    private readonly IAnsiConsole _console;
    private readonly HashSet<string> _past = new(StringComparer.Ordinal);
    private ProgressTask? _task;
    private string? _key;

    private BarProgress(ProgressContext context, IAnsiConsole console)
    {
        _context = context;
        _console = console;
    }

    /// <summary>Runs <paramref name="work"/> with bars drawn on <paramref name="terminal"/> until it returns.</summary>
    public static T Show<T>(TextWriter terminal, Func<BarProgress, T> work)
    {
        var console = AnsiConsole.Create(new AnsiConsoleSettings
        {
            Out = new AnsiConsoleOutput(terminal),
            Ansi = AnsiSupport.Detect,
            ColorSystem = ColorSystemSupport.Detect,
            Interactive = InteractionSupport.Yes,
        });
        return console.Progress()
            .AutoClear(false)
            .HideCompleted(true)
            .Columns(new TaskDescriptionColumn { Alignment = Justify.Left }, new ProgressBarColumn(), new PercentageColumn(),
                new ElapsedTimeColumn(), new RemainingTimeColumn(), new SpinnerColumn())
            .Start(context => work(new BarProgress(context, console)));
    }

    /// <summary>Writes a line of text above the bars (a warning), without disturbing them.</summary>
    public void WriteLine(string line)
    {
        lock (_gate) _console.WriteLine(line);
    }

    public void Report(RunProgress value)
    {
        int colon = value.Stage.LastIndexOf(": ", StringComparison.Ordinal);
        string key = colon < 0 ? value.Stage : value.Stage[..colon];
        string step = colon < 0 ? "" : value.Stage[(colon + 2)..];
        lock (_gate)
        {
            if (key != _key)
            {
                // Reports are posted from worker threads and may arrive late: a task already finished is not drawn again.
                if (_past.Contains(key)) return;
                if (_key is not null) _past.Add(_key);
                Finish();
                _key = key;
                _task = _context.AddTask(Markup.Escape(key), autoStart: true, maxValue: Math.Max(1, value.Total));
            }
            var task = _task!;
            task.Description = Markup.Escape(step.Length > 0 ? $"{key}: {step}" : key);
            task.IsIndeterminate = value.Total == 0;
            if (value.Total > 0)
            {
                if (task.MaxValue != value.Total) task.MaxValue = value.Total;
                if (value.Done > task.Value) task.Value = value.Done;
            }
        }
    }

    private void Finish()
    {
        if (_task is null) return;
        _task.IsIndeterminate = false;
        _task.Value = _task.MaxValue;
        _task.StopTask();
    }
}
