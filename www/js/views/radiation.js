// Radiation view: the leading-order waveform at a detector (gravity or electromagnetism), its
// memory, spectrum, sky map and the live energy balance. The JS assembles the request and lays
// out the core's results; every number comes from the core (wasm `evaluate`, `figure` and the
// progressive `RadiationJob`) and carries its source on hover/focus. No physics here.
import { el, fmt, exact, download, csv } from '../util.js';
import { plotCard } from '../plot.js';
import { controls, perFrame, select, num, splitQ, ensureOption, numCell, table, showFieldErrors, flagTable, cautionItems } from '../controls.js';

const ID = 'radiation';
const { field, input } = controls(ID);
const MASS_UNITS = [['Msun', 'M☉'], ['kg', 'kg'], ['', 'geometric']];
const SPEED_UNITS = [['gamma', 'γ (Lorentz factor)'], ['c', 'fraction of c'], ['km/s', 'km/s']];
const B_UNITS = [['', 'GM/c²'], ['km', 'km'], ['Rsun', 'R☉'], ['au', 'au'], ['pc', 'pc']];
const DIST_UNITS = [['Mpc', 'Mpc'], ['Gpc', 'Gpc'], ['kpc', 'kpc'], ['pc', 'pc'], ['au', 'au']];
const WINDOW_UNITS = [['b_over_v', '× b/v (crossing time)'], ['gm', '× GM/c³'], ['s', 's']];
const CHARGE_UNITS = [['', 'geometric (√G M)'], ['e', 'e'], ['C', 'C'], ['statC', 'statC']];
const FLAG_NAME = {
  b_weak_field: 'impact parameter b/(GM/c²)', weak_deflection: 'LO deflection angle', f_char_rule: 'f_char rule of thumb',
  flux_resolution: 'flux-integral resolution',
};
/** Budget of sky work per animation frame (ms): leaves the rest of a 60 Hz frame for drawing. */
const STEP_MS = 9;
const PHASE_TEXT = {
  balance: 'energy balance: flux integral over u and the sphere',
  sky_map: 'sky map',
  spectrum: 'spectrum dE/dω over the sphere',
  done: 'done',
};
const JOB_SRC = {
  flux: 'core waveform::RadiationJob, balance phase: flux integral (1/16π)∫dΩ∫du D²(ḣ₊² + ḣ×²)(1, n) on the sky rule SkyOptions::for_gamma (waveform sheet §4, §8); same sum as the CLI’s e_rad_flux',
  closed: 'Herrmann, Parra-Martinez, Ruf & Zeng 2021, arXiv:2101.07255: P^μ = (G³m₁²m₂²/b³)(u₁ + u₂)^μ E(γ)/(γ + 1) (sheet §4)',
  rel: 'core waveform::RadiationSnapshot: |E_flux − E_closed|/E_closed',
  prel: 'core waveform::RadiationSnapshot: |P_flux − P_closed|/E_closed (P ∝ u₁ + u₂; measured against the energy because P can vanish in the CM frame)',
  joule: 'E/(M c²) × M c² with CODATA 2018 G, c and IAU 2015 M☉ (core waveform request, physical.mc2_j)',
};

export const radiationView = {
  id: ID,
  title: 'Radiation',
  kind: 'waveform',
  make(core) { return makeRadiation(core); },
};

