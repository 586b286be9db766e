using System.CommandLine;
using System.CommandLine.Help;
using Coupling.Pipeline;

namespace Coupling.Cli;

/// <summary>The command-line front end: parses arguments, calls the library, prints through the given writers.</summary>
public static class CommandLine
{
    /// <summary>
    /// Runs the program with <paramref name="args"/>; returns the process exit code: 0 on success; 2 for anything wrong
    /// with what the user gave (the command line, the plan, or a file it names: missing, malformed or unusable); 3 when
    /// the system refuses or fails to read or write a file or folder that is there to use (permission, disk full,
    /// device error); 130 when stopped; 1 for an internal error.
    /// </summary>
    public static int Run(string[] args, TextWriter output, TextWriter error)
    {
        var root = Build(output, error);
        var parsed = root.Parse(args.Length == 0 ? ["--help"] : args);
        if (parsed.Errors.Count > 0)
        {
            string command = parsed.CommandResult.Command == root ? "coupling" : $"coupling {parsed.CommandResult.Command.Name}";
            error.WriteLine($"coupling: {UsageErrors.Describe(parsed)} (see '{command} --help')");
            return 2;
        }
        try
        {
            return parsed.Invoke(new InvocationConfiguration { Output = output, Error = error, EnableDefaultExceptionHandler = false });
        }
        catch (InputException e)
        {
            error.WriteLine($"coupling: {OneLine(e.Message)}");
            return 2;
        }
        catch (FileAccessException e)
        {
            error.WriteLine($"coupling: {OneLine(e.Message)}");
            return 3;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // The library names the file in a FileAccessException; anything else must not show the system's own text
            // (which can name a hidden temporary folder).
            error.WriteLine($"coupling: a file or folder could not be read or written ({FileErrors.Reason(e)}).");
            return 3;
        }
        catch (OperationCanceledException)
        {
            error.WriteLine("coupling: stopped before the end; no results folder was written. Run the same command again to resume from the finished units.");
            return 130;
        }
        catch (Exception e)
        {
            error.WriteLine($"coupling: internal error ({e.GetType().Name}): {OneLine(e.Message)}");
            return 1;
        }
    }

    private static string OneLine(string s) => s.ReplaceLineEndings(" ");

    private static Verbosity Level(bool quiet, bool verbose) =>
        quiet && verbose ? throw new InputException("--quiet and --verbose exclude each other; give one.")
        : quiet ? Verbosity.Quiet : verbose ? Verbosity.Verbose : Verbosity.Normal;

    /// <summary>Builds the command tree (exposed so the help text can be pinned by a test).</summary>
    public static Command Build(TextWriter output, TextWriter error)
    {
        // A named root rather than RootCommand, so help shows the tool's name whatever the executable is called.
        var root = new Command("coupling",
            "Coupling: narrowband connectivity between channels of trial-based electrophysiology recordings, " +
            "tested against trial-shuffle surrogates. For research use only; not a medical device.");

        var threads = new Option<int>("--threads") { Description = "Worker threads (0: all cores). Results do not depend on it.", DefaultValueFactory = _ => 0 };
        var force = new Option<bool>("--force") { Description = "Replace an earlier results folder of this tool at the output (never a folder holding other files)." };
        var scenarioForce = new Option<bool>("--force") { Description = "Replace an earlier scenario written by this tool in the folder (never a folder holding other files)." };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "Print no progress; only the results folder, warnings and errors." };
        var verbose = new Option<bool>("--verbose", "-v") { Description = "Print what will run before it starts, and progress lines with times and estimates." };

        var demoOut = new Option<DirectoryInfo>("--output", "-o") { Description = "Folder for the demo's data and results.", DefaultValueFactory = _ => new DirectoryInfo("coupling-demo") };
        var demoSurrogates = new Option<int?>("--surrogates") { Description = "Surrogate draws per condition and band (default: the demo plan's; 0: values without a test)." };
        var demo = new Command("demo", "Simulate the built-in scenario with known ground truth, analyse it end to end and check the result against the truth.")
        {
            demoOut, demoSurrogates, threads, scenarioForce, quiet, verbose,
        };
        demo.SetAction(r => Commands.Demo(r.GetValue(demoOut)!.FullName, r.GetValue(demoSurrogates), r.GetValue(threads), r.GetValue(scenarioForce),
            Level(r.GetValue(quiet), r.GetValue(verbose)), output, error));

