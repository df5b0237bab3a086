namespace RunWatch.Web.Data.InMemory;

/// <summary>
/// A self-contained planner for the in-memory source: L from the Arrhenius law integrated over the planned
/// profile, Poisson nucleation sites, raster capture zones (nearest site within L) and the linear radius model
/// r = A + B·Â. The store-backed source plugs in the process model of the verdict pipeline instead.
/// </summary>
public sealed class ScenarioPlanner(double d0CmSquaredPerSecond = 2.5e-5, double activationEv = 1.3, double modelA = 20.4, double modelB = 21.6)
    : IPlannerEngine
{
    private const double BoltzmannEvPerK = 8.617333262e-5;

    public Task<PlannerResult> PredictAsync(PlannerInput input, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(input);
        if (input.Profile.Count == 0 || input.GrowthTime <= TimeSpan.Zero || input.NucleationDensityPerSquareMicrometre <= 0)
        {
            throw new ArgumentException("Give a temperature profile, a positive growth time and a positive nucleation density.", nameof(input));
        }
        // ∫D dt over the growth time, 1 s steps, temperature interpolated linearly in the profile.
        double integral = 0;
        int seconds = (int)input.GrowthTime.TotalSeconds;
        for (int s = 0; s < seconds; s++)
        {
            double tK = TemperatureAt(input.Profile, (s + 0.5) / 60.0) + 273.15;
            integral += d0CmSquaredPerSecond * Math.Exp(-activationEv / (BoltzmannEvPerK * tK));
        }
        double lCm = Math.Sqrt(integral);
        double lNm = lCm * 1e7;
        double dEff = integral / seconds;
        double tEffC = (-activationEv / (BoltzmannEvPerK * Math.Log(dEff / d0CmSquaredPerSecond))) - 273.15;
        var radii = SimulateRadii(input.NucleationDensityPerSquareMicrometre, lNm / 1000, 1);
        var tradeOff = new List<TradeOffPoint>();
        foreach (double factor in new[] { 0.25, 0.5, 0.75, 1, 1.5, 2, 3, 4 })
        {
            double density = input.NucleationDensityPerSquareMicrometre * factor;
            var r = SimulateRadii(density, lNm / 1000, 2);
            double mean = r.Average();
            tradeOff.Add(new TradeOffPoint(density, mean, Math.Sqrt(r.Sum(x => (x - mean) * (x - mean)) / Math.Max(1, r.Count - 1))));
        }
        return Task.FromResult(new PlannerResult(lNm, tEffC, radii, tradeOff));
    }

    private static double TemperatureAt(IReadOnlyList<ProfilePoint> profile, double minutes)
    {
        if (minutes <= profile[0].Minutes)
        {
            return profile[0].TemperatureC;
        }
        for (int i = 1; i < profile.Count; i++)
        {
            if (minutes <= profile[i].Minutes)
            {
                var a = profile[i - 1];
                var b = profile[i];
                return a.TemperatureC + ((b.TemperatureC - a.TemperatureC) * (minutes - a.Minutes) / (b.Minutes - a.Minutes));
            }
        }
        return profile[^1].TemperatureC;
    }

    private List<double> SimulateRadii(double densityPerUm2, double lUm, int seed)
    {
        var random = new Random(seed);
        const int sites = 300;
        double side = Math.Sqrt(sites / densityPerUm2);
        var xs = new double[sites];
        var ys = new double[sites];
        for (int i = 0; i < sites; i++)
        {
            xs[i] = random.NextDouble() * side;
            ys[i] = random.NextDouble() * side;
        }
        const int grid = 150;
        double cell = side / grid;
        var area = new double[sites];
        for (int gy = 0; gy < grid; gy++)
        {
            for (int gx = 0; gx < grid; gx++)
            {
                double px = (gx + 0.5) * cell;
                double py = (gy + 0.5) * cell;
                int best = -1;
                double bestD2 = lUm * lUm;
                for (int i = 0; i < sites; i++)
                {
                    double dx = xs[i] - px;
                    double dy = ys[i] - py;
                    double d2 = (dx * dx) + (dy * dy);
                    if (d2 < bestD2)
                    {
                        bestD2 = d2;
                        best = i;
                    }
                }
                if (best >= 0)
                {
                    area[best] += cell * cell;
                }
            }
        }
        var radii = new List<double>();
        double disc = Math.PI * lUm * lUm;
        for (int i = 0; i < sites; i++)
        {
            // Guard zone: leave out sites whose disc crosses the simulated area's edge.
            if (xs[i] < lUm || ys[i] < lUm || xs[i] > side - lUm || ys[i] > side - lUm)
            {
                continue;
            }
            radii.Add(modelA + (modelB * area[i] / disc));
        }
        return radii.Count > 0 ? radii : [modelA + modelB];
    }
}
