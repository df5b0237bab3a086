"""Independent TIFF writer for RunWatch imaging tests (Pillow, Debian's python3-pil).

Usage: imaging_write_tiff.py OUT.tif MODE X_RES Y_RES UNIT
MODE is I;16 (16-bit grayscale), L (8-bit grayscale) or RGB. Writes a 64 x 48 gradient with the TIFF 6.0
tags XResolution (282), YResolution (283) and ResolutionUnit (296; 1 none, 2 inch, 3 cm). UNIT 0 writes no
resolution tags at all.
"""
import sys

import numpy as np
from PIL import Image, TiffImagePlugin

path, mode, xres, yres, unit = sys.argv[1], sys.argv[2], float(sys.argv[3]), float(sys.argv[4]), int(sys.argv[5])
h, w = 48, 64
ramp = (np.arange(w)[None, :] * 1000 + np.arange(h)[:, None] * 10).astype(np.uint16)
if mode == "I;16":
    image = Image.fromarray(ramp, mode="I;16")
elif mode == "L":
    image = Image.fromarray((ramp // 256).astype(np.uint8), mode="L")
else:
    rgb = np.stack([(ramp // 256).astype(np.uint8)] * 3, axis=-1)
    image = Image.fromarray(rgb, mode="RGB")
info = TiffImagePlugin.ImageFileDirectory_v2()
if unit != 0:
    info[282] = xres
    info[283] = yres
    info[296] = unit
image.save(path, tiffinfo=info)
