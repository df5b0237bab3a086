namespace RunWatch.Simulation.Sem;

/// <summary>Scatters wires, touching groups, tilted wires and crystallites over a field for <see cref="MicroscopeFieldGenerator"/>.</summary>
public static class MicroscopeScene
{
    /// <summary>Hexagon side a of a top whose area equals the disc of radius r: (3√3/2)a² = πr².</summary>
    public static double SideForRadius(double radius) => radius * Math.Sqrt(2 * Math.PI / (3 * Math.Sqrt(3)));

    /// <summary>
    /// Units placed by dart throwing (bounded tries) at least <see cref="MicroscopeSceneOptions.GapPx"/> apart, inside
    /// the sample rows of <paramref name="field"/>, positions foreshortened by its tilt. The spec's own objects are ignored.
    /// </summary>
    public static IReadOnlyList<MicroscopeObject> Build(MicroscopeFieldSpec field, MicroscopeSceneOptions options)
    {
        ArgumentNullException.ThrowIfNull(field);
        ArgumentNullException.ThrowIfNull(options);
        if (!(options.MinRadiusPx > 0) || options.MaxRadiusPx < options.MinRadiusPx || !(options.ContactAngleDeg is > 90 and < 180))
        {
            throw new ArgumentOutOfRangeException(nameof(options), "radii must be positive and ordered, the contact angle within (90°, 180°)");
        }
        var random = new Random(options.Seed);
        double cosTilt = Math.Cos(field.TiltDeg * Math.PI / 180);
        double planeHeight = field.SampleRows / cosTilt;
        var placed = new List<(double X, double Y, double R)>();
        var objects = new List<MicroscopeObject>();
        int group = 0;
        long tries = 0;
        for (int unit = 0; unit < options.Units && tries < 200L * options.Units; unit++)
        {
            List<MicroscopeObject> members = MakeUnit(random, options, ref group);
            double reach = 0;
            foreach (MicroscopeObject m in members)
            {
                reach = Math.Max(reach, Math.Sqrt((m.X * m.X) + (m.Y * m.Y)) + Extent(m));
            }
            bool done = false;
            while (!done && tries++ < 200L * options.Units)
            {
                double x = reach + 2 + (random.NextDouble() * (field.Width - (2 * reach) - 4));
                double y = reach + 2 + (random.NextDouble() * (planeHeight - (2 * reach) - 4));
                if (x < 0 || y < 0 || placed.Exists(p => Math.Pow(p.X - x, 2) + Math.Pow(p.Y - y, 2) < Math.Pow(p.R + reach + options.GapPx, 2)))
                {
                    continue;
                }
                placed.Add((x, y, reach));
                foreach (MicroscopeObject m in members)
                {
                    objects.Add(m with { X = x + m.X, Y = field.SampleTop + ((y + m.Y) * cosTilt) });
                }
                done = true;
            }
        }
        return objects;
    }

    private static double Extent(MicroscopeObject m) => m.Kind switch
    {
        SemObjectKind.Vertical => Math.Max(m.Size, m.DropletRadius),
        SemObjectKind.Tilted => (m.Length / 2) + m.Size + (2 * m.DropletRadius),
        _ => m.Outline.Max(p => Math.Sqrt((p.X * p.X) + (p.Y * p.Y))),
    };

