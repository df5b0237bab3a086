"""Reference for RunWatch imaging tests: hexagons and discs drawn and blurred by scikit-image, with their areas.

Usage: imaging_blurred_shapes.py OUT.png SIGMA SEED
Draws shapes on an 8x supersampled grid with skimage.draw.polygon / skimage.draw.disk, measures each shape's area
with skimage.measure.regionprops on the labelled mask (divided by 64), averages 8x8 blocks (skimage.transform.downscale_local_mean) to
the image grid, blurs with skimage.filters.gaussian(sigma=SIGMA px), scales to 16 bit (substrate 8000, tops 30000)
and writes OUT.png with OpenCV. Prints JSON {"shapes": [{"x": cx, "y": cy, "area": a}, ...]} in image pixels
(pixel (x, y) covers [x, x+1) x [y, y+1)).
"""
import json
import sys

import cv2
import numpy as np
from skimage.draw import disk, polygon
from skimage.filters import gaussian
from skimage.measure import label, regionprops
from skimage.transform import downscale_local_mean

out, sigma, seed = sys.argv[1], float(sys.argv[2]), int(sys.argv[3])
rng = np.random.default_rng(seed)
S = 8
W, H = 640, 480
mask = np.zeros((H * S, W * S), dtype=np.uint8)
shapes = []
step = 64
for gy in range(step // 2, H - step // 2 + 1, step):
    for gx in range(step // 2, W - step // 2 + 1, step):
        cx, cy = gx + rng.uniform(-4, 4), gy + rng.uniform(-4, 4)
        r = rng.uniform(4, 20)
        if rng.uniform() < 0.7:
            a = r * np.sqrt(2 * np.pi / (3 * np.sqrt(3)))  # hexagon of the same area as a disc of radius r
            t0 = rng.uniform(0, np.pi / 3)
            ang = t0 + np.arange(6) * np.pi / 3
            rows, cols = polygon((cy + a * np.sin(ang)) * S, (cx + a * np.cos(ang)) * S, mask.shape)
        else:
            rows, cols = disk((cy * S, cx * S), r * S, shape=mask.shape)
        mask[rows, cols] = 1
        shapes.append({"x": cx, "y": cy})
# One labelling of the whole mask; the shapes are apart, so each region is one shape (matched by its centroid).
for props in regionprops(label(mask)):
    py, px = props.centroid
    best = min(shapes, key=lambda s: (s["x"] - (px + 0.5) / S) ** 2 + (s["y"] - (py + 0.5) / S) ** 2)
    best["area"] = props.area / (S * S)
image = downscale_local_mean(mask.astype(np.float64), (S, S))
image = gaussian(image, sigma=sigma, mode="nearest", preserve_range=True)
image = 8000 + 22000 * image
cv2.imwrite(out, np.round(image).astype(np.uint16))
print(json.dumps({"shapes": shapes}))
