using RunWatch.Testing;
using Xunit;

namespace RunWatch.Tests.Architecture;

/// <summary>
/// The rooms' walls (docs/ARCHITECTURE.md): which project may reference which, and no loop between projects or
/// between the folders of one project.
/// </summary>
public sealed class RoomWallsTests
{
    // The allowed references of each room, as docs/ARCHITECTURE.md draws them. The executable composes them all.
    private static readonly Dictionary<string, string[]> Walls = new(StringComparer.Ordinal)
    {
        ["RunWatch.Core"] = [],
        ["RunWatch.Storage"] = ["RunWatch.Core"],
        ["RunWatch.Imaging"] = ["RunWatch.Core"],
        ["RunWatch.Reports"] = ["RunWatch.Core", "RunWatch.Imaging"],
        ["RunWatch.Simulation"] = ["RunWatch.Core", "RunWatch.Imaging"],
        ["RunWatch.Ingest"] = ["RunWatch.Core", "RunWatch.Storage"],
        ["RunWatch.Wafers"] = ["RunWatch.Core", "RunWatch.Storage", "RunWatch.Imaging", "RunWatch.Reports"],
        ["RunWatch.Web"] = ["RunWatch.Core", "RunWatch.Storage"],
    };

    [Fact]
    public void Projects_EachRoom_ReferencesOnlyWhatItsWallsAllow()
    {
        var graph = SourceDependencies.Projects(RepositoryRoot.Path);
        foreach (var (project, _) in SourceDependencies.SourceProjects(RepositoryRoot.Path))
        {
            if (project == "RunWatch")
            {
                continue;
            }
            Assert.True(Walls.ContainsKey(project), $"{project} is a new room: add its walls here and to docs/ARCHITECTURE.md");
            var beyond = graph.DependenciesOf(project).Except(Walls[project]).ToList();
            Assert.True(beyond.Count == 0, $"{project} references {string.Join(", ", beyond)} beyond its walls");
        }
    }

    [Fact]
    public void Projects_ReferenceGraph_HasNoLoop()
    {
        Assert.Null(SourceDependencies.Projects(RepositoryRoot.Path).FindLoop());
    }

    [Fact]
    public void Folders_EveryProject_HasNoLoopBetweenFolders()
    {
        var loops = new List<string>();
        int projects = 0;
        foreach (var (project, files) in SourceDependencies.SourceProjects(RepositoryRoot.Path))
        {
            projects++;
            string? loop = SourceDependencies.Folders(project, files).FindLoop();
            if (loop is not null)
            {
                loops.Add($"{project}: {loop}");
            }
        }
        Assert.True(projects >= 9, $"only {projects} projects found under src/");
        Assert.True(loops.Count == 0, "folder loops:\n" + string.Join("\n", loops));
    }

    [Fact]
    public void Folders_IngestAfterTheSplit_SeesChambersBelowParsingAndPipeline()
    {
        var ingest = SourceDependencies.SourceProjects(RepositoryRoot.Path).Single(p => p.Project == "RunWatch.Ingest");
        var graph = SourceDependencies.Folders("RunWatch.Ingest", ingest.Files);

        Assert.Contains("Chambers", graph.DependenciesOf("Parsing"));
        Assert.Contains("Chambers", graph.DependenciesOf("Pipeline"));
        Assert.DoesNotContain("Parsing", graph.DependenciesOf("Chambers"));
        Assert.DoesNotContain("Pipeline", graph.DependenciesOf("Chambers"));
    }

    [Fact]
    public void Folders_UsingLinesInALoop_LoopReportedWithItsEvidence()
    {
        (string, string)[] files =
        [
            ("Alpha/A.cs", "using Demo.Room.Beta;\nnamespace Demo.Room.Alpha;\nclass A { }"),
            ("Beta/B.cs", "namespace Demo.Room.Beta;\nclass B { Demo.Room.Gamma.C? c; }"),
            ("Gamma/C.cs", "@using Demo.Room.Alpha\n"),
            ("Root.cs", "using Demo.Room.Alpha;\nnamespace Demo.Room;"),
        ];

        string? loop = SourceDependencies.Folders("Demo.Room", files).FindLoop();

        Assert.NotNull(loop);
        Assert.Contains("Alpha/A.cs: using Demo.Room.Beta;", loop, StringComparison.Ordinal);
        Assert.Contains("Gamma/C.cs: @using Demo.Room.Alpha", loop, StringComparison.Ordinal);
    }

    [Fact]
    public void Folders_LayeredUsingLines_NoLoop()
    {
        (string, string)[] files =
        [
            ("Alpha/A.cs", "using Demo.Room.Beta;\nusing Demo.Roomy.Alpha;\nnamespace Demo.Room.Alpha;"),
            ("Beta/B.cs", "namespace Demo.Room.Beta;\n// refers to Other.Demo.Room.Alpha, another project\n"),
        ];

        var graph = SourceDependencies.Folders("Demo.Room", files);

        Assert.Null(graph.FindLoop());
        Assert.Equal(["Beta"], graph.DependenciesOf("Alpha"));
    }

    [Fact]
    public void FindLoop_ProjectReferencesInARing_LoopNamed()
    {
        var graph = new DependencyGraph();
        graph.Add("Ingest", "Storage", "ref");
        graph.Add("Storage", "Core", "ref");
        graph.Add("Core", "Ingest", "ref");

        Assert.Equal("Core → Ingest (ref) → Storage (ref) → Core (ref)", graph.FindLoop());
    }
}