        var planArg = new Argument<FileInfo>("plan") { Description = "The plan file (YAML) naming recording, conditions, bands, measures, surrogates and output." };
        var runOut = new Option<DirectoryInfo?>("--output", "-o") { Description = "Results folder, instead of the plan's 'output' (relative to the current folder)." };
        var runSurrogates = new Option<int?>("--surrogates") { Description = "Surrogate draws per unit, instead of the plan's 'surrogates'." };
        var runSeed = new Option<ulong?>("--seed") { Description = "Seed of every random choice, instead of the plan's 'seed'." };
        var restart = new Option<bool>("--restart") { Description = "Discard the finished units an interrupted earlier run kept and compute everything again (a run resumes them otherwise)." };
        var run = new Command("run", "Run the analysis a plan file describes; an interrupted run of the same plan and inputs resumes where it stopped.")
        {
            planArg, runOut, runSurrogates, runSeed, threads, force, restart, quiet, verbose,
        };
        run.SetAction(r => Commands.RunPlan(
            new PlanOverrides(r.GetValue(planArg)!.FullName, r.GetValue(runOut)?.FullName, r.GetValue(runSurrogates), r.GetValue(runSeed), r.GetValue(force)),
            r.GetValue(threads), r.GetValue(restart), Level(r.GetValue(quiet), r.GetValue(verbose)), output, error));

        var check = new Command("check", "Check a plan against its input and print what a run would do (trials, filters, work units, surrogates needed) without computing.")
        {
            planArg, runOut, runSurrogates, runSeed, force,
        };
        check.SetAction(r => Commands.Check(
            new PlanOverrides(r.GetValue(planArg)!.FullName, r.GetValue(runOut)?.FullName, r.GetValue(runSurrogates), r.GetValue(runSeed), r.GetValue(force)), output));

        var simOut = new Option<DirectoryInfo>("--output", "-o") { Description = "Folder to write the recording (EDF+), truth.json and a plan into.", DefaultValueFactory = _ => new DirectoryInfo("coupling-scenario") };
        var simSeed = new Option<int>("--seed") { Description = "Seed of the simulation.", DefaultValueFactory = _ => ScenarioFiles.DefaultSeed };
        var simTrials = new Option<int?>("--trials") { Description = "Trials per condition (default: the scenario's)." };
        var simulate = new Command("simulate", "Write the invented scenario with known ground truth as an EDF+ recording with events, truth.json and a ready plan.")
        {
            simOut, simSeed, simTrials, scenarioForce,
        };
        simulate.SetAction(r => Commands.Simulate(r.GetValue(simOut)!.FullName, r.GetValue(simSeed), r.GetValue(simTrials), r.GetValue(scenarioForce), output));

        var fileArg = new Argument<FileInfo>("file") { Description = "A recording: EDF/EDF+ (.edf), CSV (.csv) or NPY (.npy)." };
        var rate = new Option<double?>("--rate") { Description = "Sampling rate in Hz, for CSV files (which do not carry one)." };
        var inspect = new Command("inspect", "Print a recording's channels, sampling rates, duration and event counts per label.") { fileArg, rate };
        inspect.SetAction(r => Commands.Inspect(r.GetValue(fileArg)!.FullName, r.GetValue(rate), output));

        root.Options.Add(new HelpOption());
        root.Options.Add(new VersionOption());
        root.Subcommands.Add(demo);
        root.Subcommands.Add(run);
        root.Subcommands.Add(check);
        root.Subcommands.Add(simulate);
        root.Subcommands.Add(inspect);
        return root;
    }
}
