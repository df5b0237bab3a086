using System.Text.Json;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;

namespace RunWatch.Growth;

/// <summary>The file <c>runwatch model fit</c> writes and <c>model predict</c> reads (format growth-model/1).</summary>
/// <param name="Format">Always <see cref="CurrentFormat"/>.</param>
/// <param name="CaseFile">The case file it was fitted from.</param>
/// <param name="CellSizeNm">Grid cell used for the diffusion solution.</param>
/// <param name="Model">The fitted model.</param>
/// <param name="Wafers">How it fitted each wafer.</param>
/// <param name="CaptureMethod">Where capture areas came from (the diffusion solution unless the simpler Voronoi ∩ disc was asked for).</param>
internal sealed record GrowthModelFile(string Format, string CaseFile, double CellSizeNm, DiffusionRadiusModel Model, IReadOnlyList<DiffusionWaferFigures> Wafers,
    CaptureAreaMethod CaptureMethod = CaptureAreaMethod.Diffusion)
{
    public const string CurrentFormat = "growth-model/1";

    public static GrowthModelFile Read(string path)
    {
        try
        {
            GrowthModelFile file = ModelJson.Deserialize<GrowthModelFile>(File.ReadAllText(path));
            if (file.Format != CurrentFormat)
            {
                throw new GrowthCaseException(path, "format", $"is '{file.Format}'; this version reads '{CurrentFormat}'");
            }
            if (file.Model is null || !(file.Model.Lambda0SquaredUm2 > 0) || !(file.Model.KappaNm2PerUm2S > 0))
            {
                throw new GrowthCaseException(path, "model", "is missing or has non-positive lambda0SquaredUm2 / kappaNm2PerUm2S");
            }
            return file;
        }
        catch (JsonException ex)
        {
            throw new GrowthCaseException(path, ex.Path ?? "file", "is not a growth model: " + ex.Message);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            throw new GrowthCaseException(path, "file", "cannot be read: " + ex.Message);
        }
    }
}
