// The one view machinery. A view module declares a spec; makeView builds the inputs card, the
// results card (headline slot, cautions, results tables, regime checks, CSV/JSON export), the
// figures, the view's extra cards and its progressive work, and runs one update per input change
// (coalesced to one per animation frame): state → request → one evaluation (core.evaluateView)
// → headline, tables, figures, cards.
//
// Spec (every hook receives ctx = {request, values, result, tol (the tolerance the core judged
// the verdicts at), angleUnit, A(rad), au, src(key…), flags: {key: flag}, kit}):
//   id, title, kind, aliases?: [old ids]     the view id is the #view= name
//   intro?: text beside "Inputs"; inputs: field/group/note items (inputs.js)
//   constants?: request fields always sent (e.g. an input angle unit)
//   angles?: default output angle unit (the view then has an "angles in" select, state key `angles`)
//   digits?: significant digits of table numbers (default 8)
//   resultRequest?(request) → the request whose result is shown (default: request itself)
//   headline(ctx) → Node | [Node]           the headline slot (the number a reader should look at)
//   cautions?(ctx) → [li]                    banners before the flags' cautions
//   body(ctx) → [table | {grid: [[block…]…]} | {note: text, title?}]   results (table.js models)
//   figures?: [{stem, title, name, titleFor?, when?, work?}]   name may be a function of ctx,
//              titleFor(ctx) retitles; `when(ctx)` false hides the figure; `work: true` figures
//              are drawn by the progressive work, not by the evaluation
//   figureNote?(ctx) → text shown above the figures
//   cards?: [{id, place: 'results' | 'end', make(kit) → {root, render(ctx), stale?: bool}}]
//   work?: {key(ctx) → string | null, start(ctx, kit) → {step(budgetMs) → done, refresh?(ctx), stop()}}
//              work whose key is unchanged by an update keeps running (refresh redraws it);
//              a new key stops the old work and starts new work, stepped once per animation frame
//   csv?(last) → rows; json?(last, kit) → extra fields of the JSON export (csvTitle, jsonTitle: button tips)
// State: getState() → {key: string} of every control (inputs, unit selects, modes, display
// choices, card inputs); setState(map) sets them (unknown keys and values that are not options
// are returned as problems) and updates.
import { el, exact, download, csv } from './util.js';
import { buildForm, clip, group, number } from './inputs.js';
import { plotCard } from './plot.js';
import { renderTable, tableCsvRows, flagsTable, flagsCsvRows, cautionItems, levelOf, CSV_HEAD } from './table.js';
import { evaluateView, message, angle, angleLabel, angleUnits, sourceOf } from './core.js';

/** Milliseconds of progressive work per animation frame (the rest of a 60 Hz frame draws). */
export const WORK_BUDGET_MS = 9;

/** Returns schedule(task): each distinct task runs once on the next animation frame, however
 *  often it is asked for before then. */
export function frameScheduler() {
  const tasks = new Set();
  let pending = false;
  return (task) => {
    tasks.add(task);
    if (pending) return;
    pending = true;
    requestAnimationFrame(() => {
      pending = false;
      const run = [...tasks];
      tasks.clear();
      for (const t of run) t();
    });
  };
}

/** A headline number: the shown text, the full double in data-value, its source on hover. */
export function headNumber(role, value, shown, source, cls = 'big') {
  return el('span', { class: cls, 'data-role': role, 'data-value': exact(value), tabindex: source ? '0' : null, 'data-source': source || null }, shown);
}

