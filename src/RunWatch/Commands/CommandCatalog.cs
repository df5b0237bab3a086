using System.CommandLine;

namespace RunWatch.Commands;

/// <summary>The verbs of the <c>runwatch</c> executable. Each verb lives in its own file.</summary>
internal static class CommandCatalog
{
    public static RootCommand Build()
    {
        var root = new RootCommand("RunWatch: records growth-chamber thermal history, measures SEM fields of nanowires and writes a QC verdict per wafer.");
        root.Subcommands.Add(DemoCommand.Create());
        root.Subcommands.Add(ServeCommand.Create());
        root.Subcommands.Add(ReplayCommand.Create());
        root.Subcommands.Add(ThermalCommand.Create());
        root.Subcommands.Add(ReportCommand.Create());
        root.Subcommands.Add(VerifyCommand.Create());
        root.Subcommands.Add(AnalyzeCommand.Create());
        root.Subcommands.Add(ModelCommand.Create());
        root.Subcommands.Add(HashPasswordCommand.Create());
        root.Subcommands.Add(BackupCommand.CreateBackup());
        root.Subcommands.Add(BackupCommand.CreateRestore());
        return root;
    }
}
