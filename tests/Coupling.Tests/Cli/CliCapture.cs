namespace Coupling.Tests.Cli;

/// <summary>Runs the command line in this process with captured stdout and stderr.</summary>
internal static class CliCapture
{
    public static (int Code, string Out, string Err) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = Coupling.Cli.CommandLine.Run(args, output, error);
        return (code, output.ToString(), error.ToString());
    }
}
