// Form controls and result cells shared by the views that lay out their own inputs
// (encounter, radiation). Text and DOM only; no physics here.
import { el, fmt, exact } from './util.js';

/** Returns a function that runs `run` once on the next animation frame, however often it is
 *  called before then (input events coalesced to one recompute per frame). */
export function perFrame(run) {
  let pending = false;
  return () => {
    if (pending) return;
    pending = true;
    requestAnimationFrame(() => { pending = false; run(); });
  };
}

/** Field, text input and select builders whose ids carry the view's id. */
export function controls(viewId) {
  function field(key, label, control, hint) {
    const err = el('p', { class: 'field-error', id: `f-${viewId}-${key}-err`, role: 'alert', 'data-error-for': key });
    return {
      root: el('div', { class: 'field', 'data-field': key },
        el('label', { class: 'name', for: `f-${viewId}-${key}` }, label, hint ? el('span', { class: 'hint' }, ` ${hint}`) : null),
        el('div', { class: 'row' }, control), err),
      err,
    };
  }
  function input(key, value, aria) {
    return el('input', { id: `f-${viewId}-${key}`, name: key, type: 'text', inputmode: 'decimal', autocomplete: 'off', spellcheck: 'false', value, 'aria-describedby': `f-${viewId}-${key}-err`, 'aria-label': aria || null });
  }
  return { field, input, select };
}

export function select(id, options, value, aria) {
  const s = el('select', { id, 'aria-label': aria || null });
  for (const [v, l] of options) s.append(el('option', { value: v, text: l }));
  s.value = value;
  return s;
}

/** A number from a text box as the request needs it (JSON number), or an error message. */
export function num(key, text) {
  const t = text.trim().replace('−', '-');
  if (t === '') return { error: `${key}: enter a number` };
  const v = Number(t);
  if (!Number.isFinite(v)) return { error: `${key}: cannot read '${text.trim()}' as a finite number` };
  return { value: v };
}

/** Splits "1.52Msun" into ["1.52", "Msun"] (text only; the core parses the quantity). */
export function splitQ(q) {
  if (q === null || q === undefined) return ['', ''];
  if (typeof q === 'number') return [String(q), ''];
  const m = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/.exec(String(q));
  return m ? [m[1], m[2].trim()] : [String(q), ''];
}

/** Selects `value`, adding it as an option first if the list lacks it. */
export function ensureOption(sel, value) {
  if (![...sel.options].some((o) => o.value === value)) sel.append(el('option', { value, text: value }));
  sel.value = value;
}

export function badge(level, text, note) {
  return el('span', { class: `badge ${level}`, tabindex: note ? '0' : null, 'data-source': note || null, text });
}

/** A numeric table cell that keeps the full double in data-value and its source for hover. */
export function numCell(value, source, opts = {}) {
  const shown = value === null || value === undefined ? '—' : typeof value === 'number' ? fmt(value, opts.digits || 8) : String(value);
  return el('td', { class: 'num', tabindex: source ? '0' : null, 'data-source': source || null, 'data-value': exact(value), 'data-role': opts.role || null }, shown);
}

export function table(head, rows, cls = '') {
  return el('table', { class: `results enc ${cls}` },
    el('thead', {}, el('tr', {}, head.map((h, i) => el('th', { text: h, style: i > 0 && h !== 'Unit' && h !== 'Regime' ? 'text-align:right' : null })))),
    el('tbody', {}, rows));
}

/** Shows `errors` ({field: message}) beside the matching fields; the rest above the form. */
export function showFieldErrors(fields, requestError, errors) {
  const used = new Set();
  for (const f of Object.values(fields)) {
    const key = f.root.dataset.field;
    const msg = errors[key] || (f.alt && errors[f.alt]) || '';
    if (errors[key]) used.add(key);
    if (f.alt && errors[f.alt]) used.add(f.alt);
    f.err.textContent = msg;
    const inp = f.root.querySelector('input');
    if (inp) { if (msg) inp.setAttribute('aria-invalid', 'true'); else inp.removeAttribute('aria-invalid'); }
  }
  requestError.textContent = Object.entries(errors).filter(([k]) => !used.has(k)).map(([, m]) => m).join(' ');
}

/** The flags table (regime checks) of a result. */
export function flagTable(flags, names = {}) {
  const rows = (flags || []).map((f) => el('tr', { 'data-flag': f.key, 'data-level': f.level },
    el('td', { text: names[f.key] || f.key.replace(/_/g, ' ') }), el('td', {}, badge(f.level, f.level)),
    el('td', { class: 'num', text: f.value === null || f.value === undefined ? '' : fmt(f.value, 4) }), el('td', { class: 'msg', text: f.message })));
  return el('table', { class: 'results flags', 'data-role': 'flags' },
    el('thead', {}, el('tr', {}, el('th', { text: 'Regime check' }), el('th', { text: 'Level' }), el('th', { text: 'Value', style: 'text-align:right' }), el('th', { text: 'What it means' }))),
    el('tbody', {}, rows));
}

/** Caution banners for every flag that is not ok. */
export function cautionItems(flags) {
  return (flags || []).filter((f) => f.level !== 'ok').map((f) => el('li', { class: f.level, role: f.level === 'invalid' ? 'alert' : null },
    el('strong', { text: f.level === 'invalid' ? 'Outside validity: ' : 'Caution: ' }), f.message));
}
