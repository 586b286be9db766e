using System.CommandLine;
using System.CommandLine.Parsing;
using System.Text.RegularExpressions;
using Coupling.Plans;

namespace Coupling.Cli;

/// <summary>Puts the parser's errors in the tool's words: no .NET type names, one hint per unknown word.</summary>
internal static partial class UsageErrors
{
    [GeneratedRegex(@"^Cannot parse argument '(?<value>.*)' for (?:option|command) '(?<option>[^']*)' as expected type '(?<type>[^']*)'\.?$")]
    private static partial Regex CannotParse();

    [GeneratedRegex(@"^Unrecognized command or argument '(?<word>.*)'\.?$")]
    private static partial Regex Unrecognized();

    /// <summary>One sentence describing what is wrong with the command line.</summary>
    public static string Describe(ParseResult parsed)
    {
        var command = parsed.CommandResult.Command;
        var messages = new List<string>();
        bool unknownSeen = false;
        foreach (var error in parsed.Errors)
        {
            string message = error.Message.ReplaceLineEndings(" ").Trim();
            if (CannotParse().Match(message) is { Success: true } p)
            {
                string type = p.Groups["type"].Value;
                string kind = type.Contains("Int", StringComparison.Ordinal) ? "a whole number"
                    : type.Contains("Double", StringComparison.Ordinal) ? "a number" : "a value of another kind";
                messages.Add($"{p.Groups["option"].Value}: '{p.Groups["value"].Value}' is not {kind}.");
            }
            else if (Unrecognized().Match(message) is { Success: true } u)
            {
                // Later unknown words usually follow from the first (e.g. the value of a misspelt option).
                if (unknownSeen) continue;
                unknownSeen = true;
                string word = u.Groups["word"].Value;
                var known = word.StartsWith('-')
                    ? command.Options.SelectMany(o => o.Aliases.Prepend(o.Name))
                    : command.Subcommands.Select(c => c.Name);
                string what = word.StartsWith('-') ? "option" : command.Subcommands.Count > 0 ? "command" : "argument";
                messages.Add($"unknown {what} '{word}'{Spelling.Hint(word, known)}.");
            }
            else if (message.StartsWith("Required command was not provided", StringComparison.Ordinal))
            {
                if (parsed.Errors.Count == 1) messages.Add($"a command is needed: {string.Join(", ", command.Subcommands.Select(c => c.Name))}.");
            }
            else if (message.StartsWith("Required argument missing", StringComparison.Ordinal))
            {
                var argument = command.Arguments.FirstOrDefault();
                messages.Add(argument is null ? message : $"the {argument.Name} argument is missing ({argument.Description}).");
            }
            else messages.Add(message);
        }
        return string.Join(" ", messages);
    }
}
