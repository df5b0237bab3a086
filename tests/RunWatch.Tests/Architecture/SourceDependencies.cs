using System.Text.RegularExpressions;
using System.Xml.Linq;

namespace RunWatch.Tests.Architecture;

/// <summary>
/// Reads the dependencies of the rooms from the source itself: project references from the .csproj files, and
/// folder-to-folder references inside a project from the namespaces its files name (using lines, @using lines in
/// Razor files and fully qualified names). A folder's namespace is the project's name plus the folder's name. A name
/// qualified only from a sibling namespace (<c>Thermal.PhysicalConstants</c> inside <c>RunWatch.Core.Model</c>) is not
/// seen: it cannot be told from a member access by text alone, so such references are kept to folders already used.
/// </summary>
internal static partial class SourceDependencies
{
    /// <summary>The project graph of src/: each project's ProjectReference items.</summary>
    public static DependencyGraph Projects(string repositoryRoot)
    {
        var graph = new DependencyGraph();
        foreach (string project in Directory.EnumerateFiles(Path.Combine(repositoryRoot, "src"), "*.csproj", SearchOption.AllDirectories))
        {
            string name = Path.GetFileNameWithoutExtension(project);
            foreach (var reference in XDocument.Load(project).Descendants("ProjectReference"))
            {
                string target = Path.GetFileNameWithoutExtension(reference.Attribute("Include")?.Value ?? "");
                graph.Add(name, target, "ProjectReference in " + Path.GetFileName(project));
            }
        }
        return graph;
    }

    /// <summary>Every project folder under src/ with its source files (.cs and .razor, build output left out).</summary>
    public static IEnumerable<(string Project, IReadOnlyList<(string RelativePath, string Text)> Files)> SourceProjects(string repositoryRoot)
    {
        foreach (string folder in Directory.EnumerateDirectories(Path.Combine(repositoryRoot, "src")).Order(StringComparer.Ordinal))
        {
            var files = new List<(string, string)>();
            foreach (string file in Directory.EnumerateFiles(folder, "*", SearchOption.AllDirectories))
            {
                string relative = Path.GetRelativePath(folder, file).Replace('\\', '/');
                bool source = file.EndsWith(".cs", StringComparison.Ordinal) || file.EndsWith(".razor", StringComparison.Ordinal);
                if (source && !relative.StartsWith("bin/", StringComparison.Ordinal) && !relative.StartsWith("obj/", StringComparison.Ordinal))
                {
                    files.Add((relative, File.ReadAllText(file)));
                }
            }
            yield return (Path.GetFileName(folder), files);
        }
    }

    /// <summary>
    /// The graph between the top-level folders of one project. Files at the project's root are left out: the root
    /// namespace is visible from every folder without a using line, so it is the project's composition layer.
    /// </summary>
    public static DependencyGraph Folders(string project, IEnumerable<(string RelativePath, string Text)> files)
    {
        var list = files.ToList();
        var folders = list.Select(f => TopFolder(f.RelativePath)).Where(f => f is not null).Select(f => f!).ToHashSet(StringComparer.Ordinal);
        var reference = new Regex(@"(?<![\w.])" + Regex.Escape(project) + @"\.(\w+)", RegexOptions.CultureInvariant);
        var graph = new DependencyGraph();
        foreach (var (path, text) in list)
        {
            string? from = TopFolder(path);
            if (from is null)
            {
                continue;
            }
            foreach (string line in text.Split('\n'))
            {
                if (NamespaceDeclaration().IsMatch(line))
                {
                    continue;
                }
                foreach (Match match in reference.Matches(line))
                {
                    string to = match.Groups[1].Value;
                    if (folders.Contains(to) && to != from)
                    {
                        graph.Add(from, to, $"{path}: {line.Trim()}");
                    }
                }
            }
        }
        return graph;
    }

    private static string? TopFolder(string relativePath)
    {
        int slash = relativePath.IndexOf('/', StringComparison.Ordinal);
        return slash < 0 ? null : relativePath[..slash];
    }

    [GeneratedRegex(@"^\s*namespace\s")]
    private static partial Regex NamespaceDeclaration();
}
