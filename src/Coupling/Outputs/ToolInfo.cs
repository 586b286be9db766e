using System.Reflection;
using System.Runtime.InteropServices;

namespace Coupling.Outputs;

/// <summary>The program and platform that made a run's results.</summary>
/// <param name="Name">Tool name.</param>
/// <param name="Version">The tool assembly's informational version (version plus source revision where built with one).</param>
/// <param name="Runtime">.NET runtime description (e.g. ".NET 10.0.0").</param>
/// <param name="OperatingSystem">Operating system description and process architecture.</param>
/// <param name="Packages">Informational versions of the libraries whose code shapes the results, by package name.</param>
public sealed record ToolInfo(
    string Name,
    string Version,
    string Runtime,
    string OperatingSystem,
    IReadOnlyDictionary<string, string> Packages)
{
    /// <summary>
    /// The running program: <paramref name="name"/>, the informational version of <paramref name="toolAssembly"/>
    /// (the Coupling library when null), the runtime, the OS and the versions of MathNet.Numerics, QuikGraph,
    /// ScottPlot and YamlDotNet read from their loaded assemblies.
    /// </summary>
    public static ToolInfo Current(string name = "coupling", Assembly? toolAssembly = null)
    {
        var packages = new SortedDictionary<string, string>(StringComparer.Ordinal)
        {
            ["MathNet.Numerics"] = VersionOf(typeof(MathNet.Numerics.Control).Assembly),
            ["QuikGraph"] = VersionOf(typeof(QuikGraph.UndirectedGraph<,>).Assembly),
            ["ScottPlot"] = VersionOf(typeof(ScottPlot.Plot).Assembly),
            ["YamlDotNet"] = VersionOf(typeof(YamlDotNet.Serialization.Deserializer).Assembly),
        };
        return new ToolInfo(
            name,
            VersionOf(toolAssembly ?? typeof(ToolInfo).Assembly),
            RuntimeInformation.FrameworkDescription,
            $"{RuntimeInformation.OSDescription} ({RuntimeInformation.OSArchitecture})",
            packages);
    }

    /// <summary>The assembly's informational version, else its assembly version, else "unknown".</summary>
    public static string VersionOf(Assembly assembly)
    {
        ArgumentNullException.ThrowIfNull(assembly);
        return assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion
            ?? assembly.GetName().Version?.ToString()
            ?? "unknown";
    }
}
