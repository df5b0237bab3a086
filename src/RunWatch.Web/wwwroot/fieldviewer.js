// Pan and zoom of the full-field viewer: the SVG's viewBox is changed here, in the browser, so that a wheel turn or a
// drag costs no round trip. Clicks that end a drag are swallowed so that panning never selects a wire.
const MIN_SPAN = 16; // px of the image across at the deepest zoom

function box(svg) {
  const [x, y, w, h] = svg.getAttribute('viewBox').split(/[\s,]+/).map(Number);
  return { x, y, w, h };
}

function set(svg, b) {
  const s = svg.__rw;
  const w = Math.min(Math.max(b.w, MIN_SPAN), s.width * 4);
  const h = w * s.height / s.width;
  const x = Math.min(Math.max(b.x, -w * 0.5), s.width - w * 0.5);
  const y = Math.min(Math.max(b.y, -h * 0.5), s.height - h * 0.5);
  svg.setAttribute('viewBox', `${x} ${y} ${w} ${h}`);
  svg.dataset.zoom = (s.width / w).toFixed(3);
}

function toSvg(svg, clientX, clientY) {
  const p = svg.createSVGPoint();
  p.x = clientX; p.y = clientY;
  return p.matrixTransform(svg.getScreenCTM().inverse());
}

function zoomAbout(svg, factor, cx, cy) {
  const b = box(svg);
  const w = b.w / factor, h = b.h / factor;
  set(svg, { x: cx - (cx - b.x) * (w / b.w), y: cy - (cy - b.y) * (h / b.h), w, h });
}

export function attach(frame, svg, width, height) {
  svg.__rw = { width, height };
  set(svg, { x: 0, y: 0, w: width, h: height });
  // Opening another field re-uses the same frame: its listeners stay, and always act on the svg inside it now.
  if (frame.__rwAttached) return;
  frame.__rwAttached = true;
  const current = () => frame.querySelector('svg');
  let drag = null;
  let dragged = false;
  frame.addEventListener('wheel', e => {
    e.preventDefault();
    const s = current();
    const p = toSvg(s, e.clientX, e.clientY);
    zoomAbout(s, e.deltaY < 0 ? 1.25 : 0.8, p.x, p.y);
  }, { passive: false });
  frame.addEventListener('pointerdown', e => {
    if (e.button !== 0) return;
    const s = current();
    drag = { x: e.clientX, y: e.clientY, b: box(s), scale: 1 / s.getScreenCTM().a };
    dragged = false;
  });
  frame.addEventListener('pointermove', e => {
    if (!drag) return;
    const dx = e.clientX - drag.x, dy = e.clientY - drag.y;
    if (!dragged && Math.hypot(dx, dy) < 4) return;
    if (!dragged) { dragged = true; frame.setPointerCapture(e.pointerId); frame.classList.add('dragging'); }
    set(current(), { x: drag.b.x - dx * drag.scale, y: drag.b.y - dy * drag.scale, w: drag.b.w, h: drag.b.h });
  });
  const end = e => {
    if (drag && dragged && frame.hasPointerCapture(e.pointerId)) frame.releasePointerCapture(e.pointerId);
    drag = null;
    frame.classList.remove('dragging');
  };
  frame.addEventListener('pointerup', end);
  frame.addEventListener('pointercancel', end);
  // Capture phase on the frame: runs before Blazor's handler (which listens for the bubbling click further up).
  frame.addEventListener('click', e => { if (dragged) { e.stopPropagation(); e.preventDefault(); dragged = false; } }, true);
}

export function zoom(svg, factor) {
  const b = box(svg);
  zoomAbout(svg, factor, b.x + b.w / 2, b.y + b.h / 2);
}

export function fit(svg) {
  set(svg, { x: 0, y: 0, w: svg.__rw.width, h: svg.__rw.height });
}

// Brings a point (image px) to the middle, zoomed in to at least minZoom.
export function centerOn(svg, x, y, minZoom) {
  const s = svg.__rw;
  const b = box(svg);
  const w = Math.min(b.w, s.width / minZoom);
  const h = w * s.height / s.width;
  set(svg, { x: x - w / 2, y: y - h / 2, w, h });
}