function makeRadiation(core) {
  let lastGood = null; // {request, result}
  let job = null; // the running RadiationJob
  let jobGen = 0;
  let lastSnap = null;

  // ---------------- inputs ----------------
  const force = select(`f-${ID}-force`, [['gravity', 'gravity'], ['em', 'electromagnetic (Gaussian)']], 'gravity');
  const m1 = input('m1', '12'), m2 = input('m2', '7');
  const m1u = select(`f-${ID}-m1-unit`, MASS_UNITS, 'Msun', 'Mass m₁ unit');
  const m2u = select(`f-${ID}-m2-unit`, MASS_UNITS, 'Msun', 'Mass m₂ unit');
  const speed = input('speed', '0.3');
  const speedU = select(`f-${ID}-speed-unit`, SPEED_UNITS, 'c', 'Speed unit');
  const bIn = input('b', '600');
  const bU = select(`f-${ID}-b-unit`, B_UNITS, '', 'Impact parameter unit');
  const theta = input('theta', '60'), phi = input('phi', '30');
  const frame = select(`f-${ID}-frame`, [['rest2', 'rest frame of body 2'], ['cm', 'centre-of-mass frame']], 'cm');
  const dist = input('distance', '100');
  const distU = select(`f-${ID}-distance-unit`, DIST_UNITS, 'Mpc', 'Distance unit');
  const uFrom = input('u_min', '-8', 'Window start'), uTo = input('u_max', '8', 'Window end');
  const winU = select(`f-${ID}-window-unit`, WINDOW_UNITS, 'b_over_v', 'Window unit');
  const samples = input('samples', '1200');
  const detOn = el('input', { type: 'checkbox', id: `f-${ID}-detector-on` });
  const dTheta = input('det_theta', '40'), dPhi = input('det_phi', '110'), dPsi = input('det_psi', '20');
  const q1 = input('q1', '0.1'), q2 = input('q2', '-0.1');
  const q1u = select(`f-${ID}-q1-unit`, CHARGE_UNITS, '', 'Charge q₁ unit');
  const q2u = select(`f-${ID}-q2-unit`, CHARGE_UNITS, '', 'Charge q₂ unit');
  const skyQ = select(`f-${ID}-sky-quantity`, [['energy', 'radiated energy dE/dΩ'], ['memory', 'memory |DΔh|']], 'energy', 'Sky map quantity');
  const proj = select(`f-${ID}-projection`, [['cylindrical', 'cylindrical (φ, elevation)'], ['equal_area', 'equal-area (φ, cos θ)']], 'cylindrical', 'Sky map projection');

  const F = {
    force: field('force', 'Interaction', force),
    m1: field('m1', 'Mass m₁ (incoming)', [m1, m1u]),
    m2: field('m2', 'Mass m₂ (initially at rest in frame A)', [m2, m2u]),
    speed: field('gamma', 'Relative speed at infinity', [speed, speedU], '(γ, v/c or km/s)'),
    b: field('b', 'Impact parameter b', [bIn, bU]),
    theta: field('theta', 'Observer polar angle θ', theta, '(deg, from the orbital normal +z)'),
    phi: field('phi', 'Observer azimuth φ', phi, '(deg, from +x, body 1’s incoming direction)'),
    frame: field('frame', 'Frame', frame),
    distance: field('distance', 'Distance D to the observer', [dist, distU], '(empty: D·h only)'),
    window: field('u_min', 'Time window from, to', [uFrom, uTo, winU], '(closest approach at u = 0)'),
    samples: field('samples', 'Samples', samples, '(2 … 100000)'),
    detector: field('detector', 'Interferometer response', el('label', { for: detOn.id }, detOn, ' F₊h₊ + F×h× for arms along the detector’s x and y')),
    dTheta: field('detector.theta', 'Source polar angle in the detector frame', dTheta, '(deg)'),
    dPhi: field('detector.phi', 'Source azimuth in the detector frame', dPhi, '(deg)'),
    dPsi: field('detector.psi', 'Polarisation angle ψ', dPsi, '(deg)'),
    q1: field('q1', 'Charge q₁', [q1, q1u]),
    q2: field('q2', 'Charge q₂', [q2, q2u]),
    skyQ: field('sky_quantity', 'Sky map shows', skyQ),
    proj: field('projection', 'Sky map projection', proj),
  };
  F.speed.alt = 'v'; F.window.alt = 'u_max';
  const detGroup = el('div', { 'data-group': 'detector-angles' }, F.dTheta.root, F.dPhi.root, F.dPsi.root);
  const gravOnly = el('div', { 'data-group': 'gravity' }, F.frame.root, F.distance.root, F.detector.root, detGroup);
  const chargeGroup = el('div', { class: 'group', 'data-group': 'charges' }, el('p', { class: 'group-title', text: 'Charges (electromagnetic)' }), F.q1.root, F.q2.root);
  const skyGroup = el('div', { class: 'group', 'data-group': 'sky' }, el('p', { class: 'group-title', text: 'Sky map' }), F.skyQ.root, F.proj.root);
  const requestError = el('p', { class: 'request-error', role: 'alert' });
  const form = el('form', { class: 'form', novalidate: true, onsubmit: (e) => e.preventDefault() },
    requestError, F.force.root,
    el('div', { class: 'group' }, el('p', { class: 'group-title', text: 'Bodies and orbit' }), F.m1.root, F.m2.root, F.speed.root, F.b.root),
    el('div', { class: 'group' }, el('p', { class: 'group-title', text: 'Observer' }), F.theta.root, F.phi.root, gravOnly),
    el('div', { class: 'group' }, el('p', { class: 'group-title', text: 'Time samples' }), F.window.root, F.samples.root),
    chargeGroup, skyGroup,
    el('p', { class: 'muted' }, 'Axes: body 2 initially at rest at the origin, body 1 incoming along +x, b along +y, z normal to the orbital plane; ',
      'observer n = (sin θ cos φ, sin θ sin φ, cos θ), polarisation basis e_θ, e_φ; u = t − D, closest approach of the undeflected paths at u = 0. ',
      'A bare b is in GM/c² with M = m₁ + m₂.'));
  const inputs = [force, m1, m2, m1u, m2u, speed, speedU, bIn, bU, theta, phi, frame, dist, distU, uFrom, uTo, winU, samples, detOn, dTheta, dPhi, dPsi, q1, q2, q1u, q2u];
  for (const c of inputs) { c.addEventListener('input', schedule); c.addEventListener('change', schedule); }
  // A new sky quantity needs a new map; a new projection only redraws the one there is.
  skyQ.addEventListener('change', () => { if (lastGood) startJob(lastGood.request); });
  proj.addEventListener('change', () => { if (job) show(skyCard, () => job.sky_figure(proj.value)); });
  const inputsCard = el('section', { class: 'card', 'aria-labelledby': `${ID}-in-h` },
    el('h2', { id: `${ID}-in-h` }, 'Inputs ', el('span', { class: 'sub', text: '(recomputed as you type)' })), form);

  function syncVisibility() {
    const em = force.value === 'em';
    gravOnly.hidden = em; chargeGroup.hidden = !em; skyGroup.hidden = em;
    detGroup.hidden = em || !detOn.checked;
  }

  function read() {
    const req = { kind: 'waveform', force: force.value, angle_unit: 'deg' };
    const errors = {};
    const q = (inp, u) => (u.value ? `${inp.value.trim()} ${u.value}` : inp.value.trim());
    const number = (key, inp) => { const r = num(key, inp.value); if (r.error) errors[key] = r.error; return r.value; };
    req.m1 = q(m1, m1u); req.m2 = q(m2, m2u);
    if (speedU.value === 'gamma') req.gamma = number('gamma', speed);
    else if (speedU.value === 'c') req.v = number('v', speed);
    else req.v = q(speed, speedU);
    req.b = q(bIn, bU);
    req.theta = number('theta', theta);
    req.phi = number('phi', phi);
    req.u_min = number('u_min', uFrom);
    req.u_max = number('u_max', uTo);
    req.u_unit = winU.value;
    const n = number('samples', samples);
    if (n !== undefined) {
      if (!Number.isInteger(n)) errors.samples = 'samples: enter a whole number';
      req.samples = n;
    }
    if (force.value === 'em') {
      req.q1 = q(q1, q1u); req.q2 = q(q2, q2u);
    } else {
      req.frame = frame.value;
      if (dist.value.trim() !== '') req.distance = q(dist, distU);
      if (detOn.checked) req.detector = { theta: number('detector.theta', dTheta), phi: number('detector.phi', dPhi), psi: number('detector.psi', dPsi) };
    }
    return Object.keys(errors).length ? { errors } : { request: req };
  }

  function showErrors(errors) {
    const e = { ...errors };
    if (e.u_unit && !e.u_min) e.u_min = e.u_unit; // the window's unit is part of the window field
    showFieldErrors(F, requestError, e);
  }

  function load(r) {
    force.value = r.force || 'gravity';
    for (const [inp, u, v] of [[m1, m1u, r.m1], [m2, m2u, r.m2]]) { const [n, unit] = splitQ(v); inp.value = n; ensureOption(u, unit); }
    if (r.gamma != null) { speedU.value = 'gamma'; speed.value = String(r.gamma); } else {
      const [n, unit] = splitQ(r.v); speed.value = n; ensureOption(speedU, unit === '' ? 'c' : unit);
    }
    { const [n, unit] = splitQ(r.b); bIn.value = n; ensureOption(bU, unit === 'M' ? '' : unit); }
    // Angles are shown in degrees; a request in another unit is converted for display only.
    const toDeg = { deg: 1, rad: 180 / Math.PI, arcsec: 1 / 3600, mas: 1 / 3.6e6, uas: 1 / 3.6e9 }[r.angle_unit || 'rad'] || 1;
    const a = (x) => String(Number((x * toDeg).toPrecision(12)));
    theta.value = a(r.theta); phi.value = a(r.phi);
    frame.value = r.frame || 'rest2';
    if (r.distance != null) { const [n, unit] = splitQ(r.distance); dist.value = n; ensureOption(distU, unit); } else dist.value = '';
    uFrom.value = String(r.u_min); uTo.value = String(r.u_max);
    winU.value = r.u_unit || 'gm';
    samples.value = String(r.samples || 1000);
    detOn.checked = !!r.detector;
    if (r.detector) { dTheta.value = a(r.detector.theta); dPhi.value = a(r.detector.phi); dPsi.value = a(r.detector.psi || 0); }
    for (const [inp, u, v] of [[q1, q1u, r.q1], [q2, q2u, r.q2]]) if (v != null) { const [n, unit] = splitQ(v); inp.value = n; ensureOption(u, unit); }
    syncVisibility();
  }

  // ---------------- outputs ----------------
  const showSrc = el('input', { type: 'checkbox', id: `${ID}-show-src` });
  const jsonBtn = el('button', { type: 'button', text: 'JSON', title: 'Download the request, the full result and the energy balance as JSON' });
  const csvBtn = el('button', { type: 'button', text: 'CSV', title: 'Download the waveform arrays (time, h₊, h× or E_θ, E_φ) as CSV' });
  const staleNote = el('p', { class: 'stale-note', role: 'status' });
  const status = el('div', { class: 'status-line', 'data-role': 'status', 'aria-live': 'polite' });
  const cautions = el('ul', { class: 'cautions', 'data-role': 'cautions' });
  const body = el('div', { class: 'enc-body' });
  const resultsCard = el('section', { class: 'card', 'aria-labelledby': `${ID}-res-h` },
    el('div', { class: 'result-head' }, el('h2', { id: `${ID}-res-h`, text: 'Results' }),
      el('div', { class: 'result-tools' }, el('label', { for: showSrc.id }, showSrc, ' sources'), csvBtn, jsonBtn)),
    staleNote, status, cautions, body);
  showSrc.addEventListener('change', () => resultsCard.classList.toggle('show-sources', showSrc.checked));

  // Balance panel (live).
  const bar = el('div', { class: 'progress-fill' });
  const progress = el('div', { class: 'progress', role: 'progressbar', 'aria-valuemin': '0', 'aria-valuemax': '100', 'aria-valuenow': '0', 'aria-label': 'Sky integrals', 'data-role': 'sky-progress' }, bar);
  const progressText = el('p', { class: 'muted progress-text', 'aria-live': 'polite' });
  const balanceBody = el('tbody');
  const balanceCard = el('section', { class: 'card balance', 'aria-labelledby': `${ID}-bal-h`, 'data-role': 'balance' },
    el('h2', { id: `${ID}-bal-h` }, 'Energy balance ', el('span', { class: 'sub', text: '(flux integral of this waveform against the closed form)' })),
    progress, progressText,
    el('table', { class: 'results enc balance-table' },
      el('thead', {}, el('tr', {}, ['Quantity', 'Flux integral', 'Closed form', 'Rel. difference', 'Unit'].map((h, i) => el('th', { text: h, style: i > 0 && i < 4 ? 'text-align:right' : null })))),
      balanceBody),
    el('p', { class: 'muted', text: 'The flux integral runs over the retarded time and the whole sphere a few directions per frame, so the page stays responsive; it restarts when an input changes. Agreement to ~1e-10 is the check of the whole waveform.' }));

  const strainCard = plotCard('Strain h₊, h× against time', `${ID}-strain`);
  const slowCard = plotCard('Slow-motion check: quadrupole waveform of the Newtonian hyperbola', `${ID}-slow`);
  const skyCard = plotCard('Sky map', `${ID}-sky`);
  const specCard = plotCard('Spectrum', `${ID}-spectrum`);
  const emCard = plotCard('Radiation field E_θ, E_φ against time', `${ID}-em`);
  const emSpecCard = plotCard('Electromagnetic spectrum', `${ID}-em-spectrum`);
  const plotNote = el('p', { class: 'muted', 'data-role': 'plot-note' });
  const plots = el('div', { class: 'plots' }, strainCard.root, skyCard.root, specCard.root, slowCard.root, emCard.root, emSpecCard.root);

  const outputs = el('div', { class: 'outputs' }, resultsCard, balanceCard, plotNote, plots);
  const root = el('section', { class: 'view', id: `view-${ID}`, role: 'tabpanel', 'aria-label': 'Radiation' }, inputsCard, outputs);

  const nextFrame = perFrame(() => recompute());
  function schedule() {
    syncVisibility();
    nextFrame();
  }

  function markStale(msg) {
    if (!lastGood) return;
    staleNote.textContent = msg || 'Showing the last valid result; fix the marked input.';
    for (const n of [body, status, plots, balanceCard]) n.classList.add('stale');
    stopJob();
  }

  function recompute() {
    syncVisibility();
    const t0 = performance.now();
    const r = read();
    if (r.errors) { showErrors(r.errors); markStale(); return; }
    const grav = r.request.force !== 'em';
    // The gravitational sky integrals run progressively (RadiationJob), not in evaluate.
    const evalReq = grav ? { ...r.request, energy_flux: false } : r.request;
    let res;
    try {
      res = core.evaluate(evalReq);
    } catch (e) {
      showErrors({ [e && e.field ? e.field : 'request']: e && e.message ? e.message : String(e) });
      markStale();
      return;
    }
    showErrors({});
    staleNote.textContent = '';
    for (const n of [body, status, plots, balanceCard]) n.classList.remove('stale');
    lastGood = { request: r.request, result: res };
    if (grav) renderGravity(res); else renderEm(res);
    const t1 = performance.now();
    drawPlots(r.request, grav);
    const t2 = performance.now();
    if (grav) startJob(r.request); else { stopJob(); balanceCard.hidden = true; }
    root.dataset.lastMs = (performance.now() - t0).toFixed(2);
    root.dataset.evalMs = (t1 - t0).toFixed(2);
    root.dataset.plotMs = (t2 - t1).toFixed(2);
  }

  // ---- result layout ----
  const src = (res, i) => (res.sources && res.sources[i]) || null;

  function rowsTable(head, rows) { return table(head, rows.map(([l, v, u, s, role, digits]) => el('tr', {}, el('td', { text: l }), numCell(v, s, { role, digits }), el('td', { text: u || '' })))); }

  function renderGravity(res) {
    const p = res.physical;
    const phys = p && p.distance_m !== null && p.distance_m !== undefined;
    const S = { wave: src(res, 0), closed: src(res, 1), mem: src(res, 2), zfl: src(res, 3), antenna: src(res, 4) };
    const PH = 'core waveform request: strain = (D·h/(GM/c²)) × (GM/c²)/D, time = u × GM/c³ (CODATA 2018 G, c; IAU 2015 M☉)';
    const head = [];
    if (phys) head.push(el('span', {}, 'peak |h| = '), el('span', { class: 'big', 'data-role': 'peak-strain', 'data-value': exact(p.peak_strain), tabindex: '0', 'data-source': `${S.wave}; ${PH}` }, fmt(p.peak_strain, 4)));
    else head.push(el('span', {}, 'peak D·|h| = '), el('span', { class: 'big', 'data-role': 'peak-strain', 'data-value': exact(res.peak_abs_h), tabindex: '0', 'data-source': S.wave }, fmt(res.peak_abs_h, 5)), ' GM/c²');
    head.push(el('span', { class: 'sep', text: ' · E_rad = ' }), el('span', { class: 'big2', 'data-role': 'e-rad-headline', 'data-value': exact(p ? p.e_rad_j : res.e_rad_closed), tabindex: '0', 'data-source': S.closed }, p ? `${fmt(p.e_rad_j, 4)} J` : `${fmt(res.e_rad_closed, 5)} M c²`));
    status.replaceChildren(el('span', {}, ...head));
    cautions.replaceChildren(...cautionItems(res.flags));

    const frameName = res.frame === 'cm' ? 'centre-of-mass frame' : 'rest frame of body 2';
    const rel = (a, b) => (b === 0 ? null : Math.abs(a - b) / Math.abs(b)); // display of an agreement, not physics
    const memRows = [
      el('tr', { class: 'section' }, el('td', { colspan: '5', text: `At the observer, ${frameName} (D·h in units of GM/c²)` })),
      memRow('memory Δh₊ (late − early)', res.memory.plus, res.memory_braginsky_thorne.plus, rel(res.memory.plus, res.memory_braginsky_thorne.plus), S),
      memRow('memory Δh×', res.memory.cross, res.memory_braginsky_thorne.cross, rel(res.memory.cross, res.memory_braginsky_thorne.cross), S),
    ];
    const memTable = el('table', { class: 'results enc mem', 'data-role': 'memory' },
      el('thead', {}, el('tr', {}, ['Quantity', 'From the waveform', 'Braginsky–Thorne', 'Rel. difference', 'Unit'].map((h, i) => el('th', { text: h, style: i > 0 && i < 4 ? 'text-align:right' : null })))),
      el('tbody', {}, memRows));

    const w = [
      ['peak D·|h| over the samples', res.peak_abs_h, 'GM/c²', S.wave, 'peak-geometric'],
      ['constant O(G) piece h₊ (not plotted)', res.constant_piece.plus, 'GM/c²', `${S.wave}; u-independent field of the incoming bodies (sheet §0), not Lorentz-covariant`],
      ['constant O(G) piece h×', res.constant_piece.cross, 'GM/c²', `${S.wave}; sheet §0`],
      ['relative Lorentz factor γ', res.gamma, '', 'core waveform request (input)', 'gamma'],
      ['relative speed v', res.v, 'c', 'v = √(γ² − 1)/γ (definition)'],
      ['m₁/M, m₂/M', `${fmt(res.m1_over_m, 6)}, ${fmt(res.m2_over_m, 6)}`, '', 'core waveform request (input)'],
      ['impact parameter b', res.b_over_m, 'GM/c²', 'core waveform request (input)', 'b'],
      ['E_rad (closed form)', res.e_rad_closed, 'M c²', S.closed, 'e-rad-closed-table'],
      ['P_rad along x (closed form)', res.p_rad_closed[0], 'M c', S.closed],
    ];
    if (res.detector) {
      w.push(['antenna pattern F₊', res.detector.f_plus, '', S.antenna], ['antenna pattern F×', res.detector.f_cross, '', S.antenna]);
    }
    const physRows = [];
    if (p) {
      const sc = p.scales;
      physRows.push(['GM/c²', sc.mass_length_m, 'm', PH], ['GM/c³ (time unit of u)', sc.mass_time_s, 's', PH], ['b/c', sc.b_over_c_s, 's', PH],
        ['characteristic frequency v/(2πb)', sc.f_char_hz, 'Hz', 'waveform sheet §6 rule of thumb (v ≪ c, see the f_char flag)', 'f-char'],
        ['E_rad (closed form)', p.e_rad_j, 'J', S.closed, 'e-rad-j'], ['E_rad (closed form)', p.e_rad_msun_c2, 'M☉ c²', S.closed]);
      if (phys) {
        physRows.push(['distance D', p.distance_m, 'm', PH], ['strain unit G²m₁m₂/(c⁴Db)', sc.strain_unit, '', 'waveform sheet §6'],
          ['peak |h| at D', p.peak_strain, '', `${S.wave}; ${PH}`, 'peak-strain-table'],
          ['memory Δh₊ at D', p.memory_strain.plus, '', `${S.mem}; ${PH}`], ['memory Δh× at D', p.memory_strain.cross, '', `${S.mem}; ${PH}`]);
      }
    }
    body.replaceChildren(
      el('h3', { text: 'Memory: waveform against Braginsky–Thorne' }), memTable,
      el('div', { class: 'enc-grid' },
        el('div', {}, el('h3', { text: 'Waveform and system' }), rowsTable(['Quantity', 'Value', 'Unit'], w)),
        p ? el('div', {}, el('h3', { text: 'Physical units' }), rowsTable(['Quantity', 'Value', 'Unit'], physRows)) : el('div', {}, el('h3', { text: 'Physical units' }), el('p', { class: 'muted', text: 'Give the masses with a unit (M☉ or kg) for seconds, joules and the strain at a distance.' }))),
      el('p', { class: 'muted', text: 'Leading order: the O(G²) strain of straight-line orbits with their first-order deflection (weak field, any speed). Results are estimates, not a substitute for full simulations.' }),
      el('h3', { text: 'Validity' }), flagTable(res.flags, FLAG_NAME));
  }

  function memRow(label, a, b, r, S) {
    return el('tr', {}, el('td', { text: label }), numCell(a, S.wave), numCell(b, S.mem), numCell(r, 'relative difference of the two columns', { digits: 3 }), el('td', { text: 'GM/c²' }));
  }

  function renderEm(res) {
    const S = { field: src(res, 0), closed: src(res, 1), flux: src(res, 2), mem: src(res, 3) };
    status.replaceChildren(el('span', {}, 'E_rad with interference = ',
      el('span', { class: 'big', 'data-role': 'em-e-rad-flux', 'data-value': exact(res.e_rad_flux), tabindex: '0', 'data-source': S.flux }, fmt(res.e_rad_flux, 8)), ' M c²'));
    cautions.replaceChildren(...cautionItems(res.flags));
    const rows = [
      ['E_rad, body 1 alone (Liénard)', res.e_rad_body1, 'M c²', S.closed, 'em-body1'],
      ['E_rad, body 2 alone (Larmor)', res.e_rad_body2, 'M c²', S.closed, 'em-body2'],
      ['E_rad, sum of the bodies (no interference)', res.e_rad_closed, 'M c²', S.closed, 'em-closed'],
      ['E_rad, flux integral with interference', res.e_rad_flux, 'M c²', S.flux, 'em-flux'],
      ['interference part', res.interference, 'M c²', S.flux],
      ['estimated relative error of the flux integral', res.e_rad_flux_rel_error, '', S.flux],
      ['memory ∫du D·E_θ = −DΔA_θ', res.memory.theta, '√G M', S.mem],
      ['memory ∫du D·E_φ', res.memory.phi, '√G M', S.mem],
      ['transverse impulse on body 1', res.impulse, 'M c', S.mem],
      ['q₁, q₂', `${fmt(res.q1, 6)}, ${fmt(res.q2, 6)}`, '√G M', 'core waveform request (input)'],
      ['relative Lorentz factor γ', res.gamma, '', 'core waveform request (input)'],
      ['impact parameter b', res.b_over_m, 'GM/c²', 'core waveform request (input)'],
    ];
    if (res.physical) {
      const PH = 'E/(M c²) × M c² (CODATA 2018 G, c)';
      rows.push(['E_rad body 1', res.physical.e_rad_body1_j, 'J', `${S.closed}; ${PH}`], ['E_rad body 2', res.physical.e_rad_body2_j, 'J', `${S.closed}; ${PH}`],
        ['E_rad with interference', res.physical.e_rad_flux_j, 'J', `${S.flux}; ${PH}`]);
    }
    body.replaceChildren(
      el('h3', { text: 'Electromagnetic radiation, rest frame of body 2' }), rowsTable(['Quantity', 'Value', 'Unit'], rows),
      el('p', { class: 'muted', text: `Units: ${res.units}.` }),
      el('h3', { text: 'Validity' }), flagTable(res.flags, FLAG_NAME));
  }

  function show(card, fn) {
    try { card.show(fn()); card.fresh(); } catch (e) { card.fail(e && e.message ? e.message : String(e)); }
  }

  function drawPlots(req, grav) {
    for (const c of [strainCard, slowCard, skyCard, specCard]) c.root.hidden = !grav;
    emCard.root.hidden = grav; emSpecCard.root.hidden = grav;
    plotNote.textContent = grav ? '' : 'Electromagnetic: the field, its closed-form spectrum and the energies (the flux integral with interference is in the table); the sky map and the live balance panel are drawn for gravity.';
    if (!grav) {
      show(emCard, () => core.figure(req, 'em_field', {}));
      show(emSpecCard, () => core.figure(req, 'em_spectrum', {}));
      return;
    }
    show(strainCard, () => core.figure(req, 'strain', {}));
    show(slowCard, () => core.figure(req, 'slow_motion', {}));
  }

  // ---- progressive sky work ----
  function stopJob() {
    jobGen += 1;
    if (job) { job.free(); job = null; }
  }

  function startJob(req) {
    stopJob();
    balanceCard.hidden = false;
    try {
      job = new core.RadiationJob(req, skyQ.value);
    } catch (e) {
      progressText.textContent = e && e.message ? e.message : String(e);
      return;
    }
    const gen = jobGen;
    let lastSky = -1;
    let skyDrawn = 0;
    root.dataset.skyDone = 'false';
    show(specCard, () => job.spectrum_figure());
    show(skyCard, () => job.sky_figure(proj.value));
    const tick = () => {
      if (gen !== jobGen || !job) return;
      let snap;
      try {
        snap = job.step(STEP_MS);
      } catch (e) {
        progressText.textContent = e && e.message ? e.message : String(e);
        return;
      }
      renderBalance(snap);
      const now = performance.now();
      // Redraw the map as rows arrive, at most ~8 times a second, and once when it completes.
      if (snap.map_fraction !== lastSky && (snap.map_fraction === 1 || now - skyDrawn > 120)) {
        lastSky = snap.map_fraction; skyDrawn = now;
        show(skyCard, () => job.sky_figure(proj.value));
      }
      if (snap.done) {
        show(specCard, () => job.spectrum_figure());
        root.dataset.skyDone = 'true';
        return;
      }
      requestAnimationFrame(tick);
    };
    requestAnimationFrame(tick);
  }

  function renderBalance(s) {
    lastSnap = s;
    const pct = Math.round(1000 * s.fraction) / 10;
    bar.style.width = `${pct}%`;
    progress.setAttribute('aria-valuenow', String(pct));
    progress.dataset.phase = s.phase;
    progress.dataset.fraction = String(s.fraction);
    progressText.textContent = s.done ? `All sky integrals done (${s.cells_total} directions).` : `Computing ${PHASE_TEXT[s.phase]} … ${pct}% of ${s.cells_total} directions`;
    const complete = s.e_rad_rel_diff !== null;
    const partial = complete ? '' : ' (partial)';
    const row = (label, a, b, r, unit, roles) => el('tr', {}, el('td', { text: label }),
      numCell(a, JOB_SRC.flux, { role: roles[0] }), numCell(b, JOB_SRC.closed, { role: roles[1] }),
      numCell(r, roles[2] === 'e-rad-rel' ? JOB_SRC.rel : JOB_SRC.prel, { role: roles[2], digits: 3 }), el('td', { text: unit }));
    const rows = [
      row(`E_rad${partial}`, s.e_rad_flux, s.e_rad_closed, s.e_rad_rel_diff, 'M c²', ['e-rad-flux', 'e-rad-closed', 'e-rad-rel']),
      row(`P_rad x${partial}`, s.p_rad_flux[0], s.p_rad_closed[0], s.p_rad_rel_diff, 'M c', ['p-rad-flux-x', 'p-rad-closed-x', 'p-rad-rel']),
      row(`P_rad y${partial}`, s.p_rad_flux[1], s.p_rad_closed[1], null, 'M c', ['p-rad-flux-y', '', '']),
    ];
    if (s.e_rad_closed_j !== null) {
      rows.push(el('tr', {}, el('td', { text: `E_rad${partial}` }), numCell(s.e_rad_flux_j, `${JOB_SRC.flux}; ${JOB_SRC.joule}`, { role: 'e-rad-flux-j' }),
        numCell(s.e_rad_closed_j, `${JOB_SRC.closed}; ${JOB_SRC.joule}`), el('td', {}), el('td', { text: 'J' })));
    }
    balanceBody.replaceChildren(...rows);
    balanceCard.dataset.complete = String(complete);
  }

  // ---- exports ----
  jsonBtn.addEventListener('click', () => {
    if (lastGood) download('chiwave-radiation.json', JSON.stringify({ request: lastGood.request, result: lastGood.result, energy_balance: lastSnap }, null, 2), 'application/json');
  });
  csvBtn.addEventListener('click', () => {
    if (!lastGood) return;
    const r = lastGood.result;
    const phys = r.physical;
    const em = r.force === 'em';
    const head = ['u_gm', ...(phys ? ['u_s'] : []), ...(em ? ['e_theta', 'e_phi'] : ['h_plus', 'h_cross'])];
    if (!em && phys && phys.h_plus) head.push('strain_plus', 'strain_cross');
    if (!em && r.detector) head.push('detector_h');
    const rows = [head];
    for (let i = 0; i < r.u.length; i++) {
      const row = [r.u[i]];
      if (phys) row.push(phys.u_s[i]);
      if (em) row.push(r.e_theta[i], r.e_phi[i]); else row.push(r.h_plus[i], r.h_cross[i]);
      if (!em && phys && phys.h_plus) row.push(phys.h_plus[i], phys.h_cross[i]);
      if (!em && r.detector) row.push(r.detector.h[i]);
      rows.push(row.map(exact));
    }
    download('chiwave-radiation.csv', csv(rows), 'text/csv');
  });

  load({ m1: '12 Msun', m2: '7 Msun', v: 0.3, b: 600, theta: 60, phi: 30, angle_unit: 'deg', frame: 'cm', distance: '100 Mpc', u_min: -8, u_max: 8, u_unit: 'b_over_v', samples: 1200 });
  return {
    id: ID, title: 'Radiation', kind: 'waveform', root,
    load(request) { load(request); recompute(); },
    recompute,
    request() { const r = read(); return r.request || null; },
    get last() { return lastGood; },
    get balance() { return lastSnap; },
  };
}
