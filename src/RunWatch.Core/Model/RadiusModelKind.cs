namespace RunWatch.Core.Model;

/// <summary>The form of a per-process radius model: wire radius as a function of normalised capture area Â.</summary>
public enum RadiusModelKind
{
    /// <summary>r = a + b·Â.</summary>
    Linear,

    /// <summary>r = k·Â^p (mass balance at fixed wire height gives p ≈ 0.5).</summary>
    PowerLaw,
}
