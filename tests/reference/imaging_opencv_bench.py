"""Peer pipeline for the RunWatch imaging benchmark (Debian python3-opencv).

Usage: imaging_opencv_bench.py IMAGE.png REPEATS BOTTOM_ROWS
On the same 16-bit file as RunWatch, per repeat: imread (unchanged depth), crop off the information strip,
GaussianBlur 5x5, Otsu threshold (16-bit), connectedComponentsWithStats (8-connected), distanceTransform of
the wires (L2, precise mask) and distanceTransformWithLabels of the substrate (nearest wire pixel, the
raster capture-zone step). Prints JSON with the median time of each step and of the whole, in ms, and the
peak resident memory of this process in MiB.
"""
import json
import resource
import statistics
import sys
import time

import cv2
import numpy as np

path, repeats, bottom = sys.argv[1], int(sys.argv[2]), int(sys.argv[3])
steps = {}
components = threshold = None
for _ in range(repeats):
    t = {}
    t0 = time.perf_counter()
    image = cv2.imread(path, cv2.IMREAD_UNCHANGED)
    t["decode"] = time.perf_counter()
    if bottom > 0:
        image = image[: image.shape[0] - bottom]
    blurred = cv2.GaussianBlur(image, (5, 5), 0)
    t["blur"] = time.perf_counter()
    threshold, mask = cv2.threshold(blurred, 0, 65535, cv2.THRESH_BINARY + cv2.THRESH_OTSU)
    mask = (mask > 0).astype(np.uint8)
    t["otsu"] = time.perf_counter()
    components, labels, stats, centroids = cv2.connectedComponentsWithStats(mask, connectivity=8)
    t["components"] = time.perf_counter()
    inside = cv2.distanceTransform(mask, cv2.DIST_L2, cv2.DIST_MASK_PRECISE)
    t["edt wires"] = time.perf_counter()
    outside, nearest = cv2.distanceTransformWithLabels(1 - mask, cv2.DIST_L2, cv2.DIST_MASK_5, labelType=cv2.DIST_LABEL_PIXEL)
    t["edt substrate"] = time.perf_counter()
    previous = t0
    for name, at in t.items():
        steps.setdefault(name, []).append((at - previous) * 1000)
        previous = at
    steps.setdefault("total", []).append((previous - t0) * 1000)
print(json.dumps({
    "ms": {k: statistics.median(v) for k, v in steps.items()},
    "components": int(components) - 1,
    "threshold": float(threshold),
    "peak_rss_mib": resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024,
}))
