namespace RunWatch.Core.Thermal;

/// <summary>Counts uncovered intervals longer than the gap limit while integrating; allocates only through the caller's collection.</summary>
internal struct GapTally(double maxGapS, ICollection<RecordGap>? gaps)
{
    public int Count { get; private set; }

    public double Longest { get; private set; }

    public void Uncovered(double startS, double endS)
    {
        double length = endS - startS;
        if (length <= 0)
        {
            return;
        }
        Longest = Math.Max(Longest, length);
        if (length > maxGapS)
        {
            Count++;
            gaps?.Add(new RecordGap(startS, endS));
        }
    }
}
