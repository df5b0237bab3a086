"""Reference for RunWatch imaging tests: Otsu threshold and 8-connected component count by scikit-image.

Usage: imaging_skimage_check.py IMAGE.png
Reads a 16-bit grayscale PNG (OpenCV, unchanged depth), prints JSON
{"threshold": t, "components": n, "foreground": k} with t = skimage.filters.threshold_otsu(image),
foreground = image > t and n = skimage.measure.label(foreground, connectivity=2).max().
"""
import json
import sys

import cv2
import numpy as np
from skimage.filters import threshold_otsu
from skimage.measure import label

image = cv2.imread(sys.argv[1], cv2.IMREAD_UNCHANGED)
if image is None or image.dtype != np.uint16:
    sys.exit(f"cannot read {sys.argv[1]} as 16-bit grayscale")
t = threshold_otsu(image)
fg = image > t
print(json.dumps({"threshold": int(t), "components": int(label(fg, connectivity=2).max()), "foreground": int(fg.sum())}))
