// Two-body encounter view (gravity or electromagnetism). The inputs are declared for the view
// machinery; the layout reads the core's EncounterResult: every number comes from the core (wasm
// evaluate, figure and encounter_nr, through core.js) and carries its source on hover/focus.
// No physics here: the only arithmetic is the display conversion of angles.
import { el, fmt } from '../util.js';
import { quantity, number, choice, group, note } from '../inputs.js';
import { num, col, valueTable, badge, renderTable, estimateCells, bestHeadline, ESTIMATE_COLUMNS } from '../table.js';
import { plotCard } from '../plot.js';
import { compareNr, flagLabel, angle, angleLabel, message } from '../core.js';

const ID = 'encounter';
const MASS_UNITS = [['Msun', 'M☉'], ['kg', 'kg'], ['', 'geometric']];
const SPEED_UNITS = [['gamma', 'γ (Lorentz factor)', { key: 'gamma', number: true }], ['c', 'fraction of c', { key: 'v', number: true }], ['km/s', 'km/s', { key: 'v' }]];
const ORBIT_UNITS = [['', 'b in GM/c²', { aliases: ['M'] }], ['km', 'b in km'], ['au', 'b in au'], ['j', 'j = J/(G m₁m₂)', { key: 'j', number: true }]];
const CHARGE_UNITS = [['', 'geometric (√G M)'], ['e', 'e'], ['C', 'C'], ['statC', 'statC']];

// Order label (core OrderRow.order) → key of the result's `sources` map.
const ORDER_SOURCE = {
  '1PM': '1pm', '2PM': '2pm', '3PM conservative': '3pm_conservative', '3PM radiation reaction': '3pm',
  '1PL': '1pl', '2PL': '2pl', '3PL conservative (test charge)': '3pl_conservative', '3PL radiation reaction': '3pl',
};
const KIN_SRC = 'definition (core encounter::kinematics): γ = u₁·u₂, p∞ = √(γ²−1), ν = m₁m₂/M², Γ = E/M = √(1 + 2ν(γ−1)), p = ν M p∞/Γ, J = p b, j = J/(G m₁m₂)';
const PHYS_SRC = 'core unit conversion with CODATA 2018 G, c, ħ and IAU 2015 M☉, IAU 2012 au';
const NR_CONV_SRC = 'core encounter::nr: γ = 1 + (Γ² − 1)/(2ν) with Γ = E/M, j = (J/(G M²))/ν; ADM values of initial data used as asymptotic ones is an approximation';

const em = (s) => s.force === 'em';
const grav = (c) => c.request.force !== 'em';

// The view's names of the keys the core may recommend (display text only).
const BEST_NAME = {
  'chi.3pm': 'χ (3PM, with radiation reaction)', 'chi.2pm': 'χ (2PM)', 'chi.1pm': 'χ (1PM)',
  chi_test_body: 'χ, exact test body (ν → 0)', chi_estimate: 'χ, strong-field estimate',
  'chi.3pl': 'χ (3PL)', 'chi.2pl': 'χ (2PL)', 'chi.1pl': 'χ (1PL)', chi_test_exact: 'χ, Darwin’s exact test charge',
};
// Key of the result → key of its `sources` entry.
const BEST_SOURCE = { 'chi.3pm': '3pm', 'chi.2pm': '2pm', 'chi.1pm': '1pm', 'chi.3pl': '3pl', 'chi.2pl': '2pl', 'chi.1pl': '1pl' };

function headline({ result: res, A, au, src, flags, tol }) {
  const g = res.force === 'gravity';
  const b = res.best;
  const captured = g ? res.captured : res.fall_to_centre;
  const head = [bestHeadline(b, { name: BEST_NAME[b.key] || b.key, shown: fmt(A(b.value), 7), unit: au, tol, source: src(BEST_SOURCE[b.key] || b.key) })];
  if (g && res.captured) head.push(el('div', {}, 'strong-field estimate: ', badge('captured', 'captured', src('chi_estimate'))));
  else if (!g && res.fall_to_centre) head.push(el('div', {}, badge('captured', 'falls to the centre', src('chi_test_exact'))));
  // regime strip: PM (PL) parameter, capture proximity (fall to centre), velocity regime
  const chips = (g ? ['pm_parameter', 'capture_proximity', 'velocity_regime'] : ['pl_parameter', 'fall_to_centre', 'velocity_regime'])
    .map((k) => flags[k]).filter(Boolean)
    .map((f) => el('span', { class: `chip ${f.level}`, tabindex: '0', 'data-flag': f.key, 'data-source': `regime check (core validity flags): ${f.message}` },
      el('b', { text: flagLabel(f) }), ` = ${fmt(f.value, 3)} `,
      el('span', { class: `badge ${f.level}`, text: f.key === 'velocity_regime' ? (f.value < 0.1 ? 'slow' : 'relativistic') : f.level })));
  return [el('span', { 'data-captured': String(!!captured) }, ...head), el('div', { class: 'regime-strip', 'data-role': 'regime' }, chips)];
}

