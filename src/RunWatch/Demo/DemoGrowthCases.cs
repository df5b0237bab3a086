using System.Globalization;
using System.Text;
using System.Text.Json;
using RunWatch.Simulation.Chamber;
using RunWatch.Simulation.Demo;

namespace RunWatch.Demo;

/// <summary>
/// Writes the demo's runs as growth-cases/1 files for <c>runwatch model fit / predict</c> (docs/model.md): each run's
/// simulated record on its own, unaccelerated clock (seconds, 10 Hz) and each wafer's first SEM field. Three wafers at
/// three temperatures and two times calibrate (<see cref="CalibrateFile"/>); the other two are held out
/// (<see cref="HoldOutFile"/>). Invented data, like the rest of the demo.
/// </summary>
internal sealed class DemoGrowthCases(string folder)
{
    /// <summary>Case file of the calibration wafers.</summary>
    public const string CalibrateFile = "calibrate.json";

    /// <summary>Case file of the held-out wafers.</summary>
    public const string HoldOutFile = "hold-out.json";

    private static readonly string[] Calibration = ["W-DEMO-01-A", "W-DEMO-02-A", "W-DEMO-03-A"];

    private readonly List<Dictionary<string, object>> _cases = [];

    public string Folder { get; } = folder;

    /// <summary>Writes the run's record as a CSV (seconds since the run's start) and returns the growth window on that axis.</summary>
    public (double FromS, double ToS) WriteRecord(DemoRunPlan plan, ChamberSimulatorOptions simulation)
    {
        Directory.CreateDirectory(Folder);
        var csv = new StringBuilder(1 << 20);
        csv.Append("time_s,substrate_tc,substrate_sp,ga_shutter\n");
        double from = double.NaN, to = double.NaN;
        foreach (ChamberSample s in new ChamberSimulator(simulation).Run())
        {
            csv.Append(CultureInfo.InvariantCulture, $"{s.TimeS:0.###},{s.SubstrateTcC:0.###},{s.SubstrateSpC:0.###},{s.GaShutter}\n");
            if (s.Step == "growth" && s.GaShutter == 1)
            {
                from = double.IsNaN(from) ? s.TimeS : from;
                to = s.TimeS;
            }
        }
        File.WriteAllText(Path.Combine(Folder, plan.Run + ".csv"), csv.ToString());
        return (from, to);
    }

    /// <summary>Copies the wafer's first field (and its sidecar) beside the cases and lists the wafer.</summary>
    public void AddWafer(string wafer, string run, (double FromS, double ToS) window, string firstImage)
    {
        string name = Path.GetFileName(firstImage);
        File.Copy(firstImage, Path.Combine(Folder, name), overwrite: true);
        File.Copy(firstImage + Imaging.Scale.FieldSidecar.Suffix, Path.Combine(Folder, name + Imaging.Scale.FieldSidecar.Suffix), overwrite: true);
        _cases.Add(new Dictionary<string, object>
        {
            ["wafer"] = wafer, ["thermalLog"] = run + ".csv", ["channel"] = "substrate_tc",
            ["growthFrom"] = window.FromS, ["growthTo"] = window.ToS, ["image"] = name, ["pixelSizeNm"] = DemoWaferFields.PixelNm,
        });
    }

    /// <summary>Writes the two case files.</summary>
    public void WriteCaseFiles()
    {
        Write(CalibrateFile, _cases.Where(c => Calibration.Contains((string)c["wafer"])));
        Write(HoldOutFile, _cases.Where(c => !Calibration.Contains((string)c["wafer"])));
    }

    private void Write(string file, IEnumerable<Dictionary<string, object>> wafers)
    {
        var doc = new Dictionary<string, object> { ["format"] = "growth-cases/1", ["wafers"] = wafers.ToList() };
        File.WriteAllText(Path.Combine(Folder, file), JsonSerializer.Serialize(doc, new JsonSerializerOptions { WriteIndented = true }));
    }
}
