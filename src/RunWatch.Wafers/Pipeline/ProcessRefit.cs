using System.Globalization;
using RunWatch.Core.Model;
using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>
/// What a refit proposed: the diffusion radius model (or its refusal), the Â regression and the Arrhenius calibration,
/// each null when it could not be fitted.
/// </summary>
public sealed record ProcessRefit(string Process, RadiusModelFit? Radius, ModelFitRecord? RadiusRecord, ArrheniusFit? Arrhenius, ModelFitRecord? ArrheniusRecord,
    DiffusionRefit? Diffusion = null)
{
    /// <summary>One sentence for the audit log.</summary>
    public string Describe()
    {
        string radius = Radius is { } r
            ? string.Create(CultureInfo.InvariantCulture, $"radius model {r.Formula()} (r² {r.RSquared:0.###}, {r.Count} wires, {RadiusRecord!.Wafers.Count} wafers)")
            : "no radius model (too few measured wires)";
        string arrhenius = Arrhenius is { } a
            ? string.Create(CultureInfo.InvariantCulture, $"Arrhenius Ea {a.ActivationEnergy.Value:0.###} eV, D0 {a.Prefactor.Value:0.###e+0} cm²/s ({a.Count} wafers)")
            : "no Arrhenius fit (needs located capture radii at two or more temperatures)";
        string diffusion = Diffusion?.Result?.Model is { } m
            ? "diffusion model " + DescribeDiffusion(m, Diffusion.Result.Observations, Diffusion.Record!.Wafers.Count)
            : "no diffusion model (" + (Diffusion?.Reason ?? "not attempted") + ")";
        return $"proposed {diffusion}; {radius}; {arrhenius}";
    }

    private static string DescribeDiffusion(RunWatch.Core.Model.Diffusion.DiffusionRadiusModel m, int wires, int wafers)
    {
        var parts = new List<string>();
        foreach (ParameterEstimate p in m.Parameters)
        {
            parts.Add(string.Create(CultureInfo.InvariantCulture, $"{p.Name} {p.Value:G4} [{p.Lower95:G4}, {p.Upper95:G4}] {p.Unit}"));
        }
        return string.Join(", ", parts) + string.Create(CultureInfo.InvariantCulture, $" ({wires} wires, {wafers} wafers)");
    }
}
