using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.PointPatterns;
using RunWatch.Core.Thermal;

namespace RunWatch.Testing.Physics;

/// <summary>
/// Invented wafers whose radii come from the adatom random-walk simulation (never from the model under test):
/// self-catalysed-wire-like numbers (about 1.5 wires/µm², radii 30–70 nm, λ of a few hundred nm), invented. The
/// wires grow during the history (footprints follow their radius), which the model only approximates.
/// </summary>
public static class GrowthTruth
{
    public const double R0Nm = 20, KappaNm2PerUm2S = 2.5, NoiseNm = 1.5;

    /// <summary>Truth law: λ(610 °C) = 0.6 µm, E_λ = −1.2 eV (desorption outpaces diffusion: hotter means shorter).</summary>
    public static CaptureLengthLaw Law { get; } = CaptureLengthLaw.Through(0.6, PhysicalConstants.CelsiusToKelvin(610), -1.2);

    /// <summary>A 1 Hz substrate record: the setpoint with ±0.3 K noise, plus an optional excursion (ramps of 20 s).</summary>
    public static ThermalRecord Record(double setpointC, double seconds, int seed, double excursionStartS = double.NaN, double excursionS = 0, double excursionK = 0)
    {
        var random = new Random(seed);
        int count = (int)seconds + 1;
        var t = new double[count];
        var c = new double[count];
        for (int i = 0; i < count; i++)
        {
            t[i] = i;
            double lift = 0;
            if (double.IsFinite(excursionStartS))
            {
                double into = i - excursionStartS;
                lift = into < 0 || into > excursionS + 40 ? 0 : excursionK * Math.Min(1, Math.Min(into / 20, (excursionS + 40 - into) / 20));
            }
            c[i] = setpointC + lift + (0.3 * ((2 * random.NextDouble()) - 1));
        }
        return new ThermalRecord("substrate_tc", t, c);
    }

    /// <summary>One wafer: sites, simulated collection, measured radii with noise; the field the model sees is the box as an image.</summary>
    public static (Point2D[] Centres, double[] RadiiNm, CaptureField Field) Wafer(ThermalRecord record, CaptureLengthLaw law, int seed, double widthUm = 10, double heightUm = 8, long adatomsPerWire = 2000)
    {
        var box = CaptureField.PeriodicBox(widthUm, heightUm);
        Point2D[] centres = NucleationSites.RandomSequentialAdsorption(box, 1.5, 0.25, seed).Points;
        var lambdas = new double[record.Count];
        var seconds = new double[record.Count];
        for (int i = 0; i < record.Count; i++)
        {
            lambdas[i] = law.LambdaUm(PhysicalConstants.CelsiusToKelvin(record.ReadingsC[i]));
            seconds[i] = 1;
        }
        // Wires grow while they collect: the history is run in slices, each with footprints at the radius reached
        // half-way through it (from the collection so far plus half the previous slice's rate).
        const int slices = 6;
        var integrals = new double[centres.Length];
        var lastSlice = new double[centres.Length];
        var footprints = new double[centres.Length];
        int perSlice = (record.Count + slices - 1) / slices;
        for (int s = 0; s < slices; s++)
        {
            int from = s * perSlice, to = Math.Min(record.Count, from + perSlice);
            if (to <= from)
            {
                break;
            }
            for (int i = 0; i < centres.Length; i++)
            {
                double ahead = s == 0 ? 0 : 0.5 * lastSlice[i] * (to - from) / perSlice;
                footprints[i] = Math.Sqrt((R0Nm * R0Nm) + (KappaNm2PerUm2S * (integrals[i] + ahead))) / 1000;
            }
            double[] slice = AdatomWalkSimulator.Collect(centres, footprints, widthUm, heightUm, lambdas.AsSpan(from, to - from),
                seconds.AsSpan(from, to - from), adatomsPerWire * centres.Length * (to - from) / record.Count, seed + 1000 + s);
            for (int i = 0; i < centres.Length; i++)
            {
                integrals[i] += slice[i];
                lastSlice[i] = slice[i];
            }
        }
        var random = new Random(seed + 2000);
        var radii = new double[centres.Length];
        for (int i = 0; i < radii.Length; i++)
        {
            double gauss = Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
            radii[i] = Math.Sqrt((R0Nm * R0Nm) + (KappaNm2PerUm2S * integrals[i])) + (NoiseNm * gauss);
        }
        // The image: the same region, seen as a plain rectangle (its neighbours beyond the edge unknown to the model).
        return (centres, radii, CaptureField.Rectangle(widthUm, heightUm));
    }

    public static DiffusionWafer ModelWafer(string id, ThermalRecord record, (Point2D[] Centres, double[] RadiiNm, CaptureField Field) w, double lambdaMin = 0.15, double lambdaMax = 3)
    {
        double[] footprintUm = w.RadiiNm.Select(GrowthFootprint.FootprintUm).ToArray();
        CaptureAreaTable table = CaptureAreaTable.Build(w.Centres, footprintUm, w.Field, lambdaMin, lambdaMax);
        ThermalExposure exposure = ThermalExposure.FromRecord(record, TemperatureCalibration.Identity, new GrowthWindow(0, record.TimesS[^1]));
        return new DiffusionWafer(id, table, exposure, w.RadiiNm);
    }
}
