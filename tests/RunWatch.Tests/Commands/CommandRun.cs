using System.CommandLine;
using RunWatch.Commands;

namespace RunWatch.Tests.Commands;

/// <summary>Runs a <c>runwatch</c> command line in-process and captures what it writes.</summary>
internal sealed record CommandRun(int ExitCode, string Output, string Error)
{
    public static CommandRun Invoke(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CommandCatalog.Build().Parse(args).Invoke(new InvocationConfiguration { Output = output, Error = error });
        return new CommandRun(code, output.ToString(), error.ToString());
    }
}