function cautions({ result: res }) {
  if (res.force !== 'gravity' || !res.captured) return [];
  return [el('li', { class: 'invalid', role: 'alert', 'data-role': 'captured' }, el('strong', { text: 'Captured: ' }),
    'the strong-field estimate predicts capture (no scattering angle). PM numbers below are formal only.')];
}

function body({ result: res, A, au, src, tol }) {
  const g = res.force === 'gravity';
  const E = res.estimates || {};
  // 1. the angle, order by order, and the reference values: every row with the core's error
  // estimate and verdict (the page decides no level)
  const rows = [{ section: g ? 'Post-Minkowskian series (cumulative)' : 'Post-Lorentzian series (cumulative)' }];
  for (const o of res.orders) {
    const s = src(ORDER_SOURCE[o.order]);
    rows.push({ attrs: { 'data-order': o.order, 'data-verdict': o.verdict }, cells: [o.order,
      num(A(o.term), s), num(A(o.cumulative), s, { key: `cum-${ORDER_SOURCE[o.order]}` }),
      num(o.share_of_total, 'core OrderRow: this term / the most complete value', { digits: 4 }),
      num(o.relative_change, 'core OrderRow: this term / the sum of the lower orders', { digits: 4 }),
      ...estimateCells(o, tol)] });
  }
  rows.push({ section: g ? 'Other values of the same angle (same γ and j)' : 'Exact test-charge angle (same γ and κ)' });
  const ref = (label, v, key, capText) => {
    const s = src(key);
    rows.push({ attrs: { 'data-ref': key, 'data-verdict': E[key] ? E[key].verdict : null }, cells: [label, '',
      v === null || v === undefined ? { node: badge('captured', capText || 'n/a', s), cls: 'num' } : num(A(v), s, { key }),
      '', '', ...estimateCells(E[key], tol)] });
  };
  if (g) {
    ref('Newtonian hyperbola', res.chi_newtonian, 'chi_newtonian');
    ref('exact test body (ν → 0)', res.chi_test_body, 'chi_test_body', 'captured');
    ref('strong-field estimate', res.chi_estimate, 'chi_estimate', res.captured ? 'captured' : 'unavailable');
  } else {
    ref('exact test charge (Darwin)', res.chi_test_exact, 'chi_test_exact', 'falls to the centre');
  }
  const orders = {
    role: 'orders', title: 'Scattering angle, order by order', cls: 'enc orders', rows,
    columns: [col.label('Order'), col.value(`Term Δχ [${au}]`, { unit: au }), col.value(`Cumulative χ [${au}]`, { unit: au }), col.value('Share of total'), col.value('Rel. change'), ...ESTIMATE_COLUMNS],
  };

  // 2. kinematics
  const k = res.kinematics;
  const kin = [
    ['Lorentz factor γ', k.gamma, '', KIN_SRC, 'gamma'],
    ['γ − 1', k.gamma_m1, '', KIN_SRC],
    ['p∞ = √(γ² − 1)', k.p_inf, '', KIN_SRC],
    ['relative speed v', k.v, 'c', KIN_SRC],
    ['symmetric mass ratio ν', k.nu, '', KIN_SRC, 'nu'],
    ['m₁/M, m₂/M', `${fmt(k.m1, 6)}, ${fmt(k.m2, 6)}`, '', KIN_SRC],
    ['Γ = E/M', k.h, '', KIN_SRC],
    ['E₁, E₂ (CM)', `${fmt(k.E1, 8)}, ${fmt(k.E2, 8)}`, 'M c²', KIN_SRC],
    ['CM momentum p', k.p_cm, 'M c', KIN_SRC],
    ['angular momentum J', k.J, 'G M²/c', KIN_SRC],
    ['j = J/(G m₁m₂)', k.j, '', KIN_SRC, 'j'],
    ['impact parameter b', k.b_over_gm, 'GM/c²', KIN_SRC, 'b'],
  ];
  if (g) {
    kin.push(['test-body capture j_c', res.j_critical_test_body, '', src('j_critical_test_body')],
      ['test-body capture b_c', res.b_critical_test_body, 'GM/c²', src('j_critical_test_body')]);
    if (res.test_body_r_min !== null) kin.push(['test-body periapsis', res.test_body_r_min, 'GM/c²', src('chi_test_body')]);
  } else kin.push(['κ = q₁q₂/(J c)', res.kappa, '', 'definition (core encounter::em)']);
  const p = res.physical;
  if (p) {
    kin.push({ section: 'Physical units' }, ['m₁', p.m1_kg, 'kg', PHYS_SRC], ['m₂', p.m2_kg, 'kg', PHYS_SRC]);
    if (p.m_total_msun !== undefined) kin.push(['M = m₁ + m₂', p.m_total_msun, 'M☉', PHYS_SRC]);
    if (p.gm_over_c2_m !== undefined) kin.push(['GM/c²', p.gm_over_c2_m, 'm', PHYS_SRC]);
    kin.push(['b', p.b_m, 'm', PHYS_SRC]);
    if (p.b_au !== undefined) kin.push(['b', p.b_au, 'au', PHYS_SRC]);
    kin.push(['v', p.v_km_s, 'km/s', PHYS_SRC]);
    if (p.j_si !== undefined) kin.push(['J', p.j_si, 'kg m² s⁻¹', PHYS_SRC]);
    if (p.q1_c !== undefined) kin.push(['q₁', p.q1_c, 'C', PHYS_SRC], ['q₂', p.q2_c, 'C', PHYS_SRC]);
  }

  // 3. impulse
  const imp = [];
  const frame = (i, s) => {
    for (const [label, key, unit] of [['transverse (along b̂)', 'transverse', 'M c'], ['longitudinal', 'longitudinal', 'M c'], ['energy', 'energy', 'M c²']]) {
      imp.push({ cells: [label, num(i.cm[key], s), num(i.rest2[key], s), unit] });
    }
  };
  frame(res.impulse, src('impulse'));
  if (g && res.impulse_conservative) {
    imp.push({ section: 'conservative part only (no radiation reaction)' });
    frame(res.impulse_conservative, src('impulse'));
  }
  if (p && p.impulse_transverse_kg_m_s !== undefined) imp.push({ cells: ['transverse, SI', num(p.impulse_transverse_kg_m_s, PHYS_SRC), '', 'kg m s⁻¹'] });

  // 4. radiation
  // The 7th item names the row's error estimate (relative, so the SI rows share it).
  const rad = g ? [
    ['radiated energy E_rad (CM, O(G³))', res.e_rad, 'M c²', src('e_rad'), 'e_rad', undefined, 'e_rad'],
    ['radiated momentum (CM, along body 1)', res.p_rad_cm, 'M c', src('p_rad_cm')],
    ['radiated angular momentum J_rad/J (O(G²))', res.j_rad, '', src('j_rad'), undefined, undefined, 'j_rad'],
  ] : [
    ['E_rad, test charge (rest frame of body 2)', res.e_rad, 'M c²', src('e_rad'), 'e_rad', undefined, 'e_rad'],
    ['E_rad, two-body dipole (v ≪ c)', res.e_rad_dipole, 'M c²', src('e_rad_dipole'), undefined, undefined, 'e_rad_dipole'],
    ['mechanical J_rad/J (O(e⁴))', res.j_rad, '', src('j_rad'), undefined, undefined, 'j_rad'],
  ];
  if (p && g) rad.push(['E_rad', p.e_rad_j, 'J', src('e_rad'), undefined, undefined, 'e_rad'], ['E_rad', p.e_rad_msun_c2, 'M☉ c²', src('e_rad'), undefined, undefined, 'e_rad'], ['J_rad', p.j_rad_si, 'kg m² s⁻¹', src('j_rad'), undefined, undefined, 'j_rad']);
  if (p && !g) rad.push(['E_rad, test charge', p.e_rad_j, 'J', src('e_rad'), undefined, undefined, 'e_rad'], ['E_rad, dipole', p.e_rad_dipole_j, 'J', src('e_rad_dipole'), undefined, undefined, 'e_rad_dipole']);

  return [
    orders,
    { grid: [
      [valueTable('kinematics', 'Kinematics', kin)],
      [{ role: 'impulse', title: 'Impulse Δp₁ of body 1', cls: 'enc', rows: imp,
        columns: [col.label('Component'), col.value('CM frame'), col.value('Rest frame of 2'), col.unit()] },
      valueTable('radiated', g ? 'Radiated' : 'Radiated (electromagnetic)', rad, { estimates: E, tol })],
    ] },
    { note: g ? 'Units: G = c = 1 with M = m₁ + m₂ (lengths GM/c², momenta M c, energies M c², J in G M²/c). Impulse transverse along b̂ from body 2 to body 1 (attraction negative).' : `Units: ${res.units} (Coulomb force q₁q₂/r²), M = m₁ + m₂.` },
  ];
}

