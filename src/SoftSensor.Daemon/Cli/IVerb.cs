using System.CommandLine;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// One verb of the <c>softsensor</c> command line. Every non-abstract implementation in this
/// assembly is found by <see cref="VerbCatalog"/>; a verb owns its options and its action.
/// Actions return the process exit code: 0 success, 1 a failure at run time, 2 bad input.
/// </summary>
internal interface IVerb
{
    /// <summary>Builds the verb's command with its options and action.</summary>
    Command Build();
}
