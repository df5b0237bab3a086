"""Independent JPEG writer for RunWatch decoding tests (OpenCV's libjpeg, Debian's python3-opencv).

Usage: imaging_write_jpeg.py OUT.jpg KIND
KIND: gray (baseline 8-bit grayscale), colour (baseline YCbCr, libjpeg's default 4:2:0 sampling), restart
(grayscale with a restart marker every 2 MCU rows, IMWRITE_JPEG_RST_INTERVAL), progressive (IMWRITE_JPEG_PROGRESSIVE).
The picture is invented: bright discs on a noisy, uneven background, 640 x 480, seed 11.
"""
import sys

import cv2
import numpy as np

path, kind = sys.argv[1], sys.argv[2]
rng = np.random.default_rng(11)
h, w = 480, 640
yy, xx = np.mgrid[0:h, 0:w]
image = 40 + 0.05 * xx + rng.normal(0, 12, (h, w))
for _ in range(60):
    cx, cy, r = rng.uniform(20, w - 20), rng.uniform(20, h - 20), rng.uniform(5, 14)
    image[(xx - cx) ** 2 + (yy - cy) ** 2 < r * r] = 220
gray = np.clip(image, 0, 255).astype(np.uint8)
params = [cv2.IMWRITE_JPEG_QUALITY, 90]
if kind == "colour":
    out = cv2.merge([gray, np.roll(gray, 7, axis=1), 255 - gray])
elif kind == "restart":
    out, params = gray, params + [cv2.IMWRITE_JPEG_RST_INTERVAL, 2 * (w // 8)]
elif kind == "progressive":
    out, params = gray, params + [cv2.IMWRITE_JPEG_PROGRESSIVE, 1]
else:
    out = gray
if not cv2.imwrite(path, out, params):
    sys.exit("cv2.imwrite failed")
