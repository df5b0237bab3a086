using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Thermal;
using RunWatch.Growth;

namespace RunWatch.Commands;

/// <summary>
/// <c>runwatch model fit CASES.json --out MODEL.json</c> and <c>runwatch model predict MODEL.json CASES.json [--json]</c>:
/// fit the diffusion radius model to past wafers, and predict wafers' radii from their fields and thermal histories.
/// Exit codes: 0 done, 2 bad input (the message names the file and field), 3 the data cannot give a model (fit).
/// </summary>
internal static class ModelCommand
{
    public const int BadInputExitCode = 2;
    public const int RefusedExitCode = 3;

    public static Command Create()
    {
        var command = new Command("model", "Fit the diffusion radius model to past wafers, or predict wafers with a fitted model.");
        command.Subcommands.Add(CreateFit());
        command.Subcommands.Add(CreatePredict());
        return command;
    }

    private static Command CreateFit()
    {
        var cases = new Argument<string>("cases") { Description = "Case file (format growth-cases/1)." };
        var output = new Option<string>("--out") { Description = "Where to write the model (JSON).", Required = true };
        var lambdaMin = new Option<double>("--lambda-min-um") { Description = "Smallest capture length the fit may use (µm).", DefaultValueFactory = _ => 0.1 };
        var lambdaMax = new Option<double>("--lambda-max-um") { Description = "Largest capture length the fit may use (µm).", DefaultValueFactory = _ => 3.0 };
        var cell = new Option<double>("--cell-nm") { Description = "Grid cell of the diffusion solution (nm).", DefaultValueFactory = _ => 20 };
        var capture = new Option<string>("--capture")
        {
            Description = "Capture areas from the diffusion solution (diffusion, default) or the simpler Voronoi cell ∩ disc of radius λ (voronoi-disc).",
            DefaultValueFactory = _ => "diffusion",
        };
        capture.AcceptOnlyFromAmong("diffusion", "voronoi-disc");
        var command = new Command("fit", "Fit λ₀², E_λ, κ and r₀ to the wafers of a case file (at least 3 wafers at 2 or more temperatures).");
        command.Arguments.Add(cases);
        command.Options.Add(output);
        command.Options.Add(lambdaMin);
        command.Options.Add(lambdaMax);
        command.Options.Add(cell);
        command.Options.Add(capture);
        command.SetAction(parse => Fit(parse.GetValue(cases)!, parse.GetValue(output)!, parse.GetValue(lambdaMin), parse.GetValue(lambdaMax),
            parse.GetValue(cell), Console.Out, Console.Error,
            parse.GetValue(capture) == "voronoi-disc" ? CaptureAreaMethod.VoronoiDisc : CaptureAreaMethod.Diffusion));
        return command;
    }

    private static Command CreatePredict()
    {
        var model = new Argument<string>("model") { Description = "Model file written by `runwatch model fit`." };
        var cases = new Argument<string>("cases") { Description = "Case file (format growth-cases/1)." };
        var json = new Option<bool>("--json") { Description = "Write every unguarded wire and the summaries as JSON." };
        var command = new Command("predict", "Predict each unguarded wire's radius from its field and the wafer's thermal history, and compare with the measured radius.");
        command.Arguments.Add(model);
        command.Arguments.Add(cases);
        command.Options.Add(json);
        command.SetAction(parse => Predict(parse.GetValue(model)!, parse.GetValue(cases)!, parse.GetValue(json), Console.Out, Console.Error));
        return command;
    }

