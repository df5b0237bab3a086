namespace RunWatch.Benchmarks;

/// <summary>
/// Small harness: <c>runwatch-bench [--quick] [name ...]</c>. Benchmarks report figures and ratios; they never
/// pass or fail on time, because these machines are shared and noisy.
/// </summary>
internal static class BenchmarkRunner
{
    public static int Run(string[] args)
    {
        bool quick = args.Contains("--quick");
        var names = args.Where(a => !a.StartsWith("--", StringComparison.Ordinal)).ToHashSet(StringComparer.OrdinalIgnoreCase);
        if (args.Contains("--list"))
        {
            foreach (var b in BenchmarkCatalog.All)
            {
                Console.WriteLine($"{b.Name,-16} {b.Description}");
            }
            return 0;
        }

        int failures = 0;
        foreach (var benchmark in BenchmarkCatalog.All)
        {
            if (names.Count > 0 && !names.Contains(benchmark.Name))
            {
                continue;
            }
            Console.WriteLine($"== benchmark {benchmark.Name}: {benchmark.Description}{(quick ? " (quick)" : "")}");
            try
            {
                if (benchmark.Run(quick, Console.Out) != 0)
                {
                    failures++;
                }
            }
            catch (Exception ex)
            {
                Console.WriteLine($"   could not run: {ex.Message}");
                failures++;
            }
        }
        return failures == 0 ? 0 : 1;
    }
}
