namespace RunWatch.Core.Wafers;

/// <summary>What the wafer verdict needs of its run's thermal record.</summary>
/// <param name="LEffNm">Effective diffusion length, nm.</param>
/// <param name="Coverage">Fraction of the growth window covered by the record (0..1).</param>
/// <param name="ExcursionCount">Excursions inside the growth window.</param>
/// <param name="MaxAbsRelativeLChange">Largest |ΔL/L| caused by one excursion.</param>
public sealed record RunThermalFacts(double? LEffNm, double? Coverage, int? ExcursionCount, double? MaxAbsRelativeLChange);