/** The NR comparison card: its CSV box is part of the view's state (key nr_csv). */
function nrCard(kit) {
  const nrText = el('textarea', { id: `f-${ID}-nr_csv`, rows: '6', spellcheck: 'false', class: 'nr-csv',
    placeholder: '# one row per simulation: E/M, J/M², ν, χ [rad], σχ [rad]\n1.023, 1.10, 0.25, 1.05, 0.02', 'aria-describedby': `${ID}-nr-help` });
  const nrFile = el('input', { type: 'file', id: `${ID}-nr-file`, accept: '.csv,.txt,text/csv,text/plain', class: 'visually-hidden' });
  const nrFileBtn = el('label', { class: 'file-btn', for: nrFile.id, tabindex: '0', text: 'Load CSV…' });
  const nrClear = el('button', { type: 'button', text: 'Clear' });
  const nrErr = el('p', { class: 'plot-error', role: 'alert', 'data-role': 'nr-error' });
  const nrTableBox = el('div', { class: 'nr-table', 'data-role': 'nr-table' });
  const nrPlot = plotCard('Your NR angles against the predictions', `${ID}-nr`);
  nrPlot.root.hidden = true;
  const root = el('section', { class: 'card', 'aria-labelledby': `${ID}-nr-h`, 'data-role': 'nr' },
    el('h2', { id: `${ID}-nr-h` }, 'Compare with numerical relativity ', el('span', { class: 'sub', text: '(your data; chiwave ships none)' })),
    el('p', { class: 'muted', id: `${ID}-nr-help` }, 'Paste or load a CSV with one row per simulation: ', el('code', { text: 'E/M, J/M², ν, χ, σχ' }),
      ' (G = c = 1, angles in radians; header line and # comments allowed). Each row is converted to (γ, j) and compared in the core.'),
    el('label', { for: nrText.id, class: 'name', text: 'CSV rows' }), nrText,
    el('div', { class: 'nr-tools' }, nrFileBtn, nrFile, nrClear), nrErr,
    el('ul', { class: 'cautions' }, el('li', { class: 'caution' }, el('strong', { text: 'Caution: ' }),
      'ADM energy and angular momentum of initial data at finite separation are used as the asymptotic E and J — standard practice, but an approximation.')),
    nrTableBox, nrPlot.root);

  let gravSources = null; // the sources of the last gravitational result, for the prediction columns
  let shown = null; // [text, angle unit] of what the card shows

  function compare() {
    const text = nrText.value;
    const unit = kit.values.angles;
    if (shown && shown[0] === text && shown[1] === unit) return;
    shown = [text, unit];
    if (!text.trim()) { nrErr.textContent = ''; nrTableBox.replaceChildren(); nrPlot.root.hidden = true; return; }
    let out;
    try {
      out = compareNr(text, unit);
    } catch (e) {
      nrErr.textContent = message(e);
      nrTableBox.classList.add('stale');
      return;
    }
    nrErr.textContent = '';
    nrTableBox.classList.remove('stale');
    const A = (x) => angle(x, unit);
    const gs = (k) => (gravSources && gravSources[k]) || `core encounter::nr, ${k}`;
    const predicted = (v, k, o = {}) => (v === null ? { node: badge(o.captured ? 'captured' : 'caution', o.captured ? 'captured' : 'n/a', o.note || gs(k)), cls: 'num' } : num(A(v), gs(k), { digits: 5 }));
    const rows = out.rows.map((c, i) => {
      const mine = `your CSV, row ${i + 1}`;
      return { attrs: { 'data-nr-row': String(i + 1) }, cells: [String(i + 1),
        num(c.input.e_over_m, mine, { digits: 7 }), num(c.input.j_over_m2, mine, { digits: 6 }), num(c.input.nu, mine, { digits: 5 }),
        num(c.input.chi, mine, { shown: `${fmt(A(c.input.chi), 5)} ± ${fmt(A(c.input.sigma_chi), 2)}` }),
        num(c.gamma, NR_CONV_SRC, { digits: 6 }), num(c.j, NR_CONV_SRC, { digits: 6 }),
        predicted(c.chi['1pm'], '1pm'), predicted(c.chi['2pm'], '2pm'), predicted(c.chi['3pm'], '3pm'),
        c.chi_test_body === null ? predicted(null, 'chi_test_body', { captured: true }) : predicted(c.chi_test_body, 'chi_test_body'),
        predicted(c.chi_estimate, 'chi_estimate', { captured: c.captured, note: c.estimate_note }),
        num(c.pull_3pm, 'core encounter::nr: (χ_NR − χ_3PM)/σχ', { digits: 3 })] };
    });
    const au = angleLabel(unit);
    const t = renderTable({ role: 'nr-rows', cls: 'enc nr', sources: false, rows,
      columns: [col.label('#'), ...['E/M', 'J/M²', 'ν', `χ ± σ [${au}]`, 'γ', 'j', '1PM', '2PM', '3PM', 'test body', 'estimate', 'pull 3PM'].map((h) => col.value(h))] });
    nrTableBox.replaceChildren(el('div', { class: 'scroll' }, t));
    nrPlot.root.hidden = false;
    nrPlot.show(out.figure);
    nrPlot.fresh();
  }

  kit.register({ key: 'nr_csv', node: nrText, get: () => nrText.value, set: (v) => { nrText.value = v; }, reset() { nrText.value = ''; } });
  nrText.addEventListener('input', () => kit.schedule(compare));
  nrClear.addEventListener('click', () => { nrText.value = ''; compare(); });
  nrFile.addEventListener('change', () => {
    const f = nrFile.files && nrFile.files[0];
    if (!f) return;
    const reader = new FileReader();
    reader.onload = () => { nrText.value = String(reader.result); compare(); nrFile.value = ''; };
    reader.onerror = () => { nrErr.textContent = `${f.name}: could not be read`; };
    reader.readAsText(f);
  });
  nrFileBtn.addEventListener('keydown', (e) => { if (e.key === 'Enter' || e.key === ' ') { e.preventDefault(); nrFile.click(); } });

  return {
    root,
    render(ctx) {
      if (ctx.result.force === 'gravity') gravSources = ctx.result.sources;
      compare();
    },
  };
}

