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

// ---- error estimates and verdicts (from the core: the page decides no level) ----

const VERDICT_CLASS = { ok: 'ok', caution: 'caution', outside: 'invalid' };

/** The tooltip of an error estimate: the number, the method that produced it (or why there is
 *  none) and the tolerance it was judged at. */
export function estimateNote(e, tol) {
  if (!e) return null;
  const at = tol ? ` (verdict at tolerance ${fmt(tol, 3)})` : '';
  if (e.error_estimate === null || e.error_estimate === undefined) return `no error estimate: ${e.error_reason || 'none'}${at}`;
  return `estimated relative error ${fmt(e.error_estimate, 2)}, ${e.error_method}${at}`;
}

/** A verdict badge (ok | caution | outside) with the estimate's method on hover and focus. */
export function verdictBadge(e, tol) {
  if (!e || !e.verdict) return '';
  return el('span', { class: `badge ${VERDICT_CLASS[e.verdict] || 'invalid'}`, tabindex: '0', 'data-verdict': e.verdict, 'data-tip-label': 'Estimate: ', 'data-source': estimateNote(e, tol), text: e.verdict });
}

/** The two cells of an error estimate: the estimate (relative) and the verdict badge. */
export function estimateCells(e, tol) {
  if (!e) return ['', ''];
  const est = e.error_estimate;
  return [
    { node: el('span', { 'data-tip-label': 'Estimate: ', 'data-source': estimateNote(e, tol), 'data-estimate': est ?? '', tabindex: '0' }, est === null || est === undefined ? '—' : fmt(est, 2)), cls: 'num est' },
    { node: verdictBadge(e, tol), cls: 'verdict' },
  ];
}

export const ESTIMATE_COLUMNS = [col.text('Est. error', { cls: 'num', title: 'estimated relative error (hover for the method)' }), col.text('Verdict', { title: 'ok: estimate below the tolerance; caution: below 10×; outside: beyond, or no estimate' })];

/** Quantity | Value | Unit | Est. error | Verdict (the core's error estimate and verdict). */
export const QUANTITY_COLUMNS = [col.label('Quantity'), col.value(), col.unit(), ...ESTIMATE_COLUMNS];

/** A row of a QUANTITY_COLUMNS table; `e` is the core's error estimate of the value (or none),
 *  `tol` the tolerance it was judged at. */
export function qrow(key, label, value, unit, source, e, tol) {
  return { attrs: { 'data-key': key, 'data-verdict': e ? e.verdict : null }, cells: [label, num(value, source, { key }), unit || '', ...estimateCells(e, tol)] };
}

/** Quantity | Value | Unit, rows from [label, value, unit, source, key, digits] (or {section});
 *  with `o.estimates` (the core's estimates map) and `o.tol`, rows whose key has an estimate
 *  (`[label, value, unit, source, key, digits, estimateKey]`, the 7th item naming it) gain the
 *  Est. error and Verdict columns. */
export function valueTable(role, title, list, o = {}) {
  const withEst = !!o.estimates;
  return {
    role, title, cls: o.cls ?? 'enc',
    columns: [col.label('Quantity'), col.value(), col.unit(), ...(withEst ? ESTIMATE_COLUMNS : [])],
    rows: list.map((x) => {
      if (!Array.isArray(x)) return x;
      const e = withEst && x[6] ? o.estimates[x[6]] : null;
      return { attrs: e ? { 'data-verdict': e.verdict } : undefined, cells: [x[0], num(x[1], x[3], { key: x[4], digits: x[5] }), x[2] || '', ...(withEst ? estimateCells(e, o.tol) : [])] };
    }),
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

/** The header of the CSV export of tables (tableCsvRows). */
export const CSV_HEAD = ['quantity', 'value', 'unit', 'error_estimate', 'verdict', 'source'];

/** CSV rows [quantity, value, unit, error_estimate, verdict, source] of a table model: one row
 *  per number in a value column (named "row label, column label" where a row has several); the
 *  estimate and verdict of a row are the core's (the Est. error and Verdict cells). */
export function tableCsvRows(t) {
  if (t.csv === false) return [];
  const values = t.columns.map((c, i) => [c, i]).filter(([c]) => c.kind === 'value');
  const unitAt = t.columns.findIndex((c) => c.kind === 'unit');
  const text = (c) => (c === null || c === undefined ? '' : c instanceof Node ? c.textContent : c.text !== undefined ? c.text : String(c));
  const out = [];
  for (const row of t.rows) {
    if (row.section !== undefined) continue;
    const label = text(row.cells[0]);
    const estCell = row.cells.find((c) => c && c.cls === 'num est');
    const est = estCell ? estCell.node.getAttribute('data-estimate') : '';
    const verdict = (row.attrs && row.attrs['data-verdict']) || '';
    for (const [c, i] of values) {
      const cell = row.cells[i];
      if (!cell || !cell.num) continue;
      out.push([values.length > 1 ? `${label}, ${c.label}` : label, exact(cell.value), unitAt >= 0 ? text(row.cells[unitAt]) : (c.unit || ''), est, verdict, cell.source || '']);
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

/** CSV rows of the flags (quantity, level, value, '', '', message). */
export function flagsCsvRows(flags) {
  return (flags || []).map((f) => [`flag ${f.key}`, f.level, f.value ?? '', '', '', f.message]);
}

/** The headline of a result's recommended value (`best` from the core): "recommended: <name> =
 *  <value> <unit> ± <estimate> <verdict>", the why below. `name` is the view's label of the key,
 *  `shown` the formatted value (the view converts units for display), `tol` the tolerance;
 *  the number carries `value` (default best.value: the core's number) in data-value and
 *  `valueRole` (default `<role>-value`) in data-role. */
export function bestHeadline(best, { name, shown, unit = '', tol, source, role = 'best', valueRole, value }) {
  if (!best) return null;
  const est = best.error_estimate;
  const e = { error_estimate: est, error_method: best.error_method, error_reason: best.value === null ? best.why : null, verdict: best.verdict };
  if (best.value === null || best.value === undefined) {
    return el('span', { 'data-role': role, 'data-key': best.key, 'data-verdict': best.verdict },
      el('span', { class: 'rec', text: 'recommended: ' }), el('b', { text: 'none' }), ' ', verdictBadge(e, tol), el('span', { class: 'why muted', text: ` — ${best.why}` }));
  }
  return el('span', { class: 'best', 'data-role': role, 'data-key': best.key, 'data-verdict': best.verdict },
    el('span', { class: 'rec', text: 'recommended: ' }), `${name} = `,
    el('span', { class: 'big', 'data-role': valueRole || `${role}-value`, 'data-value': exact(value ?? best.value), tabindex: source ? '0' : null, 'data-source': source || null }, shown),
    unit ? ` ${unit}` : '',
    el('span', { class: 'pm', tabindex: '0', 'data-tip-label': 'Estimate: ', 'data-source': estimateNote(e, tol) }, est === null || est === undefined ? ' (no estimate)' : ` ± ${fmt(est, 2)} (relative)`),
    ' ', verdictBadge(e, tol),
    el('div', { class: 'why muted', text: best.why }));
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
