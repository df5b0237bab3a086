namespace RunWatch.Growth;

/// <summary>A case file (or a file it names) cannot be used; the message names the file and the field.</summary>
internal sealed class GrowthCaseException(string file, string field, string problem)
    : FormatException($"{file}: {field} {problem}")
{
    public string File { get; } = file;

    public string Field { get; } = field;
}
