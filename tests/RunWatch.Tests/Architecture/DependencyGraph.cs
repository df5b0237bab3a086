namespace RunWatch.Tests.Architecture;

/// <summary>A directed graph of names (projects or folders) with the evidence for each edge, and a loop finder.</summary>
internal sealed class DependencyGraph
{
    private readonly SortedDictionary<string, SortedDictionary<string, string>> _edges = new(StringComparer.Ordinal);

    /// <summary>Records that <paramref name="from"/> depends on <paramref name="to"/>; the first evidence is kept.</summary>
    public void Add(string from, string to, string evidence)
    {
        if (from == to)
        {
            return;
        }
        if (!_edges.TryGetValue(from, out var targets))
        {
            targets = new SortedDictionary<string, string>(StringComparer.Ordinal);
            _edges[from] = targets;
        }
        targets.TryAdd(to, evidence);
    }

    public IEnumerable<string> DependenciesOf(string node) =>
        _edges.TryGetValue(node, out var targets) ? targets.Keys : [];

    /// <summary>
    /// The first loop found by depth-first search, as "a → b (evidence) → … → a", or null when the graph has none.
    /// </summary>
    public string? FindLoop()
    {
        var state = new Dictionary<string, int>(StringComparer.Ordinal); // 1 = on the current path, 2 = done
        var path = new List<string>();
        foreach (string start in _edges.Keys)
        {
            string? loop = Visit(start, state, path);
            if (loop is not null)
            {
                return loop;
            }
        }
        return null;
    }

    private string? Visit(string node, Dictionary<string, int> state, List<string> path)
    {
        state.TryGetValue(node, out int seen);
        if (seen == 2)
        {
            return null;
        }
        if (seen == 1)
        {
            int from = path.IndexOf(node);
            var loop = path.Skip(from).Append(node).ToList();
            var steps = new List<string> { loop[0] };
            for (int i = 1; i < loop.Count; i++)
            {
                steps.Add($"{loop[i]} ({_edges[loop[i - 1]][loop[i]]})");
            }
            return string.Join(" → ", steps);
        }
        state[node] = 1;
        path.Add(node);
        foreach (string next in DependenciesOf(node))
        {
            string? loop = Visit(next, state, path);
            if (loop is not null)
            {
                return loop;
            }
        }
        path.RemoveAt(path.Count - 1);
        state[node] = 2;
        return null;
    }
}
