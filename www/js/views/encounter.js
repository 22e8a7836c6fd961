// Two-body encounter view (gravity or electromagnetism). The JS only assembles the request
// from the inputs and lays out the core's EncounterResult: every number comes from the core
// (wasm `evaluate`, `figure`, `encounter_nr`) and carries its source on hover/focus.
// No physics here: the only arithmetic is the display conversion of angles (viewkit.angle).
import { el, fmt, exact, download, csv } from '../util.js';
import { controls, perFrame, select, num, splitQ, ensureOption, badge, numCell, table, showFieldErrors, flagTable as flagsTable, cautionItems } from '../controls.js';
import { plotCard } from '../plot.js';
import { ANGLE_UNITS, angle, angleLabel } from '../viewkit.js';

const ID = 'encounter';
const MASS_UNITS = [['Msun', 'M☉'], ['kg', 'kg'], ['', 'geometric']];
const SPEED_UNITS = [['gamma', 'γ (Lorentz factor)'], ['c', 'fraction of c'], ['km/s', 'km/s']];
const ORBIT_UNITS = [['', 'b in GM/c²'], ['km', 'b in km'], ['au', 'b in au'], ['j', 'j = J/(G m₁m₂)']];
const CHARGE_UNITS = [['', 'geometric (√G M)'], ['e', 'e'], ['C', 'C'], ['statC', 'statC']];
const { field, input } = controls(ID);

// Order label (core OrderRow.order) → key of the result's `sources` map.
const ORDER_SOURCE = {
  '1PM': '1pm', '2PM': '2pm', '3PM conservative': '3pm_conservative', '3PM radiation reaction': '3pm',
  '1PL': '1pl', '2PL': '2pl', '3PL conservative (test charge)': '3pl_conservative', '3PL radiation reaction': '3pl',
};
// Which regime flags speak for which row of the angle table.
const ORDER_FLAGS = {
  '1PM': ['pm_parameter', 'capture_proximity'], '2PM': ['pm_parameter', 'capture_proximity'],
  '3PM conservative': ['pm_parameter', 'pm_truncation', 'capture_proximity', 'high_energy'],
  '3PM radiation reaction': ['pm_parameter', 'pm_truncation', 'capture_proximity'],
  '1PL': ['pl_parameter'], '2PL': ['pl_parameter'], '3PL conservative (test charge)': ['pl_parameter', 'three_pl_two_body'],
  '3PL radiation reaction': ['pl_parameter'],
};
const FLAG_NAME = {
  pm_parameter: 'PM parameter GM/(b v²)', capture_proximity: 'capture proximity j/j_c', velocity_regime: 'velocity v/c',
  high_energy: 'energy γ', pm_truncation: '3PM share of χ', strong_field_estimate: 'strong-field estimate',
  pl_parameter: 'PL parameter |κ|/p∞', fall_to_centre: 'fall to centre κ', three_pl_two_body: 'two-body 3PL ν',
  dipole_nonrelativistic: 'dipole E_rad v/c', classical_sommerfeld: 'Sommerfeld parameter', classical_compton: 'Compton λ/b', units: 'units',
};
const SHORT = {
  pm_parameter: 'GM/(bv²)', pm_truncation: 'truncation', capture_proximity: 'near capture', high_energy: 'high γ',
  velocity_regime: 'v', strong_field_estimate: 'estimate', pl_parameter: '|κ|/p∞', three_pl_two_body: 'ν part', fall_to_centre: 'fall',
};
const KIN_SRC = 'definition, encounter sheet §0 (core encounter::kinematics): γ = u₁·u₂, p∞ = √(γ²−1), ν = m₁m₂/M², Γ = E/M = √(1 + 2ν(γ−1)), p = ν M p∞/Γ, J = p b, j = J/(G m₁m₂)';
const PHYS_SRC = 'core unit conversion with CODATA 2018 G, c, ħ and IAU 2015 M☉, IAU 2012 au';
const NR_CONV_SRC = 'core encounter::nr: γ = 1 + (Γ² − 1)/(2ν) with Γ = E/M, j = (J/(G M²))/ν (encounter sheet §0); ADM values of initial data used as asymptotic ones is an approximation (sheet pitfall 9)';

export const encounterView = {
  id: ID,
  title: 'Two-body encounter',
  kind: 'encounter',
  make(core) { return makeEncounter(core); },
};