export const encounterView = {
  id: ID,
  title: 'Two-body encounter',
  kind: 'encounter',
  angles: 'rad',
  inputs: [
    choice('force', 'Interaction', [['gravity', 'gravity'], ['em', 'electromagnetic (Gaussian)']]),
    group('Bodies', [
      choice('mass_mode', 'Masses given as', [['masses', 'masses m₁, m₂'], ['nu', 'symmetric ratio ν (M = 1)']],
        { req: false, fromRequest: (r) => (r.nu !== undefined && r.nu !== null ? 'nu' : 'masses') }),
      quantity('m1', 'Mass m₁', MASS_UNITS, { value: '1', unit: '', show: (s) => s.mass_mode !== 'nu' }),
      quantity('m2', 'Mass m₂', MASS_UNITS, { value: '1.6', unit: '', show: (s) => s.mass_mode !== 'nu' }),
      number('nu', 'Symmetric mass ratio ν', { hint: '(0 < ν ≤ 1/4)', value: '0.25', show: (s) => s.mass_mode === 'nu' }),
    ]),
    group('Kinematics', [
      quantity('speed', 'Speed at infinity', SPEED_UNITS, { hint: '(γ, v/c or km/s)', value: '1.25', unit: 'gamma', req: 'gamma', unitAria: 'Speed unit' }),
      quantity('orbit', 'Impact parameter b, or j', ORBIT_UNITS, { value: '18', unit: '', req: 'b', unitAria: 'Impact parameter unit, or j' }),
    ]),
    group('Charges (electromagnetic)', [
      quantity('q1', 'Charge q₁', CHARGE_UNITS, { value: '0.07', unit: '' }),
      quantity('q2', 'Charge q₂', CHARGE_UNITS, { value: '0.15', unit: '' }),
    ], { role: 'charges', show: em }),
    note('Geometric units: G = c = 1, M = m₁ + m₂; a bare b is in GM/c². A physical b or charge needs masses with units.'),
  ],
  headline,
  cautions,
  body,
  figures: [
    { stem: 'chi', name: (c) => (c.request.j !== undefined ? 'chi_j' : 'chi_b'), title: 'Scattering angle against b',
      titleFor: (c) => (c.request.j !== undefined ? 'Scattering angle against j' : 'Scattering angle against b'), when: grav },
    { stem: 'orbits', name: 'orbits', title: 'Trajectories in the CM frame (estimate)', when: grav },
  ],
  figureNote: (c) => (grav(c) ? '' : 'χ(b) and trajectory figures are drawn for gravity only: the core’s χ sweep and strong-field orbit cover gravitational encounters. The table above gives every PL order and Darwin’s exact test-charge angle.'),
  cards: [{ id: 'nr', place: 'end', make: nrCard }],
};

