"""Reference for RunWatch imaging tests: exact EDT with nearest-feature indices by SciPy.

Usage: imaging_edt_zones.py LABELS.png OUT_PREFIX
LABELS.png is a 16-bit PNG of wire labels (0 = substrate). Writes OUT_PREFIX.d2 (int32 little-endian squared
distance from each pixel to the nearest wire pixel) and OUT_PREFIX.idx (int32 linear index y*width+x of that
pixel), both row-major, from scipy.ndimage.distance_transform_edt(labels == 0, return_indices=True).
"""
import sys

import cv2
import numpy as np
from scipy.ndimage import distance_transform_edt

labels = cv2.imread(sys.argv[1], cv2.IMREAD_UNCHANGED)
if labels is None:
    sys.exit(f"cannot read {sys.argv[1]}")
distance, (iy, ix) = distance_transform_edt(labels == 0, return_distances=True, return_indices=True)
h, w = labels.shape
yy, xx = np.mgrid[0:h, 0:w]
d2 = ((iy - yy) ** 2 + (ix - xx) ** 2).astype("<i4")
# The distance scipy returns must agree with its own indices.
assert np.allclose(np.sqrt(d2), distance)
d2.tofile(sys.argv[2] + ".d2")
(iy * w + ix).astype("<i4").tofile(sys.argv[2] + ".idx")
