using System.Buffers.Binary;
using System.Globalization;
using System.Text.Json;
using RunWatch.Core.Model.Diffusion;

namespace RunWatch.Testing.Reference;

/// <summary>Runs tests/reference/diffusion_grid_reference.py on a grid's labels and wire circles.</summary>
public static class DiffusionReference
{
    public static JsonDocument Run(SinkGrid grid, double lambda, BorderCondition border, string method)
    {
        string stem = Path.Combine(Path.GetTempPath(), $"runwatch-diffusion-{Guid.NewGuid():N}");
        string labels = stem + ".bin", wires = stem + ".csv";
        try
        {
            Write(grid, labels, wires);
            string json = ReferencePython.Run("diffusion_grid_reference.py", labels, wires,
                grid.Nx.ToString(CultureInfo.InvariantCulture), grid.Ny.ToString(CultureInfo.InvariantCulture),
                F(grid.CellSize), F(grid.OriginX), F(grid.OriginY),
                double.IsPositiveInfinity(lambda) ? "inf" : F(lambda), border.ToString().ToLowerInvariant(), method);
            return JsonDocument.Parse(json);
        }
        finally
        {
            File.Delete(labels);
            File.Delete(wires);
        }
    }

    public static void Write(SinkGrid grid, string labelsPath, string wiresPath)
    {
        var bytes = new byte[grid.Nx * grid.Ny * 4];
        ReadOnlySpan<int> labels = grid.Labels;
        for (int iy = 0; iy < grid.Ny; iy++)
        {
            for (int ix = 0; ix < grid.Nx; ix++)
            {
                BinaryPrimitives.WriteInt32LittleEndian(bytes.AsSpan(((iy * grid.Nx) + ix) * 4), labels[grid.Index(ix, iy)]);
            }
        }
        File.WriteAllBytes(labelsPath, bytes);
        using var writer = new StreamWriter(wiresPath);
        for (int i = 0; i < grid.WireCount; i++)
        {
            writer.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{grid.Centres[i].X:R},{grid.Centres[i].Y:R},{grid.Radii[i]:R}"));
        }
    }

    private static string F(double v) => v.ToString("R", CultureInfo.InvariantCulture);
}