    internal static int Fit(string casesPath, string outPath, double lambdaMinUm, double lambdaMaxUm, double cellNm, TextWriter stdout, TextWriter stderr,
        CaptureAreaMethod method = CaptureAreaMethod.Diffusion)
    {
        if (!(lambdaMinUm > 0) || !(lambdaMaxUm > lambdaMinUm) || !double.IsFinite(lambdaMaxUm) || !(cellNm > 0) || !double.IsFinite(cellNm))
        {
            stderr.WriteLine("runwatch model fit: need 0 < --lambda-min-um < --lambda-max-um and a positive --cell-nm");
            return BadInputExitCode;
        }
        try
        {
            IReadOnlyList<GrowthCase> cases = GrowthCaseFile.Read(casesPath);
            var wafers = new List<DiffusionWafer>();
            var options = new CaptureTableOptions { CellSizeUm = cellNm / 1000, Method = method };
            for (int i = 0; i < cases.Count; i++)
            {
                stderr.WriteLine($"[{i + 1}/{cases.Count}] {cases[i].Wafer}: reading the log, analysing the image, solving the diffusion field");
                LoadedWafer w = GrowthCaseLoader.Load(cases[i], casesPath, i);
                CaptureAreaTable table = CaptureAreaTable.Build(w.CentresUm, w.FootprintsUm, w.Field, lambdaMinUm, lambdaMaxUm, options);
                wafers.Add(new DiffusionWafer(w.Case.Wafer, table, w.Exposure, w.MeasuredRadiiNm));
            }
            DiffusionFitResult result = DiffusionModelFitter.Fit(wafers);
            if (!result.Succeeded)
            {
                stderr.WriteLine("runwatch model fit: no model: " + result.Refusal);
                return RefusedExitCode;
            }
            var file = new GrowthModelFile(GrowthModelFile.CurrentFormat, Path.GetFullPath(casesPath), cellNm, result.Model!, result.Wafers, method);
            File.WriteAllText(outPath, ModelJson.Serialize(file));
            WriteFit(result, stdout);
            stdout.WriteLine($"model written to {Path.GetFullPath(outPath)}");
            return 0;
        }
        catch (GrowthCaseException ex)
        {
            stderr.WriteLine("runwatch model fit: " + ex.Message);
            return BadInputExitCode;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            stderr.WriteLine("runwatch model fit: cannot write the model: " + ex.Message);
            return BadInputExitCode;
        }
    }

    internal static int Predict(string modelPath, string casesPath, bool json, TextWriter stdout, TextWriter stderr)
    {
        long start = Stopwatch.GetTimestamp();
        try
        {
            GrowthModelFile modelFile = GrowthModelFile.Read(modelPath);
            DiffusionRadiusModel model = modelFile.Model;
            IReadOnlyList<GrowthCase> cases = GrowthCaseFile.Read(casesPath);
            // Guards are judged at the history's largest λ, so the bounds are needed there only.
            var options = new CaptureTableOptions { CellSizeUm = modelFile.CellSizeNm / 1000, BoundsAtEveryNode = false, Method = modelFile.CaptureMethod };
            var outputs = new List<WaferPrediction>();
            var all = new List<(double P, double M)>();
            for (int i = 0; i < cases.Count; i++)
            {
                LoadedWafer w = GrowthCaseLoader.Load(cases[i], casesPath, i);
                (double lo, double hi) = w.Exposure.LambdaRange(model.Law);
                CaptureAreaTable table = CaptureAreaTable.Build(w.CentresUm, w.FootprintsUm, w.Field, lo / 1.05, hi * 1.05, options);
                FieldPrediction p = FieldPrediction.Compute(model, table, w.Exposure);
                var wires = new List<WirePrediction>();
                var pairs = new List<(double P, double M)>();
                for (int k = 0; k < w.CentresUm.Length; k++)
                {
                    if (p.Guarded[k])
                    {
                        continue;
                    }
                    double measured = w.MeasuredRadiiNm[k];
                    wires.Add(new WirePrediction(w.PixelX[k], w.PixelY[k], p.PredictedRadiiNm[k], double.IsFinite(measured) ? measured : null));
                    if (double.IsFinite(measured))
                    {
                        pairs.Add((p.PredictedRadiiNm[k], measured));
                    }
                }
                all.AddRange(pairs);
                double meanC = PhysicalConstants.KelvinToCelsius(w.Exposure.MeanTemperatureK);
                outputs.Add(new WaferPrediction(w.Case.Wafer, meanC, w.Exposure.CoveredS, p.LambdaAtMeanUm, p.LambdaEffUm,
                    !model.Covers(meanC, w.Exposure.CoveredS), w.CentresUm.Length, wires.Count, wires, Summarise(pairs)));
            }
            double seconds = Stopwatch.GetElapsedTime(start).TotalSeconds;
            if (json)
            {
                var document = new { format = "growth-prediction/1", model = Path.GetFullPath(modelPath), wafers = outputs, summary = Summarise(all), seconds };
                stdout.WriteLine(JsonSerializer.Serialize(document, ModelJson.Options));
            }
            else
            {
                WritePredictions(model, outputs, Summarise(all), stdout);
                stderr.WriteLine(string.Create(CultureInfo.InvariantCulture, $"predicted {cases.Count} wafer(s) in {seconds:F1} s"));
            }
            return 0;
        }
        catch (GrowthCaseException ex)
        {
            stderr.WriteLine("runwatch model predict: " + ex.Message);
            return BadInputExitCode;
        }
    }

