using System.CommandLine;

namespace RunWatch.Commands;

/// <summary><c>runwatch demo</c>: the whole job on embedded defaults with invented demo data.</summary>
internal static class DemoCommand
{
    public static Command Create()
    {
        var command = new Command("demo", "Run the whole job on embedded defaults with an invented demo chamber and demo SEM fields.");
        command.SetAction(_ =>
        {
            Console.WriteLine("RunWatch demo (invented data).");
            Console.WriteLine("Available so far: see README.md, section 'What works today'.");
            return 0;
        });
        return command;
    }
}
