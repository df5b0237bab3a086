"""Reference capture zones for RunWatch's geometry tests: scipy.spatial.Voronoi cells clipped with shapely.

Usage: geometry_capture_zones.py POINTS_CSV MINX MINY MAXX MAXY L [BAND_MINX BAND_MINY BAND_MAXX BAND_MAXY]
POINTS_CSV holds one "x,y" line per point. L is a number or "inf". The optional band is cut out of the field.
Prints JSON: {"areas": [...], "cell_inside_field": [...]} in input order, where cell_inside_field says whether
the unclipped Voronoi cell lies inside the (banded) field.

Independent of RunWatch: cells come from scipy's Qhull-based Voronoi, with four far dummy sites so every real
cell is bounded; the clip is shapely's polygon intersection with the field box and with a 1024-gon disc
(Point.buffer, resolution 256 per quarter), whose area is short of pi*L^2 by about 6e-6 relative.
"""
import json
import sys

import numpy as np
from scipy.spatial import Voronoi
from shapely.geometry import Point, Polygon, box


def main(argv):
    points = np.loadtxt(argv[1], delimiter=",", ndmin=2)
    minx, miny, maxx, maxy = (float(v) for v in argv[2:6])
    length = float(argv[6])
    region = box(minx, miny, maxx, maxy)
    if len(argv) > 7:
        region = region.difference(box(*(float(v) for v in argv[7:11])))
    span = max(maxx - minx, maxy - miny)
    cx, cy = (minx + maxx) / 2, (miny + maxy) / 2
    far = 10 * span
    dummies = np.array([[cx - far, cy - far], [cx + far, cy - far], [cx + far, cy + far], [cx - far, cy + far]])
    vor = Voronoi(np.vstack([points, dummies]))
    areas, inside = [], []
    for i, (x, y) in enumerate(points):
        region_index = vor.point_region[i]
        vertices = vor.regions[region_index]
        if -1 in vertices or len(vertices) < 3:
            raise SystemExit(f"cell {i} unbounded despite dummy sites")
        cell = Polygon(vor.vertices[vertices])
        inside.append(bool(region.contains(cell)))
        zone = cell.intersection(region)
        if np.isfinite(length):
            zone = zone.intersection(Point(x, y).buffer(length, resolution=256))
        areas.append(zone.area)
    json.dump({"areas": areas, "cell_inside_field": inside}, sys.stdout)


if __name__ == "__main__":
    main(sys.argv)