export function makeView(spec) {
  const id = spec.id;
  const digits = spec.digits || 8;
  const schedule = frameScheduler();
  const controls = new Map(); // state key → {key, get, set, reset, node?, apply?}
  const parts = new Map(); // part name → element (figures, tables, cards), for showing one alone
  let last = null; // {request, result, tables}
  let work = null; // {key, handle}
  let workGen = 0;
  const listeners = []; // called with the state after every update

  const update = () => run();
  // Every view has the tolerance of its verdicts (request field `tolerance`, state key `tolerance`).
  const inputs = [...spec.inputs, group('Verdicts', [number('tolerance', 'Tolerance', { hint: '(relative error; ok below it, caution below 10×)', value: '0.01', optional: true })], { role: 'tolerance' })];
  const form = buildForm(id, inputs, () => schedule(update));
  for (const [k, c] of form.controls) controls.set(k, c);

  // ---- results card ----
  const tools = el('div', { class: 'result-tools' });
  if (spec.angles) {
    const sel = el('select', { id: `f-${id}-angles`, 'aria-label': 'Output angle unit' });
    for (const u of angleUnits()) sel.append(el('option', { value: u.key, text: u.label }));
    sel.value = spec.angles;
    sel.addEventListener('change', () => schedule(update));
    register(selectControl('angles', sel, spec.angles));
    tools.append(el('label', { for: sel.id, text: 'angles in' }), sel);
  }
  const showSrc = el('input', { type: 'checkbox', id: `f-${id}-sources` });
  const csvBtn = el('button', { type: 'button', text: 'CSV', title: spec.csvTitle || 'Download every number shown, with its source, as CSV' });
  const jsonBtn = el('button', { type: 'button', text: 'JSON', title: spec.jsonTitle || 'Download the request and the full result as JSON' });
  tools.append(el('label', { for: showSrc.id }, showSrc, ' sources'), csvBtn, jsonBtn);
  const staleNote = el('p', { class: 'stale-note', role: 'status' });
  const headline = el('div', { class: 'status-line', 'data-role': 'headline', 'aria-live': 'polite' });
  const cautions = el('ul', { class: 'cautions', 'data-role': 'cautions' });
  const body = el('div', { class: 'result-body' });
  const resultsCard = el('section', { class: 'card', 'aria-labelledby': `${id}-res-h`, 'data-part': 'results' },
    el('div', { class: 'result-head' }, el('h2', { id: `${id}-res-h`, text: 'Results' }), tools),
    staleNote, headline, cautions, body);
  const applySources = () => resultsCard.classList.toggle('show-sources', showSrc.checked);
  showSrc.addEventListener('change', applySources);
  register({ key: 'sources', node: showSrc, get: () => String(showSrc.checked), set: (v) => setCheck(showSrc, v), reset() { showSrc.checked = false; }, apply: applySources });

  // ---- figures ----
  const figures = (spec.figures || []).map((f) => {
    const card = plotCard(f.title, `${id}-${f.stem}`);
    parts.set(f.stem, card.root);
    return { spec: f, card };
  });
  const plotNote = el('p', { class: 'muted', 'data-role': 'plot-note', hidden: true });
  const plots = el('div', { class: 'plots' }, figures.map((f) => f.card.root));

  // ---- the kit: what hooks may use ----
  const kit = {
    id,
    schedule,
    register,
    figure: (stem) => figures.find((f) => f.spec.stem === stem).card,
    card: (cid) => cards.find((c) => c.id === cid).made,
    get values() { return getState(); },
    get last() { return last; },
    root: null,
  };

  // ---- extra cards ----
  const cards = (spec.cards || []).map((c) => {
    const made = c.make(kit);
    parts.set(c.id, made.root);
    return { ...c, made };
  });
  const placed = (where) => cards.filter((c) => (c.place || 'end') === where).map((c) => c.made.root);

  const inputsCard = el('section', { class: 'card', 'aria-labelledby': `${id}-in-h`, 'data-part': 'inputs' },
    el('h2', { id: `${id}-in-h` }, 'Inputs ', el('span', { class: 'sub', text: spec.intro || '(recomputed as you type)' })), form.root);
  const outputs = el('div', { class: 'outputs' }, resultsCard, placed('results'), plotNote, plots, placed('end'));
  const root = el('section', { class: 'view', id: `view-${id}`, role: 'tabpanel', 'aria-label': spec.title }, inputsCard, outputs);
  kit.root = root;
  parts.set('results', resultsCard);
  parts.set('inputs', inputsCard);

  // ---- state ----
  function register(c) { controls.set(c.key, c); }

  function getState() {
    const s = {};
    for (const [k, c] of controls) s[k] = c.get();
    return s;
  }

  /** Sets the state (missing keys take their defaults); returns the keys and values it could
   *  not use, each as a short message; updates the view. */
  function setState(map) {
    const problems = [];
    for (const c of controls.values()) c.reset();
    for (const [k, v] of Object.entries(map || {})) {
      const c = controls.get(k);
      if (!c) problems.push(`unknown key '${clip(k)}'`);
      else if (c.set(String(v)) === false) problems.push(`${k}: '${clip(v)}' is not one of its options`);
    }
    for (const c of controls.values()) if (c.apply) c.apply();
    run();
    return problems;
  }

  /** Shows a request (a scenario) in the inputs and updates. */
  function load(request) {
    const next = form.fromRequest(request, getState());
    for (const [k, v] of Object.entries(next)) controls.get(k).set(v);
    run();
  }

  function currentRequest(values) {
    form.sync(values);
    const r = form.read(values);
    if (r.errors) return r;
    return { request: { kind: spec.kind, ...(spec.constants || {}), ...r.fields } };
  }

  // ---- one update ----
  function context(request, values) {
    const angleUnit = values.angles;
    const ctx = {
      request, values, angleUnit, kit, result: null, flags: {},
      tol: null,
      A: (rad) => angle(rad, angleUnit),
      au: angleUnit ? angleLabel(angleUnit) : '',
      src: (...keys) => sourceOf(ctx.result, ...keys),
    };
    return ctx;
  }

  function markStale() {
    if (!last) return;
    staleNote.textContent = 'Showing the last valid result; fix the marked input.';
    for (const n of [headline, body, plots]) n.classList.add('stale');
    for (const c of cards) if (c.made.stale) c.made.root.classList.add('stale');
    stopWork();
  }

  function run() {
    const t0 = performance.now();
    const values = getState();
    const r = currentRequest(values);
    if (r.errors) { form.showErrors(r.errors); markStale(); return; }
    const ctx = context(r.request, values);
    const figs = figures.map((f) => ({ ...f, shown: f.spec.when ? !!f.spec.when(ctx) : true }));
    const drawn = figs.filter((f) => f.shown && !f.spec.work);
    let ev;
    try {
      ev = evaluateView({
        request: r.request,
        resultRequest: spec.resultRequest ? spec.resultRequest(r.request) : r.request,
        figures: drawn.map((f) => ({ name: resolve(f.spec.name, ctx), options: spec.angles ? { angle_unit: ctx.angleUnit } : {} })),
      });
    } catch (e) {
      form.showErrors({ [e && e.field ? e.field : 'request']: message(e) });
      markStale();
      return;
    }
    form.showErrors({});
    staleNote.textContent = '';
    for (const n of [headline, body, plots]) n.classList.remove('stale');
    for (const c of cards) c.made.root.classList.remove('stale');
    ctx.result = ev.result;
    ctx.tol = ev.result.tolerance ?? null;
    ctx.flags = Object.fromEntries((ev.result.flags || []).map((f) => [f.key, f]));

    // headline, cautions, tables, regime checks
    headline.replaceChildren(...[spec.headline(ctx)].flat().filter(Boolean));
    cautions.replaceChildren(...(spec.cautions ? spec.cautions(ctx) : []), ...cautionItems(ev.result.flags));
    const tables = [];
    const blocks = [...spec.body(ctx), { title: 'Validity', ...flagsTable(ev.result.flags) }];
    body.replaceChildren(...blocks.map((b) => block(b, tables)));
    root.dataset.level = levelOf(ev.result.flags);
    last = { request: r.request, result: ev.result, tables };

    // figures
    const note = spec.figureNote ? spec.figureNote(ctx) : '';
    plotNote.textContent = note || '';
    plotNote.hidden = !note;
    for (const f of figs) {
      f.card.root.hidden = !f.shown;
      if (f.shown && f.spec.titleFor) f.card.setTitle(f.spec.titleFor(ctx));
    }
    plots.hidden = !figs.some((f) => f.shown);
    drawn.forEach((f, i) => f.card.draw(ev.figures[i]));

    for (const c of cards) c.made.render(ctx);
    runWork(ctx);
    root.dataset.lastMs = (performance.now() - t0).toFixed(2);
    for (const fn of listeners) fn(values);
  }

  function block(b, tables) {
    const frag = document.createDocumentFragment();
    if (b.title) frag.append(el('h3', { text: b.title }));
    if (b.note !== undefined) { frag.append(el('p', { class: 'muted', text: b.note })); return frag; }
    if (b.grid) return el('div', { class: 'enc-grid' }, b.grid.map((column) => el('div', {}, column.map((x) => block(x, tables)))));
    tables.push(b);
    const t = renderTable(b, { digits });
    if (b.role) parts.set(b.role, t);
    frag.append(t);
    return frag;
  }

  // ---- progressive work ----
  // root[data-work-done]: 'false' while work runs, 'true' when it is done, absent with no work.
  function stopWork() {
    workGen += 1;
    if (work) { work.handle.stop(); work = null; }
    delete root.dataset.workDone;
  }

  function runWork(ctx) {
    if (!spec.work) return;
    const key = spec.work.key(ctx);
    if (work && key === work.key) { if (work.handle.refresh) work.handle.refresh(ctx); return; }
    stopWork();
    if (key === null || key === undefined) return;
    const handle = spec.work.start(ctx, kit);
    if (!handle) return;
    const gen = workGen;
    work = { key, handle };
    root.dataset.workDone = 'false';
    const tick = () => {
      if (gen !== workGen) return;
      let done;
      try {
        done = handle.step(WORK_BUDGET_MS);
      } catch (e) {
        if (handle.fail) handle.fail(message(e));
        return;
      }
      if (done) { root.dataset.workDone = 'true'; return; }
      requestAnimationFrame(tick);
    };
    requestAnimationFrame(tick);
  }

  // ---- exports ----
  csvBtn.addEventListener('click', () => {
    if (!last) return;
    const rows = spec.csv ? spec.csv(last) : [CSV_HEAD,
      ...last.tables.flatMap(tableCsvRows), ...flagsCsvRows(last.result.flags)];
    download(`chiwave-${id}.csv`, csv(rows), 'text/csv');
  });
  jsonBtn.addEventListener('click', () => {
    if (!last) return;
    const extra = spec.json ? spec.json(last, kit) : {};
    download(`chiwave-${id}.json`, JSON.stringify({ request: last.request, result: last.result, ...extra }, null, 2), 'application/json');
  });

  return {
    id, title: spec.title, kind: spec.kind, aliases: spec.aliases || [], root,
    /** Recomputes now (a tab shown, the page started). */
    update: run,
    load,
    getState,
    setState,
    /** The request of the current inputs, or null while an input is refused. */
    request() { const r = currentRequest(getState()); return r.request || null; },
    /** Calls fn(state) after every update that shows a result (e.g. to keep a link current). */
    onUpdate(fn) { listeners.push(fn); },
    /** The names of the parts a page can show alone, and one part's element. */
    parts: () => [...parts.keys()],
    part: (name) => parts.get(name) || null,
    get last() { return last; },
  };
}

function resolve(x, ctx) {
  return typeof x === 'function' ? x(ctx) : x;
}

function setCheck(box, v) {
  if (v !== 'true' && v !== 'false') return false;
  box.checked = v === 'true';
  return true;
}

/** A state control for a select the machinery (or a card) builds itself. */
export function selectControl(key, sel, initial) {
  return {
    key, node: sel, get: () => sel.value,
    set(v) { if (![...sel.options].some((o) => o.value === v)) return false; sel.value = v; return true; },
    reset() { sel.value = initial; },
  };
}

