namespace RunWatch.Core.Excursions;

/// <summary>
/// On-delay plus hysteresis for one band: a magnitude beyond the band starts a pending period; it becomes active
/// after the minimum duration unless the magnitude first falls back to band − hysteresis, which also clears it.
/// </summary>
internal struct BandDetector
{
    public bool Pending { get; private set; }

    public bool Active { get; private set; }

    public double SinceS { get; private set; }

    /// <summary>Feeds one magnitude; returns true when <see cref="Active"/> changed.</summary>
    public bool Update(double magnitude, double band, double hysteresis, double minimumS, double timeS)
    {
        bool wasActive = Active;
        if (Pending || Active)
        {
            if (magnitude <= band - hysteresis)
            {
                Pending = false;
                Active = false;
            }
            else if (Pending && timeS - SinceS >= minimumS)
            {
                Pending = false;
                Active = true;
            }
        }
        else if (magnitude > band)
        {
            SinceS = timeS;
            Active = minimumS <= 0;
            Pending = !Active;
        }
        return wasActive != Active;
    }

    public void Reset()
    {
        Pending = false;
        Active = false;
    }
}
