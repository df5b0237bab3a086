namespace RunWatch.Simulation.Sem;

/// <summary>How a drawn wire touches its neighbours (generator truth).</summary>
public enum TouchArrangement
{
    /// <summary>Free-standing.</summary>
    None,

    /// <summary>Two hexagons sharing (most of) a side face.</summary>
    FaceToFace,

    /// <summary>Two hexagons meeting at a corner.</summary>
    CornerToCorner,

    /// <summary>One of three hexagons in a row, each touching the next face to face.</summary>
    ChainOfThree,
}
