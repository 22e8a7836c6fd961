// A plot card: shows a figure rendered by the wasm module (SVG string + plot frame), a
// crosshair with a readout of every series near the cursor, and SVG/PNG download buttons (PNG at
// 2× or 4× the figure size, rasterised from the same SVG).
import { el, fmt, download, svgToPng } from './util.js';

/** Pixel → data with the frame from the plot crate (log axes are linear in log10). */
export function toData(frame, px, py) {
  const ax = (v, log) => (log ? Math.log10(v) : v);
  const un = (v, log) => (log ? 10 ** v : v);
  const x0 = ax(frame.x_min, frame.x_log), x1 = ax(frame.x_max, frame.x_log);
  const y0 = ax(frame.y_min, frame.y_log), y1 = ax(frame.y_max, frame.y_log);
  const x = x0 + ((px - frame.left) / frame.width) * (x1 - x0);
  const y = y1 - ((py - frame.top) / frame.height) * (y1 - y0);
  return [un(x, frame.x_log), un(y, frame.y_log)];
}

export function toPixel(frame, x, y) {
  const ax = (v, log) => (log ? Math.log10(v) : v);
  const x0 = ax(frame.x_min, frame.x_log), x1 = ax(frame.x_max, frame.x_log);
  const y0 = ax(frame.y_min, frame.y_log), y1 = ax(frame.y_max, frame.y_log);
  return [
    frame.left + ((ax(x, frame.x_log) - x0) / (x1 - x0)) * frame.width,
    frame.top + ((y1 - ax(y, frame.y_log)) / (y1 - y0)) * frame.height,
  ];
}

function monotonic(xs) {
  let prev = -Infinity;
  for (const x of xs) {
    if (x === null) continue;
    if (!(x >= prev)) return false;
    prev = x;
  }
  return true;
}

/** The value of a series at x (linear interpolation between neighbours), or the nearest point. */
function seriesAt(s, frame, px, py, x) {
  const n = s.x.length;
  if (s._mono === undefined) s._mono = monotonic(s.x);
  if (s._mono) {
    // Binary search for the first sample with x ≥ target.
    let lo = 0, hi = n - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((s.x[mid] ?? -Infinity) < x) lo = mid + 1; else hi = mid;
    }
    const i = lo;
    const a = i > 0 ? i - 1 : i;
    const xa = s.x[a], xb = s.x[i], ya = s.y[a], yb = s.y[i];
    if (xa === null || xb === null || ya === null || yb === null) return null;
    if (x < Math.min(xa, xb) || x > Math.max(xa, xb)) return null;
    if (xb === xa) return { x: xa, y: ya };
    const lg = frame.x_log, t = lg ? Math.log(x / xa) / Math.log(xb / xa) : (x - xa) / (xb - xa);
    const y = frame.y_log && ya > 0 && yb > 0 ? Math.exp(Math.log(ya) + t * Math.log(yb / ya)) : ya + t * (yb - ya);
    return { x, y };
  }
  let best = null, bd = Infinity;
  for (let i = 0; i < n; i++) {
    if (s.x[i] === null || s.y[i] === null) continue;
    const [qx, qy] = toPixel(frame, s.x[i], s.y[i]);
    const d = (qx - px) ** 2 + (qy - py) ** 2;
    if (d < bd) { bd = d; best = { x: s.x[i], y: s.y[i] }; }
  }
  return bd < 30 * 30 ? best : null;
}

/** Index k of the cell edges[k]..edges[k+1] holding v (edges ascending or descending), or -1. */
function cellOf(edges, v) {
  for (let k = 0; k + 1 < edges.length; k++) {
    const lo = Math.min(edges[k], edges[k + 1]), hi = Math.max(edges[k], edges[k + 1]);
    if (v >= lo && v <= hi) return k;
  }
  return -1;
}

/** Readout of a heat-map cell under the pointer: its value, or a note while it is not computed. */
function heatAt(heat, x, y) {
  const j = cellOf(heat.x_edges, x), i = cellOf(heat.y_edges, y);
  const v = i >= 0 && j >= 0 ? heat.values[i][j] : null;
  const name = heat.label.split(' [')[0];
  const text = typeof v === 'number' && Number.isFinite(v) ? `${name} = ${fmt(v, 5)}${heat.label.includes('[') ? ` [${heat.label.split('[')[1].split(']')[0]}]` : ''}` : `${name}: not computed yet`;
  return el('span', { class: 'item', 'data-role': 'heat-readout' }, text);
}

/** Parses the SVG text of a rendered figure (from the core's own renderer) into an element of
 *  this document. No innerHTML: DOMParser's document runs no script, and text that is not one
 *  SVG element is an error, not markup. (The HTML parser is as fast as innerHTML here; the XML
 *  parser with importNode took about twice as long on a 100 kB figure.) */
function svgElement(text) {
  const doc = new DOMParser().parseFromString(text, 'text/html');
  const svg = doc.body.firstElementChild;
  if (!svg || svg.localName !== 'svg' || doc.body.childElementCount !== 1) throw new Error('the figure is not one SVG element');
  return document.adoptNode(svg);
}

/** Creates a plot card; returns {root, show(rendered), fail(message), fresh(), draw(outcome),
 *  setTitle(text)}. */
