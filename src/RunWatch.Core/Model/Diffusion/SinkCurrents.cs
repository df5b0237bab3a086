namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// What one steady-state solve gives, every figure divided by the deposition flux F, so currents are areas (in the
/// grid's length unit squared): a wire collects what lands on <see cref="CaptureAreas"/>[i] of substrate.
/// </summary>
/// <param name="CaptureAreas">Each wire's sink current ÷ F (substrate collection; what lands on the footprint itself is not included).</param>
/// <param name="DesorbedArea">Desorption rate ÷ F = Σ n/τ over the free cells ÷ F.</param>
/// <param name="BorderOutflowArea">Net flow out across the field edge and band ÷ F (negative when the border feeds the field; 0 for reflecting and periodic borders).</param>
/// <param name="FreeArea">Area of the free substrate cells.</param>
/// <param name="Iterations">Conjugate-gradient iterations used.</param>
/// <param name="RelativeResidual">Final ‖b − A·u‖₂ / ‖b‖₂.</param>
public sealed record SinkCurrents(double[] CaptureAreas, double DesorbedArea, double BorderOutflowArea, double FreeArea, int Iterations, double RelativeResidual)
{
    /// <summary>Σ captured + desorbed + border outflow − free area: zero by mass balance, up to the solver's tolerance.</summary>
    public double BalanceError
    {
        get
        {
            double captured = 0;
            foreach (double a in CaptureAreas)
            {
                captured += a;
            }
            return captured + DesorbedArea + BorderOutflowArea - FreeArea;
        }
    }
}
