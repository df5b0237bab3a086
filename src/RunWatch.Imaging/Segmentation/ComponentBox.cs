namespace RunWatch.Imaging.Segmentation;

/// <summary>Bounding box (inclusive) and pixel count of one labelled component.</summary>
internal struct ComponentBox
{
    public int MinX;
    public int MinY;
    public int MaxX;
    public int MaxY;
    public int Area;

    public readonly int Width => MaxX - MinX + 1;

    public readonly int Height => MaxY - MinY + 1;

    public static ComponentBox Empty => new() { MinX = int.MaxValue, MinY = int.MaxValue, MaxX = -1, MaxY = -1 };

    public void Add(int x, int y)
    {
        if (x < MinX)
        {
            MinX = x;
        }
        if (x > MaxX)
        {
            MaxX = x;
        }
        if (y < MinY)
        {
            MinY = y;
        }
        if (y > MaxY)
        {
            MaxY = y;
        }
        Area++;
    }
}
