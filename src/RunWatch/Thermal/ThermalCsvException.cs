namespace RunWatch.Thermal;

/// <summary>A thermal-log CSV that cannot be read; names the line (1-based) and, where known, the column.</summary>
internal sealed class ThermalCsvException(int line, int? column, string? columnName, string problem)
    : FormatException(Describe(line, column, columnName, problem))
{
    public int Line { get; } = line;

    public int? Column { get; } = column;

    private static string Describe(int line, int? column, string? columnName, string problem) =>
        column is { } c
            ? $"line {line}, column {c}{(columnName is null ? "" : $" ({columnName})")}: {problem}"
            : $"line {line}: {problem}";
}
