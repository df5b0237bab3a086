using RunWatch.Benchmarks;

return BenchmarkRunner.Run(args);