    /// <summary>One unit with member positions relative to the unit's centre (sample plane).</summary>
    private static List<MicroscopeObject> MakeUnit(Random random, MicroscopeSceneOptions o, ref int group)
    {
        double Radius() => o.MinRadiusPx + (random.NextDouble() * (o.MaxRadiusPx - o.MinRadiusPx));
        double angle = random.NextDouble() * 60;
        double u = random.NextDouble();
        double edge = o.FaceToFaceFraction, corner = edge + o.CornerToCornerFraction, chain = corner + o.ChainFraction;
        double tilted = chain + o.TiltedFraction, crystal = tilted + o.CrystalliteFraction;
        if (u < chain)
        {
            group++;
            TouchArrangement touch = u < edge ? TouchArrangement.FaceToFace : u < corner ? TouchArrangement.CornerToCorner : TouchArrangement.ChainOfThree;
            int count = touch == TouchArrangement.ChainOfThree ? 3 : 2;
            // Neighbours share one rotation; they meet along a face normal (θ + k·60°) or a corner direction (θ + 30° + k·60°).
            double direction = (angle + (60 * random.Next(6)) + (touch == TouchArrangement.CornerToCorner ? 30 : 0)) * Math.PI / 180;
            var members = new List<MicroscopeObject>(count);
            double cx = 0, cy = 0, previousSide = 0;
            for (int k = 0; k < count; k++)
            {
                double side = SideForRadius(Radius());
                if (k > 0)
                {
                    double gap = -0.3 + (0.5 * random.NextDouble());
                    double step = touch == TouchArrangement.CornerToCorner ? previousSide + side : (previousSide + side) * Math.Sqrt(3) / 2;
                    cx += (step + gap) * Math.Cos(direction);
                    cy += (step + gap) * Math.Sin(direction);
                    if (touch == TouchArrangement.ChainOfThree && random.NextDouble() < 0.5)
                    {
                        direction += (random.NextDouble() < 0.5 ? -1 : 1) * Math.PI / 3;
                    }
                }
                members.Add(new MicroscopeObject { Kind = SemObjectKind.Vertical, X = cx, Y = cy, Size = side, AngleDeg = angle, Group = group, Touch = touch });
                previousSide = side;
            }
            double mx = members.Average(m => m.X), my = members.Average(m => m.Y);
            return members.Select(m => m with { X = m.X - mx, Y = m.Y - my }).ToList();
        }
        if (u < tilted)
        {
            double half = 0.8 * SideForRadius(Radius());
            return [new MicroscopeObject
            {
                Kind = SemObjectKind.Tilted, X = 0, Y = 0, Size = half, Length = half * (4 + (4 * random.NextDouble())),
                AngleDeg = random.NextDouble() * 360, DropletRadius = random.NextDouble() < 0.5 ? 1.1 * half : 0,
            }];
        }
        if (u < crystal)
        {
            return [Crystallite(random, o)];
        }
        double a = SideForRadius(Radius());
        double droplet = 0;
        double v = random.NextDouble();
        if (v < o.DropletOnlyFraction)
        {
            // Spherical cap with contact angle θ > 90° on a top of radius r: seen from above its outline is the sphere's equator, R = r / sin θ.
            droplet = Math.Sqrt(1.5 * Math.Sqrt(3) * a * a / Math.PI) / Math.Sin(o.ContactAngleDeg * Math.PI / 180);
        }
        else if (v < o.DropletOnlyFraction + o.VisibleFacetDropletFraction)
        {
            droplet = a * (0.5 + (0.3 * random.NextDouble()));
        }
        return [new MicroscopeObject { Kind = SemObjectKind.Vertical, X = 0, Y = 0, Size = a, AngleDeg = angle, DropletRadius = droplet }];
    }

    private static MicroscopeObject Crystallite(Random random, MicroscopeSceneOptions o) => RandomCrystallite(random, (o.MinRadiusPx + o.MaxRadiusPx) / 2);

    /// <summary>
    /// An irregular star-shaped polygon centred on (0, 0): 3–9 corners, jittered radii, stretched along a random axis,
    /// 0.35–2.25 × <paramref name="wireRadiusPx"/> in size and 0.55–1.35 × a top's brightness: unlike a wire's on average, not always.
    /// </summary>
    public static MicroscopeObject RandomCrystallite(Random random, double wireRadiusPx)
    {
        ArgumentNullException.ThrowIfNull(random);
        int n = 3 + random.Next(7);
        double mean = wireRadiusPx * (0.35 + (1.9 * random.NextDouble()));
        double stretch = 1 + (1.2 * random.NextDouble());
        double axis = random.NextDouble() * Math.PI;
        double start = random.NextDouble() * 2 * Math.PI;
        var points = new List<(double X, double Y)>(n);
        for (int k = 0; k < n; k++)
        {
            double phi = start + ((k + (0.6 * (random.NextDouble() - 0.5))) * 2 * Math.PI / n);
            double r = mean * (0.65 + (0.7 * random.NextDouble()));
            double x = r * Math.Cos(phi), y = r * Math.Sin(phi);
            // Stretch along `axis` by `stretch`, shrink across it to keep the area near the mean's disc.
            double along = (x * Math.Cos(axis)) + (y * Math.Sin(axis)), across = (-x * Math.Sin(axis)) + (y * Math.Cos(axis));
            along *= Math.Sqrt(stretch);
            across /= Math.Sqrt(stretch);
            points.Add(((along * Math.Cos(axis)) - (across * Math.Sin(axis)), (along * Math.Sin(axis)) + (across * Math.Cos(axis))));
        }
        points.Sort((p, q) => Math.Atan2(p.Y, p.X).CompareTo(Math.Atan2(q.Y, q.X)));
        return new MicroscopeObject
        {
            Kind = SemObjectKind.Parasitic, X = 0, Y = 0, Size = mean, AngleDeg = axis * 180 / Math.PI, Outline = points,
            BrightnessFactor = 0.55 + (0.8 * random.NextDouble()),
        };
    }
}