function makeEncounter(core) {
  let angleUnit = 'rad';
  let lastGood = null;
  let gravSources = null;

  // ---------------- inputs ----------------
  const force = select(`f-${ID}-force`, [['gravity', 'gravity'], ['em', 'electromagnetic (Gaussian)']], 'gravity');
  const massMode = select(`f-${ID}-mass-mode`, [['masses', 'masses m₁, m₂'], ['nu', 'symmetric ratio ν (M = 1)']], 'masses');
  const m1 = input('m1', '1'), m2 = input('m2', '1.6');
  const m1u = select(`f-${ID}-m1-unit`, MASS_UNITS, '', 'Mass m₁ unit');
  const m2u = select(`f-${ID}-m2-unit`, MASS_UNITS, '', 'Mass m₂ unit');
  const nu = input('nu', '0.25');
  const speed = input('speed', '1.25');
  const speedU = select(`f-${ID}-speed-unit`, SPEED_UNITS, 'gamma', 'Speed unit');
  const orbit = input('orbit', '18');
  const orbitU = select(`f-${ID}-orbit-unit`, ORBIT_UNITS, '', 'Impact parameter unit, or j');
  const q1 = input('q1', '0.07'), q2 = input('q2', '0.15');
  const q1u = select(`f-${ID}-q1-unit`, CHARGE_UNITS, '', 'Charge q₁ unit');
  const q2u = select(`f-${ID}-q2-unit`, CHARGE_UNITS, '', 'Charge q₂ unit');

  const F = {
    force: field('force', 'Interaction', force),
    massMode: field('mass_mode', 'Masses given as', massMode),
    m1: field('m1', 'Mass m₁', [m1, m1u]),
    m2: field('m2', 'Mass m₂', [m2, m2u]),
    nu: field('nu', 'Symmetric mass ratio ν', nu, '(0 < ν ≤ 1/4)'),
    speed: field('gamma', 'Speed at infinity', [speed, speedU], '(γ, v/c or km/s)'),
    orbit: field('b', 'Impact parameter b, or j', [orbit, orbitU]),
    q1: field('q1', 'Charge q₁', [q1, q1u]),
    q2: field('q2', 'Charge q₂', [q2, q2u]),
  };
  // The speed and orbit fields answer to either request key.
  F.speed.alt = 'v'; F.orbit.alt = 'j';
  const chargeGroup = el('div', { class: 'group', 'data-group': 'charges' }, el('p', { class: 'group-title', text: 'Charges (electromagnetic)' }), F.q1.root, F.q2.root);
  const requestError = el('p', { class: 'request-error', role: 'alert' });
  const form = el('form', { class: 'form', novalidate: true, onsubmit: (e) => e.preventDefault() },
    requestError, F.force.root,
    el('div', { class: 'group' }, el('p', { class: 'group-title', text: 'Bodies' }), F.massMode.root, F.m1.root, F.m2.root, F.nu.root),
    el('div', { class: 'group' }, el('p', { class: 'group-title', text: 'Kinematics' }), F.speed.root, F.orbit.root),
    chargeGroup,
    el('p', { class: 'muted', text: 'Geometric units: G = c = 1, M = m₁ + m₂; a bare b is in GM/c². A physical b or charge needs masses with units.' }));
  for (const c of [force, massMode, m1, m2, m1u, m2u, nu, speed, speedU, orbit, orbitU, q1, q2, q1u, q2u]) {
    c.addEventListener('input', schedule);
    c.addEventListener('change', schedule);
  }
  const inputsCard = el('section', { class: 'card', 'aria-labelledby': `${ID}-in-h` },
    el('h2', { id: `${ID}-in-h` }, 'Inputs ', el('span', { class: 'sub', text: '(recomputed as you type)' })), form);

  function syncVisibility() {
    const byNu = massMode.value === 'nu';
    F.m1.root.hidden = byNu; F.m2.root.hidden = byNu; F.nu.root.hidden = !byNu;
    chargeGroup.hidden = force.value !== 'em';
  }

  function read() {
    const req = { kind: 'encounter', force: force.value };
    const errors = {};
    const q = (inp, u) => (u.value ? `${inp.value.trim()} ${u.value}` : inp.value.trim());
    if (massMode.value === 'nu') {
      const r = num('nu', nu.value); if (r.error) errors.nu = r.error; else req.nu = r.value;
    } else {
      req.m1 = q(m1, m1u); req.m2 = q(m2, m2u);
    }
    if (speedU.value === 'gamma') {
      const r = num('gamma', speed.value); if (r.error) errors.gamma = r.error; else req.gamma = r.value;
    } else if (speedU.value === 'c') {
      const r = num('v', speed.value); if (r.error) errors.gamma = r.error; else req.v = r.value;
    } else req.v = q(speed, speedU);
    if (orbitU.value === 'j') {
      const r = num('j', orbit.value); if (r.error) errors.b = r.error; else req.j = r.value;
    } else req.b = q(orbit, orbitU);
    if (force.value === 'em') { req.q1 = q(q1, q1u); req.q2 = q(q2, q2u); }
    return Object.keys(errors).length ? { errors } : { request: req };
  }

  function showErrors(errors) { showFieldErrors(F, requestError, errors); }

  function load(r) {
    force.value = r.force || 'gravity';
    if (r.nu != null) { massMode.value = 'nu'; nu.value = String(r.nu); } else {
      massMode.value = 'masses';
      for (const [inp, u, v] of [[m1, m1u, r.m1], [m2, m2u, r.m2]]) { const [n, unit] = splitQ(v); inp.value = n; ensureOption(u, unit); }
    }
    if (r.gamma != null) { speedU.value = 'gamma'; speed.value = String(r.gamma); } else {
      const [n, unit] = splitQ(r.v); speed.value = n; ensureOption(speedU, unit === '' ? 'c' : unit);
    }
    if (r.j != null) { orbitU.value = 'j'; orbit.value = String(r.j); } else {
      const [n, unit] = splitQ(r.b); orbit.value = n; ensureOption(orbitU, unit === 'M' ? '' : unit);
    }
    for (const [inp, u, v] of [[q1, q1u, r.q1], [q2, q2u, r.q2]]) if (v != null) { const [n, unit] = splitQ(v); inp.value = n; ensureOption(u, unit); }
    syncVisibility();
  }

  // ---------------- outputs ----------------
  const outUnit = select(`${ID}-angle-unit`, ANGLE_UNITS, angleUnit, 'Output angle unit');
  outUnit.addEventListener('change', () => { angleUnit = outUnit.value; schedule(); nrSchedule(); });
  const showSrc = el('input', { type: 'checkbox', id: `${ID}-show-src` });
  const jsonBtn = el('button', { type: 'button', text: 'JSON', title: 'Download the request and the full result as JSON' });
  const csvBtn = el('button', { type: 'button', text: 'CSV', title: 'Download every number shown, with its source, as CSV' });
  const staleNote = el('p', { class: 'stale-note', role: 'status' });
  const status = el('div', { class: 'status-line', 'data-role': 'status', 'aria-live': 'polite' });
  const regime = el('div', { class: 'regime-strip', 'data-role': 'regime' });
  const cautions = el('ul', { class: 'cautions', 'data-role': 'cautions' });
  const body = el('div', { class: 'enc-body' });
  const resultsCard = el('section', { class: 'card', 'aria-labelledby': `${ID}-res-h` },
    el('div', { class: 'result-head' }, el('h2', { id: `${ID}-res-h`, text: 'Results' }),
      el('div', { class: 'result-tools' }, el('label', { for: outUnit.id, text: 'angles in' }), outUnit,
        el('label', { for: showSrc.id }, showSrc, ' sources'), csvBtn, jsonBtn)),
    staleNote, status, regime, cautions, body);
  showSrc.addEventListener('change', () => resultsCard.classList.toggle('show-sources', showSrc.checked));

  const chiCard = plotCard('Scattering angle against b', `${ID}-chi`);
  const orbitCard = plotCard('Trajectories in the CM frame (estimate)', `${ID}-orbits`);
  const plotNote = el('p', { class: 'muted', 'data-role': 'plot-note' });
  const plots = el('div', { class: 'plots' }, chiCard.root, orbitCard.root);

  // NR comparison
  const nrText = el('textarea', { id: `${ID}-nr-csv`, rows: '6', spellcheck: 'false', class: 'nr-csv',
    placeholder: '# one row per simulation: E/M, J/M², ν, χ [rad], σχ [rad]\n1.023, 1.10, 0.25, 1.05, 0.02', 'aria-describedby': `${ID}-nr-help` });
  const nrFile = el('input', { type: 'file', id: `${ID}-nr-file`, accept: '.csv,.txt,text/csv,text/plain', class: 'visually-hidden' });
  const nrFileBtn = el('label', { class: 'file-btn', for: nrFile.id, tabindex: '0', text: 'Load CSV…' });
  const nrClear = el('button', { type: 'button', text: 'Clear' });
  const nrErr = el('p', { class: 'plot-error', role: 'alert', 'data-role': 'nr-error' });
  const nrTableBox = el('div', { class: 'nr-table', 'data-role': 'nr-table' });
  const nrPlot = plotCard('Your NR angles against the predictions', `${ID}-nr`);
  nrPlot.root.hidden = true;
  const nrCard = el('section', { class: 'card', 'aria-labelledby': `${ID}-nr-h`, 'data-role': 'nr' },
    el('h2', { id: `${ID}-nr-h` }, 'Compare with numerical relativity ', el('span', { class: 'sub', text: '(your data; chiwave ships none)' })),
    el('p', { class: 'muted', id: `${ID}-nr-help` }, 'Paste or load a CSV with one row per simulation: ', el('code', { text: 'E/M, J/M², ν, χ, σχ' }),
      ' (G = c = 1, angles in radians; header line and # comments allowed). Each row is converted to (γ, j) and compared in the core.'),
    el('label', { for: nrText.id, class: 'name', text: 'CSV rows' }), nrText,
    el('div', { class: 'nr-tools' }, nrFileBtn, nrFile, nrClear), nrErr,
    el('ul', { class: 'cautions' }, el('li', { class: 'caution' }, el('strong', { text: 'Caution: ' }),
      'ADM energy and angular momentum of initial data at finite separation are used as the asymptotic E and J — standard practice, but an approximation.')),
    nrTableBox, nrPlot.root);

  const outputs = el('div', { class: 'outputs' }, resultsCard, plotNote, plots, nrCard);
  const root = el('section', { class: 'view', id: `view-${ID}`, role: 'tabpanel', 'aria-label': 'Two-body encounter' }, inputsCard, outputs);

  const nextFrame = perFrame(() => recompute());
  function schedule() {
    syncVisibility();
    nextFrame();
  }

  function markStale(msg) {
    if (!lastGood) return;
    staleNote.textContent = msg || 'Showing the last valid result; fix the marked input.';
    for (const n of [body, status, plots]) n.classList.add('stale');
  }

  function recompute() {
    const t0 = performance.now();
    const r = read();
    if (r.errors) { showErrors(r.errors); markStale(); return; }
    let res;
    try {
      res = core.evaluate(r.request);
    } catch (e) {
      showErrors({ [e && e.field ? e.field : 'request']: e && e.message ? e.message : String(e) });
      markStale();
      return;
    }
    showErrors({});
    staleNote.textContent = '';
    for (const n of [body, status, plots]) n.classList.remove('stale');
    if (res.force === 'gravity') gravSources = res.sources;
    lastGood = { request: r.request, result: res, rows: [] };
    render(res, r.request);
    const t1 = performance.now();
    drawPlots(res, r.request);
    const t2 = performance.now();
    root.dataset.lastMs = (t2 - t0).toFixed(2);
    root.dataset.evalMs = (t1 - t0).toFixed(2);
    root.dataset.plotMs = (t2 - t1).toFixed(2);
  }

  // ---- result layout ----
  function flagsByKey(res) { return Object.fromEntries((res.flags || []).map((f) => [f.key, f])); }

  function regimeBadges(flags, keys) {
    const list = keys.map((k) => flags[k]).filter(Boolean);
    const bad = list.filter((f) => f.level !== 'ok');
    const note = (f) => `regime check “${FLAG_NAME[f.key] || f.key}” = ${fmt(f.value, 4)} (${f.level}): ${f.message}`;
    if (!bad.length) return list.length ? [badge('ok', 'ok', list.map(note).join(' · '))] : [];
    return bad.map((f) => badge(f.level, `${SHORT[f.key] || f.key}: ${f.level}`, note(f)));
  }

  function render(res, req) {
    const rows = lastGood.rows;
    const src = (k) => (res.sources && res.sources[k]) || null;
    const A = (x) => angle(x, angleUnit);
    const au = angleLabel(angleUnit);
    const flags = flagsByKey(res);
    const grav = res.force === 'gravity';
    const push = (label, value, unit, source) => rows.push([label, value, unit, source]);

    // headline
    const best = grav ? res.chi['3pm'] : res.chi['3pl'];
    const captured = grav ? res.captured : res.fall_to_centre;
    const head = [el('span', {}, grav ? 'χ (3PM, with radiation reaction) = ' : 'χ (3PL) = '),
      el('span', { class: 'big', 'data-role': grav ? 'chi-3pm' : 'chi-3pl', 'data-value': exact(best), tabindex: '0', 'data-source': src(grav ? '3pm' : '3pl') }, fmt(A(best), 7)), ` ${au}`];
    if (captured) head.push(el('span', { class: 'sep', text: ' (formal only: outside validity)' }));
    if (grav) {
      head.push(el('span', { class: 'sep', text: ' · strong-field estimate: ' }));
      head.push(res.captured ? badge('captured', 'captured', src('chi_estimate')) : el('span', { class: 'big2', 'data-role': 'chi-estimate', 'data-value': exact(res.chi_estimate), tabindex: '0', 'data-source': src('chi_estimate') }, res.chi_estimate === null ? '—' : `${fmt(A(res.chi_estimate), 6)} ${au}`));
    } else if (res.fall_to_centre) head.push(' ', badge('captured', 'falls to the centre', src('chi_test_exact')));
    status.replaceChildren(el('span', { 'data-captured': String(!!captured) }, ...head));

    // regime strip: PM parameter, capture proximity, velocity regime (always shown)
    const chips = (grav ? ['pm_parameter', 'capture_proximity', 'velocity_regime'] : ['pl_parameter', 'fall_to_centre', 'velocity_regime'])
      .map((k) => flags[k]).filter(Boolean)
      .map((f) => el('span', { class: `chip ${f.level}`, tabindex: '0', 'data-flag': f.key, 'data-source': `regime check (core validity flags): ${f.message}` },
        el('b', { text: FLAG_NAME[f.key] || f.key }), ` = ${fmt(f.value, 3)} `, el('span', { class: `badge ${f.level}`, text: f.key === 'velocity_regime' ? (f.value < 0.1 ? 'slow' : 'relativistic') : f.level })));
    regime.replaceChildren(...chips);

    // banners
    const items = [];
    if (grav && res.captured) items.push(el('li', { class: 'invalid', role: 'alert', 'data-role': 'captured' }, el('strong', { text: 'Captured: ' }), 'the strong-field estimate predicts capture (no scattering angle). PM numbers below are formal only.'));
    items.push(...cautionItems(res.flags));
    cautions.replaceChildren(...items);

    // 1. angle table
    const orderRows = [el('tr', { class: 'section' }, el('td', { colspan: '6', text: grav ? 'Post-Minkowskian series (cumulative)' : 'Post-Lorentzian series (cumulative)' }))];
    for (const o of res.orders) {
      const s = src(ORDER_SOURCE[o.order]);
      orderRows.push(el('tr', { 'data-order': o.order },
        el('td', { text: o.order }),
        numCell(A(o.term), s), numCell(A(o.cumulative), s, { role: `cum-${ORDER_SOURCE[o.order]}` }),
        numCell(o.share_of_total, 'core OrderRow: this term / the most complete value', { digits: 4 }),
        numCell(o.relative_change, 'core OrderRow: this term / the sum of the lower orders', { digits: 4 }),
        el('td', { class: 'regime' }, regimeBadges(flags, ORDER_FLAGS[o.order] || []))));
      push(`χ ${o.order} term`, A(o.term), au, s); push(`χ through ${o.order}`, A(o.cumulative), au, s);
    }
    orderRows.push(el('tr', { class: 'section' }, el('td', { colspan: '6', text: 'Reference values (same γ and j)' })));
    const ref = (label, v, key, flagKeys, capText) => {
      const s = src(key);
      orderRows.push(el('tr', { 'data-ref': key }, el('td', { text: label }), el('td', {}),
        v === null || v === undefined ? el('td', { class: 'num' }, badge('captured', capText || 'n/a', s)) : numCell(A(v), s, { role: key }),
        el('td', {}), el('td', {}), el('td', { class: 'regime' }, regimeBadges(flags, flagKeys))));
      push(label, v === null ? capText : A(v), au, s);
    };
    if (grav) {
      ref('Newtonian hyperbola', res.chi_newtonian, 'chi_newtonian', ['velocity_regime']);
      ref('exact test body (ν → 0)', res.chi_test_body, 'chi_test_body', ['capture_proximity'], 'captured');
      ref('strong-field estimate', res.chi_estimate, 'chi_estimate', ['strong_field_estimate', 'capture_proximity'], res.captured ? 'captured' : 'unavailable');
    } else {
      ref('exact test charge (Darwin)', res.chi_test_exact, 'chi_test_exact', ['fall_to_centre'], 'falls to the centre');
    }
    const angleTable = table(['Order', `Term Δχ [${au}]`, `Cumulative χ [${au}]`, 'Share of total', 'Rel. change', 'Regime'], orderRows, 'orders');
    angleTable.dataset.role = 'orders';

    // 2. kinematics
    const k = res.kinematics;
    const kin = [];
    const krow = (label, v, unit, s = KIN_SRC, role) => { kin.push(el('tr', {}, el('td', { text: label }), numCell(v, s, { role }), el('td', { text: unit }))); push(label, v, unit, s); };
    krow('Lorentz factor γ', k.gamma, '', KIN_SRC, 'gamma');
    krow('γ − 1', k.gamma_m1, '');
    krow('p∞ = √(γ² − 1)', k.p_inf, '');
    krow('relative speed v', k.v, 'c');
    krow('symmetric mass ratio ν', k.nu, '', KIN_SRC, 'nu');
    krow('m₁/M, m₂/M', `${fmt(k.m1, 6)}, ${fmt(k.m2, 6)}`, '');
    krow('Γ = E/M', k.h, '');
    krow('E₁, E₂ (CM)', `${fmt(k.E1, 8)}, ${fmt(k.E2, 8)}`, 'M c²');
    krow('CM momentum p', k.p_cm, 'M c');
    krow('angular momentum J', k.J, 'G M²/c');
    krow('j = J/(G m₁m₂)', k.j, '', KIN_SRC, 'j');
    krow('impact parameter b', k.b_over_gm, 'GM/c²', KIN_SRC, 'b');
    if (grav) {
      krow('test-body capture j_c', res.j_critical_test_body, '', src('j_critical_test_body'));
      krow('test-body capture b_c', res.b_critical_test_body, 'GM/c²', src('j_critical_test_body'));
      if (res.test_body_r_min !== null) krow('test-body periapsis', res.test_body_r_min, 'GM/c²', src('chi_test_body'));
    } else krow('κ = q₁q₂/(J c)', res.kappa, '', 'definition, encounter sheet §4 (core encounter::em)');
    const p = res.physical;
    if (p) {
      kin.push(el('tr', { class: 'section' }, el('td', { colspan: '3', text: 'Physical units' })));
      krow('m₁', p.m1_kg, 'kg', PHYS_SRC); krow('m₂', p.m2_kg, 'kg', PHYS_SRC);
      if (p.m_total_msun !== undefined) krow('M = m₁ + m₂', p.m_total_msun, 'M☉', PHYS_SRC);
      if (p.gm_over_c2_m !== undefined) krow('GM/c²', p.gm_over_c2_m, 'm', PHYS_SRC);
      krow('b', p.b_m, 'm', PHYS_SRC);
      if (p.b_au !== undefined) krow('b', p.b_au, 'au', PHYS_SRC);
      krow('v', p.v_km_s, 'km/s', PHYS_SRC);
      if (p.j_si !== undefined) krow('J', p.j_si, 'kg m² s⁻¹', PHYS_SRC);
      if (p.q1_c !== undefined) { krow('q₁', p.q1_c, 'C', PHYS_SRC); krow('q₂', p.q2_c, 'C', PHYS_SRC); }
    }

    // 3. impulse
    const imp = [];
    const irow = (label, c, r2, unit, s) => { imp.push(el('tr', {}, el('td', { text: label }), numCell(c, s), numCell(r2, s), el('td', { text: unit }))); push(`${label} (CM)`, c, unit, s); push(`${label} (rest frame of body 2)`, r2, unit, s); };
    const fr = (i, s) => {
      irow('transverse (along b̂)', i.cm.transverse, i.rest2.transverse, 'M c', s);
      irow('longitudinal', i.cm.longitudinal, i.rest2.longitudinal, 'M c', s);
      irow('energy', i.cm.energy, i.rest2.energy, 'M c²', s);
    };
    fr(res.impulse, src('impulse'));
    if (grav && res.impulse_conservative) {
      imp.push(el('tr', { class: 'section' }, el('td', { colspan: '4', text: 'conservative part only (no radiation reaction)' })));
      fr(res.impulse_conservative, src('impulse'));
    }
    if (p && p.impulse_transverse_kg_m_s !== undefined) {
      imp.push(el('tr', {}, el('td', { text: 'transverse, SI' }), numCell(p.impulse_transverse_kg_m_s, PHYS_SRC), el('td', {}), el('td', { text: 'kg m s⁻¹' })));
    }

    // 4. radiation
    const rad = [];
    const rrow = (label, v, unit, s, role) => { rad.push(el('tr', {}, el('td', { text: label }), numCell(v, s, { role }), el('td', { text: unit }))); push(label, v, unit, s); };
    if (grav) {
      rrow('radiated energy E_rad (CM, O(G³))', res.e_rad, 'M c²', src('e_rad'), 'e_rad');
      rrow('radiated momentum (CM, along body 1)', res.p_rad_cm, 'M c', src('p_rad_cm'));
      rrow('radiated angular momentum J_rad/J (O(G²))', res.j_rad, '', src('j_rad'));
      if (p) {
        rrow('E_rad', p.e_rad_j, 'J', src('e_rad')); rrow('E_rad', p.e_rad_msun_c2, 'M☉ c²', src('e_rad'));
        rrow('J_rad', p.j_rad_si, 'kg m² s⁻¹', src('j_rad'));
      }
    } else {
      rrow('E_rad, test charge (rest frame of body 2)', res.e_rad, 'M c²', src('e_rad'), 'e_rad');
      rrow('E_rad, two-body dipole (v ≪ c)', res.e_rad_dipole, 'M c²', src('e_rad_dipole'));
      rrow('mechanical J_rad/J (O(e⁴))', res.j_rad, '', src('j_rad'));
      if (p) { rrow('E_rad, test charge', p.e_rad_j, 'J', src('e_rad')); rrow('E_rad, dipole', p.e_rad_dipole_j, 'J', src('e_rad_dipole')); }
    }

    // 5. flags
    const flagTable = flagsTable(res.flags, FLAG_NAME);

    body.replaceChildren(
      el('h3', { text: 'Scattering angle, order by order' }), angleTable,
      el('div', { class: 'enc-grid' },
        el('div', {}, el('h3', { text: 'Kinematics' }), table(['Quantity', 'Value', 'Unit'], kin, 'kin')),
        el('div', {},
          el('h3', { text: 'Impulse Δp₁ of body 1' }), table(['Component', 'CM frame', 'Rest frame of 2', 'Unit'], imp, 'imp'),
          el('h3', { text: grav ? 'Radiated' : 'Radiated (electromagnetic)' }), table(['Quantity', 'Value', 'Unit'], rad, 'rad'))),
      el('p', { class: 'muted', text: grav ? 'Units: G = c = 1 with M = m₁ + m₂ (lengths GM/c², momenta M c, energies M c², J in G M²/c). Impulse transverse along b̂ from body 2 to body 1 (attraction negative).' : `Units: ${res.units} (Coulomb force q₁q₂/r²), M = m₁ + m₂.` }),
      el('h3', { text: 'Validity' }), flagTable);
    for (const tr of body.querySelectorAll('table.enc td.num')) if (!tr.dataset.source) tr.removeAttribute('tabindex');
  }

  function drawPlots(res, req) {
    const grav = res.force === 'gravity';
    plots.hidden = !grav;
    plotNote.textContent = grav ? '' : 'χ(b) and trajectory figures are drawn for gravity only: the core’s χ sweep and strong-field orbit cover gravitational encounters. The table above gives every PL order and Darwin’s exact test-charge angle.';
    if (!grav) return;
    const byJ = req.j !== undefined;
    const name = byJ ? 'chi_j' : 'chi_b';
    chiCard.root.querySelector('h3').textContent = byJ ? 'Scattering angle against j' : 'Scattering angle against b';
    for (const [card, fig] of [[chiCard, name], [orbitCard, 'orbits']]) {
      try {
        card.show(core.figure(req, fig, { angle_unit: angleUnit }));
        card.fresh();
      } catch (e) {
        card.fail(e && e.message ? e.message : String(e));
      }
    }
  }

  // ---- NR comparison ----
  let nrPending = false;
  function nrSchedule() {
    if (nrPending) return;
    nrPending = true;
    requestAnimationFrame(() => { nrPending = false; nrCompare(); });
  }
  function nrCompare() {
    const text = nrText.value;
    if (!text.trim()) { nrErr.textContent = ''; nrTableBox.replaceChildren(); nrPlot.root.hidden = true; return; }
    let out;
    try {
      out = core.encounter_nr(text, angleUnit);
    } catch (e) {
      nrErr.textContent = e && e.message ? e.message : String(e);
      nrTableBox.classList.add('stale');
      return;
    }
    nrErr.textContent = '';
    nrTableBox.classList.remove('stale');
    const A = (x) => angle(x, angleUnit);
    const au = angleLabel(angleUnit);
    const gs = (k) => (gravSources && gravSources[k]) || `core encounter::nr, ${k}`;
    const trs = out.rows.map((c, i) => el('tr', { 'data-nr-row': String(i + 1) },
      el('td', { text: String(i + 1) }),
      numCell(c.input.e_over_m, `your CSV, row ${i + 1}`, { digits: 7 }), numCell(c.input.j_over_m2, `your CSV, row ${i + 1}`, { digits: 6 }),
      numCell(c.input.nu, `your CSV, row ${i + 1}`, { digits: 5 }),
      el('td', { class: 'num', tabindex: '0', 'data-source': `your CSV, row ${i + 1}`, 'data-value': exact(c.input.chi) }, `${fmt(A(c.input.chi), 5)} ± ${fmt(A(c.input.sigma_chi), 2)}`),
      numCell(c.gamma, NR_CONV_SRC, { digits: 6 }), numCell(c.j, NR_CONV_SRC, { digits: 6 }),
      numCell(A(c.chi['1pm']), gs('1pm'), { digits: 5 }), numCell(A(c.chi['2pm']), gs('2pm'), { digits: 5 }),
      numCell(A(c.chi['3pm']), gs('3pm'), { digits: 5 }),
      c.chi_test_body === null ? el('td', { class: 'num' }, badge('captured', 'captured', gs('chi_test_body'))) : numCell(A(c.chi_test_body), gs('chi_test_body'), { digits: 5 }),
      c.chi_estimate === null ? el('td', { class: 'num' }, badge(c.captured ? 'captured' : 'caution', c.captured ? 'captured' : 'n/a', c.estimate_note || gs('chi_estimate'))) : numCell(A(c.chi_estimate), gs('chi_estimate'), { digits: 5 }),
      numCell(c.pull_3pm, 'core encounter::nr: (χ_NR − χ_3PM)/σχ', { digits: 3 })));
    const t = el('table', { class: 'results enc nr', 'data-role': 'nr-rows' },
      el('thead', {}, el('tr', {}, ['#', 'E/M', 'J/M²', 'ν', `χ ± σ [${au}]`, 'γ', 'j', '1PM', '2PM', '3PM', 'test body', 'estimate', 'pull 3PM'].map((h, i) => el('th', { text: h, style: i ? 'text-align:right' : null })))),
      el('tbody', {}, trs));
    nrTableBox.replaceChildren(el('div', { class: 'scroll' }, t));
    nrPlot.root.hidden = false;
    nrPlot.show(out.figure);
    nrPlot.fresh();
  }
  nrText.addEventListener('input', nrSchedule);
  nrClear.addEventListener('click', () => { nrText.value = ''; nrCompare(); });
  nrFile.addEventListener('change', () => {
    const f = nrFile.files && nrFile.files[0];
    if (!f) return;
    const reader = new FileReader();
    reader.onload = () => { nrText.value = String(reader.result); nrCompare(); nrFile.value = ''; };
    reader.onerror = () => { nrErr.textContent = `${f.name}: could not be read`; };
    reader.readAsText(f);
  });
  nrFileBtn.addEventListener('keydown', (e) => { if (e.key === 'Enter' || e.key === ' ') { e.preventDefault(); nrFile.click(); } });

  jsonBtn.addEventListener('click', () => {
    if (lastGood) download('chiwave-encounter.json', JSON.stringify({ request: lastGood.request, result: lastGood.result }, null, 2), 'application/json');
  });
  csvBtn.addEventListener('click', () => {
    if (!lastGood) return;
    const out = [['quantity', 'value', 'unit', 'source']];
    for (const [l, v, u, s] of lastGood.rows) out.push([l, exact(v), u, s || '']);
    for (const f of lastGood.result.flags || []) out.push([`flag ${f.key}`, f.level, '', f.message]);
    download('chiwave-encounter.csv', csv(out), 'text/csv');
  });

  load({ m1: 1, m2: 1.6, gamma: 1.25, b: 18 });
  return {
    id: ID, title: 'Two-body encounter', kind: 'encounter', root,
    load(request) { load(request); recompute(); },
    recompute,
    request() { const r = read(); return r.request || null; },
    get last() { return lastGood; },
  };
}
