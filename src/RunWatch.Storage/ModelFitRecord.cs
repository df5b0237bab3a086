namespace RunWatch.Storage;

/// <summary>A fitted model of a process (radius model or Arrhenius calibration), proposed or accepted.</summary>
public sealed record ModelFitRecord
{
    /// <summary>Store id; 0 before it is stored.</summary>
    public long Id { get; init; }

    /// <summary>Process (recipe family).</summary>
    public required string Process { get; init; }

    /// <summary>Kind of model, one of <see cref="ModelKinds"/>.</summary>
    public required string Model { get; init; }

    /// <summary>When it was fitted.</summary>
    public DateTimeOffset FittedAt { get; init; }

    /// <summary>Parameters and their intervals as JSON.</summary>
    public required string ParamsJson { get; init; }

    /// <summary>Coefficient of determination of the fit.</summary>
    public double? RSquared { get; init; }

    /// <summary>Root-mean-square error, nm.</summary>
    public double? RmseNm { get; init; }

    /// <summary>Wafers the fit used.</summary>
    public IReadOnlyList<string> Wafers { get; init; } = [];

    /// <summary>When a person accepted it; null while only proposed.</summary>
    public DateTimeOffset? AcceptedAt { get; init; }

    /// <summary>Who accepted it.</summary>
    public string? AcceptedBy { get; init; }
}
