"""Prints the OpenCV version (for the RunWatch imaging benchmark report)."""
import cv2

print(cv2.__version__)