    internal static PredictionSummary Summarise(List<(double P, double M)> pairs)
    {
        int n = pairs.Count;
        if (n == 0)
        {
            return new PredictionSummary(0, double.NaN, double.NaN, double.NaN);
        }
        double meanM = pairs.Average(x => x.M);
        double bias = pairs.Average(x => x.P - x.M);
        double ssr = pairs.Sum(x => (x.P - x.M) * (x.P - x.M));
        double sst = pairs.Sum(x => (x.M - meanM) * (x.M - meanM));
        return new PredictionSummary(n, bias, Math.Sqrt(ssr / n), sst > 0 ? 1 - (ssr / sst) : double.NaN);
    }

    private static void WriteFit(DiffusionFitResult result, TextWriter o)
    {
        DiffusionRadiusModel m = result.Model!;
        o.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"diffusion radius model: r² = r₀² + κ·∫A(λ(T(t)))dt, λ² = λ₀²·exp(−E_λ/(k_B·T)); {result.Wafers.Count} wafers, {result.Observations} wires"));
        o.WriteLine("parameter        value         95 % interval (profile likelihood)");
        foreach (ParameterEstimate p in m.Parameters)
        {
            o.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  {p.Name,-16} {p.Value,-12:G4} [{p.Lower95:G4}, {p.Upper95:G4}] {p.Unit}"));
        }
        o.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"  lambda_ref is λ at {PhysicalConstants.KelvinToCelsius(m.ReferenceTemperatureK):F1} °C; residual SD {m.ResidualSdNm:F2} nm; calibrated {m.CalibratedMinC:F1}–{m.CalibratedMaxC:F1} °C, {m.CalibratedMinS:F0}–{m.CalibratedMaxS:F0} s"));
        o.WriteLine("wafer        T_mean °C   window s   λ µm    λ_eff µm   wires   measured nm   predicted nm   bias nm   RMSE nm");
        foreach (DiffusionWaferFigures f in result.Wafers)
        {
            o.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"  {f.Id,-10} {f.MeanTemperatureC,9:F1} {f.WindowS,10:F0} {f.LambdaAtMeanUm,7:F3} {f.LambdaEffUm,10:F3} {f.WiresUsed,7} {f.MeanMeasuredNm,13:F2} {f.MeanPredictedNm,14:F2} {f.BiasNm,9:F2} {f.RmseNm,9:F2}"));
        }
    }

    private static void WritePredictions(DiffusionRadiusModel model, List<WaferPrediction> wafers, PredictionSummary total, TextWriter o)
    {
        o.WriteLine("wafer        T_mean °C   window s   λ µm    λ_eff µm   wires (unguarded)   n     bias nm   RMSE nm    r²");
        foreach (WaferPrediction w in wafers)
        {
            o.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"  {w.Wafer,-10} {w.MeanTemperatureC,9:F1} {w.WindowS,10:F0} {w.LambdaAtMeanUm,7:F3} {w.LambdaEffUm,10:F3} {w.WireCount,6} ({w.UnguardedCount,5})    {w.Summary.N,5} {w.Summary.MeanBiasNm,9:F2} {w.Summary.RmseNm,9:F2} {w.Summary.RSquared,6:F3}"));
            if (w.Extrapolated)
            {
                o.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"    warning: outside the calibrated range ({model.CalibratedMinC:F1}–{model.CalibratedMaxC:F1} °C, {model.CalibratedMinS:F0}–{model.CalibratedMaxS:F0} s): the prediction extrapolates"));
            }
        }
        o.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"all wafers: n {total.N}, mean bias {total.MeanBiasNm:F2} nm, RMSE {total.RmseNm:F2} nm, r² {total.RSquared:F3}"));
    }

    /// <summary>One unguarded wire: centroid in pixels, radii in nm (measured null when the wire was not measured as vertical).</summary>
    internal sealed record WirePrediction(double X, double Y, double PredictedRadiusNm, double? MeasuredRadiusNm);

    /// <summary>n wires with both radii; bias = mean(predicted − measured); r² = 1 − SSR/SST.</summary>
    internal sealed record PredictionSummary(int N, double MeanBiasNm, double RmseNm, double RSquared);

    internal sealed record WaferPrediction(string Wafer, double MeanTemperatureC, double WindowS, double LambdaAtMeanUm, double LambdaEffUm,
        bool Extrapolated, int WireCount, int UnguardedCount, IReadOnlyList<WirePrediction> Wires, PredictionSummary Summary);
}
