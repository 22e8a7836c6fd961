// The machinery every view shares: form → request → wasm evaluate → table + flags + figures,
// recomputed on every input event (coalesced to one per animation frame). A view module only
// declares its fields, how to lay out its result rows, and which figures to draw.
import { el, fmt, exact, download, csv } from './util.js';
import { buildForm } from './form.js';
import { plotCard } from './plot.js';
import { perFrame } from './controls.js';

export const ANGLE_UNITS = [
  ['rad', 'rad'], ['deg', 'deg'], ['arcsec', 'arcsec'], ['mas', 'mas'], ['uas', 'µas'],
];
const RAD_PER = { rad: 1, deg: Math.PI / 180, arcsec: Math.PI / 648000, mas: Math.PI / 648000e3, uas: Math.PI / 648000e6 };
const ANGLE_LABEL = { rad: 'rad', deg: 'deg', arcsec: 'arcsec', mas: 'mas', uas: 'µas' };

/** Display conversion of an angle in radians (a unit change, not physics). */
export function angle(rad, unit) {
  return rad === null || rad === undefined ? null : rad / RAD_PER[unit];
}
export function angleLabel(unit) { return ANGLE_LABEL[unit]; }

function levelOf(flags) {
  const order = { ok: 0, caution: 1, invalid: 2 };
  let worst = 'ok';
  for (const f of flags || []) if ((order[f.level] ?? 0) > order[worst]) worst = f.level;
  return worst;
}

/** Looks up a source text in the result's `sources` map by any of the given keys. */
export function sourceOf(result, ...keys) {
  const s = result && result.sources;
  if (!s) return null;
  for (const k of keys) if (k && s[k]) return typeof s[k] === 'string' ? s[k] : JSON.stringify(s[k]);
  return null;
}

/**
 * spec: {
 *   id, title, kind, fields: [...form fields], angleOutput: bool,
 *   rows(result, ctx) -> [{section} | {label, value, unit, source, key}],
 *   status(result, ctx) -> Node | null     (headline under the title),
 *   figures: [{name, title, stem}],
 *   defaults: request object for first load,
 * }
 */