export function plotCard(title, fileStem) {
  const box = el('div', { class: 'plot-box', tabindex: '0', role: 'img', 'aria-label': title });
  const crossX = el('div', { class: 'cross-x' });
  const crossY = el('div', { class: 'cross-y' });
  const readout = el('div', { class: 'readout', 'aria-live': 'polite' });
  const err = el('p', { class: 'plot-error', role: 'alert' });
  const svgBtn = el('button', { type: 'button', text: 'SVG', title: `Download “${title}” as SVG` });
  const pngBtn = el('button', { type: 'button', text: 'PNG', title: `Download “${title}” as PNG at the scale chosen beside it` });
  // PNG resolution: the figure's SVG rasterised at 2× or 4× its size (same picture and fonts).
  const pngScale = el('select', { class: 'png-scale', 'aria-label': `PNG scale for “${title}”`, title: 'PNG resolution (× the figure size)' },
    el('option', { value: '2', text: '2×' }), el('option', { value: '4', text: '4×' }));
  const heading = el('h3', { text: title });
  const root = el('section', { class: 'card plot-card', 'data-plot': fileStem },
    el('div', { class: 'plot-head' }, heading, el('div', { class: 'plot-tools' }, svgBtn, pngBtn, pngScale)),
    box, readout, err);
  let current = null;
  let cursor = null; // [px, py] in SVG pixels, for keyboard moves

  function hint() {
    readout.replaceChildren('Move the pointer over the plot (or focus it and use the arrow keys) for values.');
  }
  hint();

  function point(px, py) {
    if (!current) return;
    const f = current.frame;
    const svg = box.querySelector('svg');
    if (!svg) return;
    const scale = svg.getBoundingClientRect().width / f.svg_width;
    if (px < f.left || px > f.left + f.width || py < f.top || py > f.top + f.height) {
      box.classList.remove('hover');
      hint();
      return;
    }
    cursor = [px, py];
    box.classList.add('hover');
    crossX.style.left = `${px * scale}px`;
    crossX.style.top = `${f.top * scale}px`;
    crossX.style.height = `${f.height * scale}px`;
    crossY.style.top = `${py * scale}px`;
    crossY.style.left = `${f.left * scale}px`;
    crossY.style.width = `${f.width * scale}px`;
    const [x, y] = toData(f, px, py);
    const items = [el('span', { class: 'item' }, `${current.x_label.split(' [')[0]} = ${fmt(x, 4)}, ${current.y_label.split(' [')[0]} = ${fmt(y, 4)}`)];
    if (current.heat) items.push(heatAt(current.heat, x, y));
    for (const s of current.series) {
      const v = seriesAt(s, f, px, py, x);
      if (!v) continue;
      items.push(el('span', { class: 'item' }, el('span', { class: 'sw', style: `background:${s.color}` }), `${s.label}: ${fmt(v.y, 6)}`));
    }
    readout.replaceChildren(...items);
  }

  box.addEventListener('mousemove', (e) => {
    const svg = box.querySelector('svg');
    if (!svg || !current) return;
    const r = svg.getBoundingClientRect();
    const scale = r.width / current.frame.svg_width;
    point((e.clientX - r.left) / scale, (e.clientY - r.top) / scale);
  });
  box.addEventListener('mouseleave', () => { box.classList.remove('hover'); hint(); });
  box.addEventListener('keydown', (e) => {
    if (!current) return;
    const f = current.frame;
    const step = (e.shiftKey ? 0.1 : 0.02);
    if (!cursor) cursor = [f.left + f.width / 2, f.top + f.height / 2];
    let [px, py] = cursor;
    if (e.key === 'ArrowRight') px += step * f.width;
    else if (e.key === 'ArrowLeft') px -= step * f.width;
    else if (e.key === 'ArrowUp') py -= step * f.height;
    else if (e.key === 'ArrowDown') py += step * f.height;
    else if (e.key === 'Escape') { box.classList.remove('hover'); hint(); return; }
    else return;
    e.preventDefault();
    px = Math.min(f.left + f.width, Math.max(f.left, px));
    py = Math.min(f.top + f.height, Math.max(f.top, py));
    point(px, py);
  });
  box.addEventListener('blur', () => { box.classList.remove('hover'); });

  svgBtn.addEventListener('click', () => {
    if (current) download(`chiwave-${fileStem}.svg`, current.svg, 'image/svg+xml');
  });
  pngBtn.addEventListener('click', async () => {
    if (!current) return;
    try {
      const scale = Number(pngScale.value) === 4 ? 4 : 2;
      const png = await svgToPng(current.svg, current.frame.svg_width, current.frame.svg_height, scale);
      download(`chiwave-${fileStem}@${scale}x.png`, png);
    } catch (e) {
      err.textContent = String(e.message || e);
    }
  });

  return {
    root,
    show(rendered) {
      let svg;
      try {
        svg = svgElement(rendered.svg);
      } catch (e) {
        this.fail(e.message);
        return;
      }
      current = rendered;
      err.textContent = '';
      box.replaceChildren(svg, crossX, crossY);
      box.setAttribute('aria-label', `${title}: ${rendered.x_label} against ${rendered.y_label}`);
      if (cursor && box.classList.contains('hover')) point(...cursor);
    },
    fail(message) {
      err.textContent = message;
      box.classList.add('stale');
    },
    fresh() { box.classList.remove('stale'); },
    /** Shows `{value: rendered}` or the message of `{error}`; a function is called for it first. */
    draw(outcome) {
      let o = outcome;
      if (typeof o === 'function') {
        try { o = { value: o() }; } catch (e) { o = { error: e && e.message ? e.message : String(e) }; }
      }
      if (o.error !== undefined) this.fail(o.error);
      else { this.show(o.value); this.fresh(); }
    },
    setTitle(text) {
      if (heading.textContent === text) return;
      title = text;
      heading.textContent = text;
    },
    get rendered() { return current; },
  };
}
