namespace RunWatch.Imaging.Segmentation;

/// <summary>
/// 8-connected labelling of the pixels above a threshold, by the classical two-pass algorithm with a union-find
/// table (Rosenfeld &amp; Pfaltz 1966; union by smaller label, path halving). Labels are 1..n in raster order of
/// each component's first pixel, 0 is background.
/// </summary>
internal static class ConnectedLabeling
{
    /// <summary>Labels pixels with value &gt; <paramref name="threshold"/>; returns the component count and fills <paramref name="boxes"/> (index = label).</summary>
    public static int Label(ReadOnlySpan<ushort> pixels, int width, int height, int threshold, Span<int> labels, out ComponentBox[] boxes)
    {
        var parent = new int[1024];
        int next = 1;
        for (int y = 0; y < height; y++)
        {
            int row = y * width;
            for (int x = 0; x < width; x++)
            {
                int i = row + x;
                if (pixels[i] <= threshold)
                {
                    labels[i] = 0;
                    continue;
                }
                int north = y > 0 ? labels[i - width] : 0;
                if (north != 0)
                {
                    // N touches W, NW and NE in 8-connectivity, so they already share its set.
                    labels[i] = north;
                    continue;
                }
                int west = x > 0 ? labels[i - 1] : 0;
                int northWest = y > 0 && x > 0 ? labels[i - width - 1] : 0;
                int northEast = y > 0 && x + 1 < width ? labels[i - width + 1] : 0;
                int l = west != 0 ? west : northWest;
                if (northEast != 0)
                {
                    if (l != 0)
                    {
                        Union(parent, l, northEast);
                    }
                    else
                    {
                        l = northEast;
                    }
                }
                if (l == 0)
                {
                    if (next == parent.Length)
                    {
                        Array.Resize(ref parent, parent.Length * 2);
                    }
                    parent[next] = next;
                    l = next++;
                }
                labels[i] = l;
            }
        }

        var final = new int[next];
        int count = 0;
        for (int l = 1; l < next; l++)
        {
            int root = Find(parent, l);
            final[l] = root == l ? ++count : final[root];
        }
        boxes = new ComponentBox[count + 1];
        for (int k = 1; k <= count; k++)
        {
            boxes[k] = ComponentBox.Empty;
        }
        for (int y = 0; y < height; y++)
        {
            Span<int> row = labels.Slice(y * width, width);
            for (int x = 0; x < width; x++)
            {
                if (row[x] != 0)
                {
                    int f = final[row[x]];
                    row[x] = f;
                    boxes[f].Add(x, y);
                }
            }
        }
        return count;
    }

    private static int Find(int[] parent, int x)
    {
        while (parent[x] != x)
        {
            parent[x] = parent[parent[x]];
            x = parent[x];
        }
        return x;
    }

    private static void Union(int[] parent, int a, int b)
    {
        int ra = Find(parent, a);
        int rb = Find(parent, b);
        if (ra < rb)
        {
            parent[rb] = ra;
        }
        else if (rb < ra)
        {
            parent[ra] = rb;
        }
    }
}
