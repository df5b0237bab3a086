namespace RunWatch.Core.Safety;

/// <summary>Broad hazard class of a reminder, shown as a text label next to it.</summary>
public enum HazardKind
{
    /// <summary>Toxic arsenic deposits, arsenic and hydride sources.</summary>
    ToxicMaterial,

    /// <summary>Hot cells, heaters, hot substrates and bake-out.</summary>
    HotSurface,

    /// <summary>Liquid nitrogen and other cryogens; oxygen depletion.</summary>
    Cryogen,

    /// <summary>Vacuum vessels and viewports, pressure difference on venting.</summary>
    Vacuum,

    /// <summary>High voltage (electron guns, gauges) and the X-rays it can produce.</summary>
    HighVoltage,

    /// <summary>The dashboard's own view of the chamber may be out of date.</summary>
    Monitoring,
}
