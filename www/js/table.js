// Results tables: one model and one renderer for every table of every view, the flags (regime
// checks) table and caution banners, and the CSV rows of a table. Text and DOM only.
//
// A table is {role, title?, cls?, columns, rows, sources?: false, csv?: false}:
//   columns  [{label, kind: 'label' | 'value' | 'unit' | 'rel' | 'text', title?, unit?}]
//   rows     [{section: text} | {cells: [cell per column], attrs?: {data-…}}]
//   cell     a string, a DOM node, {text | node, cls}, or a number cell
//            num(value, source, {key, digits, blank, shown})
// Every number cell keeps the full double in data-value, its source in data-source (shown on hover
// and focus, and in the Source column), and its stable name in data-key. Number cells are the
// focusable cells of a table: keyboard navigation inside a table attaches to renderTable.
import { el, fmt, exact } from './util.js';
import { flagLabel } from './core.js';

/** A number cell. */
export function num(value, source, o = {}) {
  return { num: true, value, source: source || null, key: o.key || null, digits: o.digits, blank: !!o.blank, shown: o.shown };
}

export const col = {
  label: (label) => ({ label, kind: 'label' }),
  value: (label = 'Value', o = {}) => ({ label, kind: 'value', ...o }),
  unit: (label = 'Unit') => ({ label, kind: 'unit' }),
  rel: (label, o = {}) => ({ label, kind: 'rel', ...o }),
  text: (label, o = {}) => ({ label, kind: 'text', ...o }),
};

/** Quantity | Value | Unit | Rel. error (relative difference to an exact value in the same result). */
export const QUANTITY_COLUMNS = [col.label('Quantity'), col.value(), col.unit(), col.rel('Rel. error', { title: 'relative difference to the exact value' })];

/** A row of a QUANTITY_COLUMNS table. */
export function qrow(key, label, value, unit, source, rel) {
  return { attrs: { 'data-key': key }, cells: [label, num(value, source, { key }), unit || '', num(rel, null, { digits: 3, blank: true })] };
}

/** Quantity | Value | Unit, rows from [label, value, unit, source, key, digits] (or {section}). */
export function valueTable(role, title, list, o = {}) {
  return {
    role, title, cls: o.cls ?? 'enc',
    columns: [col.label('Quantity'), col.value(), col.unit()],
    rows: list.map((x) => (Array.isArray(x) ? { cells: [x[0], num(x[1], x[3], { key: x[4], digits: x[5] }), x[2] || ''] } : x)),
  };
}

const RIGHT = new Set(['value', 'rel']);

function numCell(c, digits, kind) {
  const v = c.value;
  const shown = c.shown !== undefined ? c.shown
    : v === null || v === undefined ? (c.blank ? '' : '—') : typeof v === 'number' ? fmt(v, c.digits || digits) : String(v);
  return el('td', {
    class: kind === 'rel' ? 'num rel' : 'num', tabindex: c.source ? '0' : null, 'data-source': c.source,
    'data-value': exact(v), 'data-key': c.key,
  }, shown);
}

function rowSources(row) {
  return [...new Set(row.cells.filter((c) => c && c.num && c.source).map((c) => c.source))].join(' · ');
}

/** Renders a table model; `digits` is the view's default for numbers. */
export function renderTable(t, { digits = 8 } = {}) {
  const withSrc = t.sources !== false;
  const span = String(t.columns.length + (withSrc ? 1 : 0));
  const head = el('tr', {}, t.columns.map((c) => el('th', { text: c.label, title: c.title || null, style: RIGHT.has(c.kind) ? 'text-align:right' : null })),
    withSrc ? el('th', { class: 'src-col', text: 'Source' }) : null);
  const body = t.rows.map((row) => {
    if (row.section !== undefined) return el('tr', { class: 'section' }, el('td', { colspan: span, text: row.section }));
    const tds = row.cells.map((c, i) => {
      const column = t.columns[i] || {};
      if (c && c.num) return numCell(c, digits, column.kind);
      if (c instanceof Node) return el('td', { class: column.cls || null }, c);
      if (c && (c.text !== undefined || c.node)) return el('td', { class: c.cls || null }, c.node ?? c.text);
      return el('td', { class: column.cls || null, text: c === null || c === undefined ? '' : String(c) });
    });
    if (withSrc) tds.push(el('td', { class: 'src src-col', text: rowSources(row) || '—' }));
    return el('tr', row.attrs || {}, tds);
  });
  return el('table', { class: `results ${t.cls || ''}`.trim(), 'data-role': t.role || null }, el('thead', {}, head), el('tbody', {}, body));
}

/** CSV rows [quantity, value, unit, relative_error, source] of a table model: one row per number
 *  in a value column (named "row label, column label" where a row has several). */
export function tableCsvRows(t) {
  if (t.csv === false) return [];
  const values = t.columns.map((c, i) => [c, i]).filter(([c]) => c.kind === 'value');
  const unitAt = t.columns.findIndex((c) => c.kind === 'unit');
  const relAt = t.columns.findIndex((c) => c.kind === 'rel');
  const text = (c) => (c === null || c === undefined ? '' : c instanceof Node ? c.textContent : c.text !== undefined ? c.text : String(c));
  const out = [];
  for (const row of t.rows) {
    if (row.section !== undefined) continue;
    const label = text(row.cells[0]);
    const rel = relAt >= 0 && row.cells[relAt] && row.cells[relAt].num ? exact(row.cells[relAt].value) : '';
    for (const [c, i] of values) {
      const cell = row.cells[i];
      if (!cell || !cell.num) continue;
      out.push([values.length > 1 ? `${label}, ${c.label}` : label, exact(cell.value), unitAt >= 0 ? text(row.cells[unitAt]) : (c.unit || ''), rel, cell.source || '']);
    }
  }
  return out;
}

export function badge(level, text, note) {
  return el('span', { class: `badge ${level}`, tabindex: note ? '0' : null, 'data-source': note || null, text });
}

/** The regime-check table of a result's flags. */
export function flagsTable(flags) {
  return {
    role: 'flags', cls: 'flags', sources: false, csv: false,
    columns: [col.label('Regime check'), col.text('Level'), col.value('Value'), col.text('What it means')],
    rows: (flags || []).map((f) => ({
      attrs: { 'data-flag': f.key, 'data-level': f.level },
      cells: [flagLabel(f), badge(f.level, f.level), { cls: 'num', text: f.value === null || f.value === undefined ? '' : fmt(f.value, 4) }, { cls: 'msg', text: f.message }],
    })),
  };
}

/** CSV rows of the flags. */
export function flagsCsvRows(flags) {
  return (flags || []).map((f) => [`flag ${f.key}`, f.level, f.value ?? '', '', f.message]);
}

/** Caution banners for every flag that is not ok. */
export function cautionItems(flags) {
  return (flags || []).filter((f) => f.level !== 'ok').map((f) => el('li', { class: f.level, role: f.level === 'invalid' ? 'alert' : null },
    el('strong', { text: f.level === 'invalid' ? 'Outside validity: ' : 'Caution: ' }), f.message));
}

/** The worst level of a list of flags. */
export function levelOf(flags) {
  const order = { ok: 0, caution: 1, invalid: 2 };
  let worst = 'ok';
  for (const f of flags || []) if ((order[f.level] ?? 0) > order[worst]) worst = f.level;
  return worst;
}
