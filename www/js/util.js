// Small DOM, formatting and download helpers. No physics here.

/** Creates an element: el('td', {class: 'num', text: '1.0'}, child...). */
export function el(tag, attrs, ...children) {
  const e = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs || {})) {
    if (v === undefined || v === null || v === false) continue;
    if (k === 'text') e.textContent = v;
    else if (k === 'class') e.className = v;
    else if (k.startsWith('on') && typeof v === 'function') e.addEventListener(k.slice(2), v);
    else e.setAttribute(k, v === true ? '' : String(v));
  }
  for (const c of children.flat()) {
    if (c === null || c === undefined || c === false) continue;
    e.append(c instanceof Node ? c : document.createTextNode(String(c)));
  }
  return e;
}

const SUP = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

/** Formats a number for people: 6 significant digits, ×10ⁿ for very large/small values. */
export function fmt(x, digits = 6) {
  if (x === null || x === undefined) return '—';
  if (typeof x !== 'number') return String(x);
  if (Number.isNaN(x)) return 'NaN';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '−∞';
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e-3 && a < 1e6) {
    return trimZeros(x.toPrecision(digits));
  }
  const [m, e] = x.toExponential(digits - 1).split('e');
  const exp = String(Number(e)).split('').map((c) => SUP[c] || c).join('');
  return `${trimZeros(m)}×10${exp}`.replace('-', '−');
}

function trimZeros(s) {
  if (!s.includes('.') || s.includes('e')) return s.replace('-', '−');
  return s.replace(/\.?0+$/, '').replace('-', '−');
}

/** Full-precision text for exports (round-trips the double). */
export function exact(x) {
  return x === null || x === undefined ? '' : String(x);
}

/** Starts a download of `data` (string or Blob) under `name`; blob URL, no network. */
export function download(name, data, type) {
  const blob = data instanceof Blob ? data : new Blob([data], { type });
  const url = URL.createObjectURL(blob);
  const a = el('a', { href: url, download: name });
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 2000);
}

/** Rasterises an SVG string to a PNG Blob at `scale` (canvas; no network). */
export function svgToPng(svgText, width, height, scale = 2) {
  return new Promise((resolve, reject) => {
    const img = new Image();
    const url = URL.createObjectURL(new Blob([svgText], { type: 'image/svg+xml' }));
    img.onload = () => {
      const c = document.createElement('canvas');
      c.width = Math.round(width * scale);
      c.height = Math.round(height * scale);
      const g = c.getContext('2d');
      g.fillStyle = '#fff';
      g.fillRect(0, 0, c.width, c.height);
      g.drawImage(img, 0, 0, c.width, c.height);
      URL.revokeObjectURL(url);
      c.toBlob((b) => (b ? resolve(b) : reject(new Error('PNG encoding failed'))), 'image/png');
    };
    img.onerror = () => { URL.revokeObjectURL(url); reject(new Error('SVG could not be rasterised')); };
    img.src = url;
  });
}

/** CSV text from rows of cells (RFC 4180 quoting). */
export function csv(rows) {
  const q = (v) => {
    const s = v === null || v === undefined ? '' : String(v);
    return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
  };
  return rows.map((r) => r.map(q).join(',')).join('\n') + '\n';
}

// ---- source tooltips: any element with data-source shows it on hover and on focus ----
let tip;
function showTip(target) {
  if (!tip) tip = document.getElementById('tooltip');
  const src = target.getAttribute('data-source');
  if (!tip || !src) return;
  tip.replaceChildren(el('b', { text: target.getAttribute('data-tip-label') || 'Source: ' }), src, el('div', { class: 'tip-hint', text: 'Click or press Enter: BibTeX of its references' }));
  tip.hidden = false;
  const r = target.getBoundingClientRect();
  const w = Math.min(480, window.innerWidth - 16);
  tip.style.maxWidth = `${w}px`;
  let left = Math.min(r.left, window.innerWidth - w - 8);
  left = Math.max(8, left);
  tip.style.left = `${left}px`;
  const below = r.bottom + 8;
  tip.style.top = `${below}px`;
  const th = tip.getBoundingClientRect().height;
  if (below + th > window.innerHeight - 8) tip.style.top = `${Math.max(8, r.top - th - 8)}px`;
}
function hideTip() { if (tip) tip.hidden = true; }

export function installTooltips(root) {
  const find = (e) => (e.target instanceof Element ? e.target.closest('[data-source]') : null);
  root.addEventListener('mouseover', (e) => { const t = find(e); if (t) showTip(t); });
  root.addEventListener('mouseout', (e) => { if (find(e)) hideTip(); });
  root.addEventListener('focusin', (e) => { const t = find(e); if (t) showTip(t); else hideTip(); });
  root.addEventListener('focusout', hideTip);
  document.addEventListener('keydown', (e) => { if (e.key === 'Escape') hideTip(); });
}

/** Splits "1.52Msun" into ["1.52", "Msun"] (text only; the core does the real parsing). */
export function splitQuantity(q) {
  if (q === null || q === undefined) return ['', ''];
  if (typeof q === 'number') return [String(q), ''];
  if (typeof q === 'object') return [String(q.value ?? ''), String(q.unit ?? '')];
  const m = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/.exec(String(q));
  return m ? [m[1], m[2].trim()] : [String(q), ''];
}
