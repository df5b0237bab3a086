namespace RunWatch.Core.Profiles;

/// <summary>
/// A fitted edge profile f(u) = A·Φ(−(u−δ)/σ) + B·E(u−δ), E the exponential rim blurred by the same Gaussian
/// (see <see cref="BlurredEdgeFit"/>). Lengths in the profile's own unit (pixels for images).
/// </summary>
/// <param name="Offset">δ: where the step edge lies relative to the profile's origin.</param>
/// <param name="Sigma">σ of the Gaussian blur.</param>
/// <param name="StepHeight">A: height of the step.</param>
/// <param name="RimHeight">B: height of the exponential rim at the edge, before blurring (0 = a plain blurred step).</param>
/// <param name="RimWidth">w: decay length of the rim inwards.</param>
/// <param name="Rms">Root-mean-square residual of the fit.</param>
public readonly record struct BlurredEdge(double Offset, double Sigma, double StepHeight, double RimHeight, double RimWidth, double Rms);