export function makeView(spec, api) {
  let lastGood = null; // {request, result, rows}
  let angleUnit = spec.angleDefault || 'arcsec';

  const schedule = perFrame(() => recompute());
  const form = buildForm(spec.fields.map((f) => ({ ...f, view: spec.id })), schedule);
  const outUnit = el('select', { id: `${spec.id}-angle-unit`, 'aria-label': 'Output angle unit' });
  for (const [v, l] of ANGLE_UNITS) outUnit.append(el('option', { value: v, text: l }));
  outUnit.value = angleUnit;
  outUnit.addEventListener('change', () => { angleUnit = outUnit.value; schedule(); });

  const showSrc = el('input', { type: 'checkbox', id: `${spec.id}-show-src` });
  const status = el('div', { class: 'status-line', 'data-role': 'status', 'aria-live': 'polite' });
  const staleNote = el('p', { class: 'stale-note', role: 'status' });
  const cautions = el('ul', { class: 'cautions', 'data-role': 'cautions' });
  const tbody = el('tbody');
  const table = el('table', { class: 'results', 'data-role': 'results' },
    el('thead', {}, el('tr', {}, el('th', { text: 'Quantity' }), el('th', { text: 'Value', style: 'text-align:right' }),
      el('th', { text: 'Unit' }), el('th', { text: 'Rel. error', style: 'text-align:right', title: 'relative difference to the exact value' }),
      el('th', { class: 'src-col', text: 'Source' }))), tbody);
  const flagBody = el('tbody');
  const flagTable = el('table', { class: 'results flags', 'data-role': 'flags' },
    el('thead', {}, el('tr', {}, el('th', { text: 'Regime check' }), el('th', { text: 'Level' }), el('th', { text: 'Value', style: 'text-align:right' }), el('th', { text: 'What it means' }))), flagBody);

  const csvBtn = el('button', { type: 'button', text: 'CSV' , title: 'Download the results table as CSV' });
  const jsonBtn = el('button', { type: 'button', text: 'JSON', title: 'Download the request and full result as JSON' });
  const resultsCard = el('section', { class: 'card', 'aria-labelledby': `${spec.id}-res-h` },
    el('div', { class: 'result-head' },
      el('h2', { id: `${spec.id}-res-h`, text: 'Results' }),
      el('div', { class: 'result-tools' },
        spec.angleOutput ? el('label', { for: outUnit.id, text: 'angles in' }) : null, spec.angleOutput ? outUnit : null,
        el('label', { for: showSrc.id }, showSrc, ' sources'), csvBtn, jsonBtn)),
    staleNote, status, cautions, table,
    el('h2', { text: 'Validity', style: 'margin-top:16px' }), flagTable);
  showSrc.addEventListener('change', () => resultsCard.classList.toggle('show-sources', showSrc.checked));

  const plots = spec.figures.map((f) => ({ ...f, card: plotCard(f.title, `${spec.id}-${f.stem}`) }));
  const inputsCard = el('section', { class: 'card', 'aria-labelledby': `${spec.id}-in-h` },
    el('h2', { id: `${spec.id}-in-h` }, 'Inputs ', el('span', { class: 'sub', text: spec.inputsNote || '' })), form.root);
  const outputs = el('div', { class: 'outputs' }, resultsCard, el('div', { class: 'plots' }, plots.map((p) => p.card.root)));
  const root = el('section', { class: 'view', id: `view-${spec.id}`, role: 'tabpanel', 'aria-label': spec.title }, inputsCard, outputs);


  function currentRequest() {
    const r = form.read();
    if (r.errors) return r;
    return { request: { kind: spec.kind, ...r.fields } };
  }

  function markStale(message) {
    if (lastGood) {
      staleNote.textContent = message || 'Showing the last valid result; fix the marked input.';
      table.classList.add('stale'); status.classList.add('stale');
      for (const p of plots) p.card.root.classList.add('stale');
    }
  }

  function recompute() {
    const t0 = performance.now();
    const r = currentRequest();
    if (r.errors) { form.showErrors(r.errors); markStale(); return; }
    let result;
    try {
      result = api.evaluate(r.request);
    } catch (e) {
      const field = e && e.field ? e.field : 'request';
      form.showErrors({ [field]: e && e.message ? e.message : String(e) });
      markStale();
      return;
    }
    form.showErrors({});
    staleNote.textContent = '';
    table.classList.remove('stale'); status.classList.remove('stale');
    const ctx = { angleUnit, request: r.request };
    lastGood = { request: r.request, result, rows: spec.rows(result, ctx) };
    renderTable(lastGood.rows);
    renderFlags(result.flags || []);
    status.replaceChildren(...[spec.status ? spec.status(result, ctx) : null].filter(Boolean));
    for (const p of plots) {
      p.card.root.classList.remove('stale');
      try {
        const rendered = api.figure(r.request, p.name, { angle_unit: angleUnit });
        p.card.show(rendered);
        p.card.fresh();
      } catch (e) {
        p.card.fail(e && e.message ? e.message : String(e));
      }
    }
    root.dataset.lastMs = (performance.now() - t0).toFixed(2);
  }

  function renderTable(rows) {
    const trs = [];
    for (const row of rows) {
      if (row.section) { trs.push(el('tr', { class: 'section' }, el('td', { colspan: '5', text: row.section }))); continue; }
      const src = row.source || null;
      trs.push(el('tr', { 'data-key': row.key || '' },
        el('td', { text: row.label }),
        el('td', { class: 'num', tabindex: src ? '0' : null, 'data-source': src, 'data-value': exact(row.value), 'data-key': row.key || null },
          typeof row.value === 'number' || row.value === null ? fmt(row.value, row.digits || 9) : String(row.value)),
        el('td', { text: row.unit || '' }),
        el('td', { class: 'num rel', 'data-value': exact(row.rel) }, row.rel === undefined || row.rel === null ? '' : fmt(row.rel, 3)),
        el('td', { class: 'src src-col', text: src || '—' })));
    }
    tbody.replaceChildren(...trs);
  }

  function renderFlags(flags) {
    const items = [];
    const trs = [];
    for (const f of flags) {
      trs.push(el('tr', { 'data-flag': f.key, 'data-level': f.level },
        el('td', { text: f.key.replace(/_/g, ' ') }),
        el('td', {}, el('span', { class: `badge ${f.level}`, text: f.level })),
        el('td', { class: 'num', text: f.value === null || f.value === undefined ? '' : fmt(f.value, 4) }),
        el('td', { class: 'msg', text: f.message })));
      if (f.level !== 'ok') items.push(el('li', { class: f.level, role: f.level === 'invalid' ? 'alert' : null }, el('strong', { text: f.level === 'invalid' ? 'Outside validity: ' : 'Caution: ' }), f.message));
    }
    flagBody.replaceChildren(...trs);
    cautions.replaceChildren(...items);
    root.dataset.level = levelOf(flags);
  }

  csvBtn.addEventListener('click', () => {
    if (!lastGood) return;
    const rows = [['quantity', 'value', 'unit', 'relative_error', 'source']];
    for (const r of lastGood.rows) if (!r.section) rows.push([r.label, exact(r.value), r.unit || '', exact(r.rel), r.source || '']);
    for (const f of lastGood.result.flags || []) rows.push([`flag ${f.key}`, f.level, f.value ?? '', '', f.message]);
    download(`chiwave-${spec.id}.csv`, csv(rows), 'text/csv');
  });
  jsonBtn.addEventListener('click', () => {
    if (!lastGood) return;
    download(`chiwave-${spec.id}.json`, JSON.stringify({ request: lastGood.request, result: lastGood.result }, null, 2), 'application/json');
  });

  form.load(spec.defaults);
  return {
    id: spec.id, title: spec.title, kind: spec.kind, root,
    load(request) { form.load(request); recompute(); },
    recompute,
    request() { const r = currentRequest(); return r.request || null; },
    get last() { return lastGood; },
  };
}
