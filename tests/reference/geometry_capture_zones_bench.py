"""Peer for RunWatch's capture-zone benchmark: scipy.spatial.Voronoi + shapely clipping, timed in-process.

Usage: geometry_capture_zones_bench.py POINTS_CSV MINX MINY MAXX MAXY L [L ...]   (L a number or "inf")
Prints JSON {"count": N, "results": [{"length": L, "seconds": t, "total_area": A}, ...]}. The time covers the
computation only (Voronoi, building each cell polygon, intersecting it with the field box and, for finite L, with
the point's disc from Point.buffer at shapely's default resolution), not interpreter start or reading the file.
"""
import json
import sys
import time

import numpy as np
from scipy.spatial import Voronoi
from shapely.geometry import Point, Polygon, box


def zones(points, field, length, bounds):
    minx, miny, maxx, maxy = bounds
    span = max(maxx - minx, maxy - miny)
    cx, cy = (minx + maxx) / 2, (miny + maxy) / 2
    far = 10 * span
    dummies = np.array([[cx - far, cy - far], [cx + far, cy - far], [cx + far, cy + far], [cx - far, cy + far]])
    vor = Voronoi(np.vstack([points, dummies]))
    total = 0.0
    finite = np.isfinite(length)
    for i in range(len(points)):
        cell = Polygon(vor.vertices[vor.regions[vor.point_region[i]]]).intersection(field)
        if finite:
            cell = cell.intersection(Point(points[i, 0], points[i, 1]).buffer(length))
        total += cell.area
    return total


def main(argv):
    points = np.loadtxt(argv[1], delimiter=",", ndmin=2)
    bounds = tuple(float(v) for v in argv[2:6])
    field = box(*bounds)
    results = []
    for text in argv[6:]:
        length = float(text)
        start = time.perf_counter()
        total = zones(points, field, length, bounds)
        results.append({"length": text, "seconds": time.perf_counter() - start, "total_area": total})
    json.dump({"count": len(points), "results": results}, sys.stdout)


if __name__ == "__main__":
    main(sys.argv)
