namespace RunWatch.Benchmarks;

/// <summary>A benchmark that prints its own figures and, where it has one, the ratio to a peer run in the same process.</summary>
internal interface IBenchmark
{
    /// <summary>Short name used on the command line.</summary>
    string Name { get; }

    /// <summary>What it measures, one line.</summary>
    string Description { get; }

    /// <summary>Runs the benchmark; <paramref name="quick"/> shrinks it for CI. Returns 0, or non-zero if it could not run.</summary>
    int Run(bool quick, TextWriter output);
}
