// Waveform & radiation view: the leading-order waveform at a detector (gravity or
// electromagnetism), its memory, spectrum, sky map and the live energy balance. The inputs are
// declared for the view machinery; the layout reads the core's results: every number comes from the
// core (wasm evaluate, figure and the progressive waveform job, through core.js) and carries its
// source on hover/focus. No physics here.
import { el, fmt, exact } from '../util.js';
import { quantity, number, choice, check, group, field, control, note } from '../inputs.js';
import { num, col, valueTable, renderTable, bestHeadline } from '../table.js';
import { startWaveformJob, waveformSource, bOverGm, convertAngle } from '../core.js';

const ID = 'waveform';
const MASS_UNITS = [['Msun', 'M☉'], ['kg', 'kg'], ['', 'geometric']];
const SPEED_UNITS = [['gamma', 'γ (Lorentz factor)', { key: 'gamma', number: true }], ['c', 'fraction of c', { key: 'v', number: true }], ['km/s', 'km/s', { key: 'v' }]];
const B_UNITS = [['', 'GM/c²', { aliases: ['M'] }], ['km', 'km'], ['Rsun', 'R☉'], ['au', 'au'], ['pc', 'pc']];
const DIST_UNITS = [['Mpc', 'Mpc'], ['Gpc', 'Gpc'], ['kpc', 'kpc'], ['pc', 'pc'], ['au', 'au']];
const WINDOW_UNITS = [['b_over_v', '× b/v (crossing time)'], ['gm', '× GM/c³'], ['s', 's']];
const CHARGE_UNITS = [['', 'geometric (√G M)'], ['e', 'e'], ['C', 'C'], ['statC', 'statC']];
const PHASE_TEXT = {
  balance: 'energy balance: flux integral over u and the sphere',
  sky_map: 'sky map',
  spectrum: 'spectrum dE/dω over the sphere',
  done: 'done',
};
const JOB_SRC = {
  flux: 'core waveform job, balance phase: flux integral (1/16π)∫dΩ∫du D²(ḣ₊² + ḣ×²)(1, n) on the sky rule SkyOptions::for_gamma; same sum as the CLI’s e_rad_flux',
  closed: 'Herrmann, Parra-Martinez, Ruf & Zeng 2021, arXiv:2101.07255: P^μ = (G³m₁²m₂²/b³)(u₁ + u₂)^μ E(γ)/(γ + 1)',
  rel: 'core waveform::RadiationSnapshot: |E_flux − E_closed|/E_closed',
  prel: 'core waveform::RadiationSnapshot: |P_flux − P_closed|/E_closed (P ∝ u₁ + u₂; measured against the energy because P can vanish in the CM frame)',
  joule: 'E/(M c²) × M c² with CODATA 2018 G, c and IAU 2015 M☉ (core waveform request, physical.mc2_j)',
};
const PH = 'core waveform request: strain = (D·h/(GM/c²)) × (GM/c²)/D, time = u × GM/c³ (CODATA 2018 G, c; IAU 2015 M☉)';

const gravState = (s) => s.force !== 'em';
const gravity = (c) => c.request.force !== 'em';
const em = (c) => c.request.force === 'em';

/** A loaded request's angle (in its angle_unit, radians by default) in degrees, as input text. */
const degrees = (pick) => (r) => {
  const x = pick(r);
  if (x === undefined || x === null) return undefined;
  return String(Number(convertAngle(x, r.angle_unit || 'rad', 'deg').toPrecision(12)));
};
const detectorAngle = (k, absent) => degrees((r) => (r.detector ? (r.detector[k] ?? absent) : undefined));

function headline({ request, result: res, tol }) {
  if (request.force === 'em') {
    const b = res.best_e_rad;
    const S = waveformSource(res, 'em', b.key === 'e_rad_flux' ? 'flux' : 'closed_form');
    return el('span', {}, bestHeadline(b, { name: b.key === 'e_rad_flux' ? 'E_rad with interference' : 'E_rad (no interference)', shown: fmt(b.value, 8), unit: 'M c²', tol, source: S, role: 'best-e-rad', valueRole: 'em-e-rad-flux' }),
      bestHeadline(res.best, { name: 'peak D·|E|', shown: fmt(res.best.value, 6), unit: 'c²/√G', tol, source: waveformSource(res, 'em', 'field') }));
  }
  const S = (n) => waveformSource(res, 'gravity', n);
  const p = res.physical;
  const phys = p && p.distance_m !== null && p.distance_m !== undefined;
  // The relative estimate holds for the strain at D too (the same number times GM/(c²D)).
  const peak = phys
    ? bestHeadline(res.best, { name: 'peak |h| at D', shown: fmt(p.peak_strain, 4), tol, source: `${S('waveform')}; ${PH}`, valueRole: 'peak-strain', value: p.peak_strain })
    : bestHeadline(res.best, { name: 'peak D·|h|', shown: fmt(res.best.value, 5), unit: 'GM/c²', tol, source: S('waveform'), valueRole: 'peak-strain' });
  const e = p
    ? bestHeadline(res.best_e_rad, { name: 'E_rad', shown: fmt(p.e_rad_j, 4), unit: 'J', tol, source: S('closed_form'), role: 'best-e-rad', valueRole: 'e-rad-headline', value: p.e_rad_j })
    : bestHeadline(res.best_e_rad, { name: 'E_rad', shown: fmt(res.best_e_rad.value, 5), unit: 'M c²', tol, source: S('closed_form'), role: 'best-e-rad', valueRole: 'e-rad-headline' });
  return el('span', {}, peak, e);
}

function gravityBody(res, tol) {
  const S = (n) => waveformSource(res, 'gravity', n);
  const E = res.estimates || {};
  const p = res.physical;
  const phys = p && p.distance_m !== null && p.distance_m !== undefined;
  const frameName = res.frame === 'cm' ? 'centre-of-mass frame' : 'rest frame of body 2';
  const rel = (a, b) => (b === 0 ? null : Math.abs(a - b) / Math.abs(b)); // display of an agreement, not physics
  const mem = (label, key, a, b) => ({ cells: [label, num(a, S('waveform'), { key: `memory-${key}` }), num(b, S('memory'), { key: `memory-bt-${key}` }),
    num(rel(a, b), 'relative difference of the two columns', { digits: 3 }), 'GM/c²'] });
  const memory = {
    role: 'memory', title: 'Memory: waveform against Braginsky–Thorne', cls: 'enc mem',
    columns: [col.label('Quantity'), col.value('From the waveform'), col.value('Braginsky–Thorne'), col.rel('Rel. difference'), col.unit()],
    rows: [{ section: `At the observer, ${frameName} (D·h in units of GM/c²)` },
      mem('memory Δh₊ (late − early)', 'plus', res.memory.plus, res.memory_braginsky_thorne.plus),
      mem('memory Δh×', 'cross', res.memory.cross, res.memory_braginsky_thorne.cross)],
  };
  // The 7th item names the row's error estimate (the core's; relative, so the SI rows share it).
  const w = [
    ['peak D·|h| over the samples', res.peak_abs_h, 'GM/c²', S('waveform'), 'peak-geometric', undefined, 'peak_abs_h'],
    ['constant O(G) piece h₊ (not plotted)', res.constant_piece.plus, 'GM/c²', `${S('waveform')}; u-independent field of the incoming bodies, not Lorentz-covariant`],
    ['constant O(G) piece h×', res.constant_piece.cross, 'GM/c²', `${S('waveform')}; u-independent field of the incoming bodies`],
    ['relative Lorentz factor γ', res.gamma, '', 'core waveform request (input)', 'gamma'],
    ['relative speed v', res.v, 'c', 'v = √(γ² − 1)/γ (definition)'],
    ['m₁/M, m₂/M', `${fmt(res.m1_over_m, 6)}, ${fmt(res.m2_over_m, 6)}`, '', 'core waveform request (input)'],
    ['impact parameter b', bOverGm(res), 'GM/c²', 'core waveform request (input)', 'b'],
    ['E_rad (closed form)', res.e_rad_closed, 'M c²', S('closed_form'), 'e-rad-closed-table', undefined, 'e_rad_closed'],
    ['P_rad along x (closed form)', res.p_rad_closed[0], 'M c', S('closed_form')],
  ];
  if (res.detector) w.push(['antenna pattern F₊', res.detector.f_plus, '', S('antenna')], ['antenna pattern F×', res.detector.f_cross, '', S('antenna')]);
  let physical;
  if (p) {
    const sc = p.scales;
    const rows = [['GM/c²', sc.mass_length_m, 'm', PH], ['GM/c³ (time unit of u)', sc.mass_time_s, 's', PH], ['b/c', sc.b_over_c_s, 's', PH],
      ['characteristic frequency v/(2πb)', sc.f_char_hz, 'Hz', 'rule of thumb f ≈ v/(2πb) for v ≪ c (see the f_char_rule check)', 'f-char'],
      ['E_rad (closed form)', p.e_rad_j, 'J', S('closed_form'), 'e-rad-j', undefined, 'e_rad_closed'], ['E_rad (closed form)', p.e_rad_msun_c2, 'M☉ c²', S('closed_form'), undefined, undefined, 'e_rad_closed']];
    if (phys) {
      rows.push(['distance D', p.distance_m, 'm', PH], ['strain unit G²m₁m₂/(c⁴Db)', sc.strain_unit, '', `definition (${PH})`],
        ['peak |h| at D', p.peak_strain, '', `${S('waveform')}; ${PH}`, 'peak-strain-table', undefined, 'peak_abs_h'],
        ['memory Δh₊ at D', p.memory_strain.plus, '', `${S('memory')}; ${PH}`], ['memory Δh× at D', p.memory_strain.cross, '', `${S('memory')}; ${PH}`]);
    }
    physical = valueTable('physical', 'Physical units', rows, { estimates: E, tol });
  } else physical = { title: 'Physical units', note: 'Give the masses with a unit (M☉ or kg) for seconds, joules and the strain at a distance.' };
  return [
    memory,
    { grid: [[valueTable('waveform', 'Waveform and system', w, { estimates: E, tol })], [physical]] },
    { note: 'Leading order: the O(G²) strain of straight-line orbits with their first-order deflection (weak field, any speed; its error grows with the deflection angle). Results are estimates, not a substitute for full simulations.' },
  ];
}

function emBody(res, tol) {
  const S = (n) => waveformSource(res, 'em', n);
  const E = res.estimates || {};
  const rows = [
    ['peak D·|E| over the samples', res.peak_abs_e, 'c²/√G', S('field'), 'em-peak', undefined, 'peak_abs_e'],
    ['E_rad, body 1 alone (Liénard)', res.e_rad_body1, 'M c²', S('closed_form'), 'em-body1'],
    ['E_rad, body 2 alone (Larmor)', res.e_rad_body2, 'M c²', S('closed_form'), 'em-body2'],
    ['E_rad, sum of the bodies (no interference)', res.e_rad_closed, 'M c²', S('closed_form'), 'em-closed', undefined, 'e_rad_closed'],
    ['E_rad, flux integral with interference', res.e_rad_flux, 'M c²', S('flux'), 'em-flux', undefined, 'e_rad_flux'],
    ['interference part', res.interference, 'M c²', S('flux')],
    ['estimated relative error of the flux integral', res.e_rad_flux_rel_error, '', S('flux')],
    ['memory ∫du D·E_θ = −DΔA_θ', res.memory.theta, '√G M', S('memory')],
    ['memory ∫du D·E_φ', res.memory.phi, '√G M', S('memory')],
    ['transverse impulse on body 1', res.impulse, 'M c', S('memory')],
    ['q₁, q₂', `${fmt(res.q1, 6)}, ${fmt(res.q2, 6)}`, '√G M', 'core waveform request (input)'],
    ['relative Lorentz factor γ', res.gamma, '', 'core waveform request (input)'],
    ['impact parameter b', bOverGm(res), 'GM/c²', 'core waveform request (input)'],
  ];
  if (res.physical) {
    const ph = 'E/(M c²) × M c² (CODATA 2018 G, c)';
    rows.push(['E_rad body 1', res.physical.e_rad_body1_j, 'J', `${S('closed_form')}; ${ph}`], ['E_rad body 2', res.physical.e_rad_body2_j, 'J', `${S('closed_form')}; ${ph}`],
      ['E_rad with interference', res.physical.e_rad_flux_j, 'J', `${S('flux')}; ${ph}`]);
  }
  return [valueTable('em', 'Electromagnetic radiation, rest frame of body 2', rows, { estimates: E, tol }), { note: `Units: ${res.units}.` }];
}

/** The live energy balance: the flux integral of the progressive job against the closed form. */
function balanceCard() {
  const bar = el('div', { class: 'progress-fill' });
  const progress = el('div', { class: 'progress', role: 'progressbar', 'aria-valuemin': '0', 'aria-valuemax': '100', 'aria-valuenow': '0', 'aria-label': 'Sky integrals', 'data-role': 'sky-progress' }, bar);
  const progressText = el('p', { class: 'muted progress-text', 'aria-live': 'polite' });
  const table = el('div');
  const root = el('section', { class: 'card balance', 'aria-labelledby': `${ID}-bal-h`, 'data-role': 'balance' },
    el('h2', { id: `${ID}-bal-h` }, 'Energy balance ', el('span', { class: 'sub', text: '(flux integral of this waveform against the closed form)' })),
    progress, progressText, table,
    el('p', { class: 'muted', text: 'The flux integral runs over the retarded time and the whole sphere a few directions per frame, so the page stays responsive; it restarts when an input changes. Agreement to ~1e-10 is the check of the whole waveform.' }));
  let snapshot = null;

  function show(s) {
    snapshot = s;
    const pct = Math.round(1000 * s.fraction) / 10;
    bar.style.width = `${pct}%`;
    progress.setAttribute('aria-valuenow', String(pct));
    progress.dataset.phase = s.phase;
    progress.dataset.fraction = String(s.fraction);
    progressText.textContent = s.done ? `All sky integrals done (${s.cells_total} directions).` : `Computing ${PHASE_TEXT[s.phase]} … ${pct}% of ${s.cells_total} directions`;
    const complete = s.e_rad_rel_diff !== null;
    const partial = complete ? '' : ' (partial)';
    const row = (label, a, b, r, unit, keys, relSrc) => ({ cells: [label, num(a, JOB_SRC.flux, { key: keys[0] }), num(b, JOB_SRC.closed, { key: keys[1] }),
      num(r, relSrc, { key: keys[2], digits: 3 }), unit] });
    const rows = [
      row(`E_rad${partial}`, s.e_rad_flux, s.e_rad_closed, s.e_rad_rel_diff, 'M c²', ['e-rad-flux', 'e-rad-closed', 'e-rad-rel'], JOB_SRC.rel),
      row(`P_rad x${partial}`, s.p_rad_flux[0], s.p_rad_closed[0], s.p_rad_rel_diff, 'M c', ['p-rad-flux-x', 'p-rad-closed-x', 'p-rad-rel'], JOB_SRC.prel),
      row(`P_rad y${partial}`, s.p_rad_flux[1], s.p_rad_closed[1], null, 'M c', ['p-rad-flux-y'], JOB_SRC.prel),
    ];
    if (s.e_rad_closed_j !== null) {
      rows.push({ cells: [`E_rad${partial}`, num(s.e_rad_flux_j, `${JOB_SRC.flux}; ${JOB_SRC.joule}`, { key: 'e-rad-flux-j' }),
        num(s.e_rad_closed_j, `${JOB_SRC.closed}; ${JOB_SRC.joule}`), '', 'J'] });
    }
    table.replaceChildren(renderTable({ role: 'balance-rows', cls: 'enc balance-table', sources: false, rows,
      columns: [col.label('Quantity'), col.value('Flux integral'), col.value('Closed form'), col.rel('Rel. difference'), col.unit()] }));
    root.dataset.complete = String(complete);
  }

  return {
    root,
    stale: true,
    render(ctx) { root.hidden = em(ctx); },
    show,
    message(text) { progressText.textContent = text; },
    get snapshot() { return snapshot; },
  };
}

/** The progressive sky work (energy balance, sky map, dE/dω over the sphere) of a gravitational
 *  request: one core job, stepped by the machinery once per animation frame. */
const work = {
  key: (c) => (gravity(c) ? JSON.stringify([c.request, c.values.sky]) : null),
  start(c, kit) {
    const balance = kit.card('balance');
    let job;
    try {
      job = startWaveformJob(c.request, c.values.sky);
    } catch (e) {
      balance.message(e && e.message ? e.message : String(e));
      return null;
    }
    const sky = kit.figure('sky');
    const spectrum = kit.figure('spectrum');
    let projection = c.values.projection;
    let lastFraction = -1;
    let drawnAt = 0;
    const drawSky = () => sky.draw(() => job.sky_figure(projection));
    balance.show(job.snapshot()); // the new job's progress at once, not the last job's
    spectrum.draw(() => job.spectrum_figure());
    drawSky();
    return {
      step(budgetMs) {
        const snap = job.step(budgetMs);
        balance.show(snap);
        // Redraw the map as rows arrive, at most ~8 times a second, and once when it completes.
        const now = performance.now();
        if (snap.map_fraction !== lastFraction && (snap.map_fraction === 1 || now - drawnAt > 120)) {
          lastFraction = snap.map_fraction;
          drawnAt = now;
          drawSky();
        }
        if (snap.done) spectrum.draw(() => job.spectrum_figure());
        return snap.done;
      },
      // A new projection redraws the map there is; the sums go on.
      refresh(next) {
        if (next.values.projection === projection) return;
        projection = next.values.projection;
        drawSky();
      },
      fail: (msg) => balance.message(msg),
      stop: () => job.free(),
    };
  },
};

/** The waveform arrays as CSV (time, h₊, h× or E_θ, E_φ; seconds and strain with physical units). */
function arraysCsv({ request, result: r }) {
  const phys = r.physical;
  const isEm = request.force === 'em';
  const head = ['u_gm', ...(phys ? ['u_s'] : []), ...(isEm ? ['e_theta', 'e_phi'] : ['h_plus', 'h_cross'])];
  if (!isEm && phys && phys.h_plus) head.push('strain_plus', 'strain_cross');
  if (!isEm && r.detector) head.push('detector_h');
  const rows = [head];
  for (let i = 0; i < r.u.length; i++) {
    const row = [r.u[i]];
    if (phys) row.push(phys.u_s[i]);
    if (isEm) row.push(r.e_theta[i], r.e_phi[i]); else row.push(r.h_plus[i], r.h_cross[i]);
    if (!isEm && phys && phys.h_plus) row.push(phys.h_plus[i], phys.h_cross[i]);
    if (!isEm && r.detector) row.push(r.detector.h[i]);
    rows.push(row.map(exact));
  }
  return rows;
}

export const waveformView = {
  id: ID,
  aliases: ['radiation'],
  title: 'Waveform & radiation',
  kind: 'waveform',
  constants: { angle_unit: 'deg' },
  inputs: [
    choice('force', 'Interaction', [['gravity', 'gravity'], ['em', 'electromagnetic (Gaussian)']]),
    group('Bodies and orbit', [
      quantity('m1', 'Mass m₁ (incoming)', MASS_UNITS, { value: '12', unit: 'Msun', unitAria: 'Mass m₁ unit' }),
      quantity('m2', 'Mass m₂ (initially at rest in frame A)', MASS_UNITS, { value: '7', unit: 'Msun', unitAria: 'Mass m₂ unit' }),
      quantity('speed', 'Relative speed at infinity', SPEED_UNITS, { hint: '(γ, v/c or km/s)', value: '0.3', unit: 'c', req: 'gamma', unitAria: 'Speed unit' }),
      quantity('b', 'Impact parameter b', B_UNITS, { value: '600', unit: '', unitAria: 'Impact parameter unit' }),
    ]),
    group('Observer', [
      number('theta', 'Observer polar angle θ', { hint: '(deg, from the orbital normal +z)', value: '60', fromRequest: degrees((r) => r.theta) }),
      number('phi', 'Observer azimuth φ', { hint: '(deg, from +x, body 1’s incoming direction)', value: '30', fromRequest: degrees((r) => r.phi) }),
      group(null, [
        choice('frame', 'Frame', [['rest2', 'rest frame of body 2'], ['cm', 'centre-of-mass frame']], { value: 'cm', absent: 'rest2' }),
        quantity('distance', 'Distance D to the observer', DIST_UNITS, { hint: '(empty: D·h only)', value: '100', unit: 'Mpc', optional: true, unitAria: 'Distance unit' }),
        check('detector', 'Interferometer response', 'F₊h₊ + F×h× for arms along the detector’s x and y', { fromRequest: (r) => String(!!r.detector) }),
        group(null, [
          number('det_theta', 'Source polar angle in the detector frame', { hint: '(deg)', value: '40', req: 'detector.theta', fromRequest: detectorAngle('theta') }),
          number('det_phi', 'Source azimuth in the detector frame', { hint: '(deg)', value: '110', req: 'detector.phi', fromRequest: detectorAngle('phi') }),
          number('det_psi', 'Polarisation angle ψ', { hint: '(deg)', value: '20', req: 'detector.psi', fromRequest: detectorAngle('psi', 0) }),
        ], { role: 'detector-angles', show: (s) => s.detector === 'true' }),
      ], { role: 'gravity', show: gravState }),
    ]),
    group('Time samples', [
      field('u_min', 'Time window from, to', [
        control.number('u_min', { value: '-8', aria: 'Window start' }),
        control.number('u_max', { value: '8', aria: 'Window end' }),
        control.select('u_unit', WINDOW_UNITS, { value: 'b_over_v', absent: 'gm', aria: 'Window unit' }),
      ], { hint: '(closest approach at u = 0)' }),
      number('samples', 'Samples', { hint: '(2 … 100000)', value: '1200', integer: true, absent: '1000' }),
    ]),
    group('Charges (electromagnetic)', [
      quantity('q1', 'Charge q₁', CHARGE_UNITS, { value: '0.1', unit: '' }),
      quantity('q2', 'Charge q₂', CHARGE_UNITS, { value: '-0.1', unit: '' }),
    ], { role: 'charges', show: (s) => s.force === 'em' }),
    group('Sky map', [
      choice('sky', 'Sky map shows', [['energy', 'radiated energy dE/dΩ'], ['memory', 'memory |DΔh|']], { req: false }),
      choice('projection', 'Sky map projection', [['cylindrical', 'cylindrical (φ, elevation)'], ['equal_area', 'equal-area (φ, cos θ)']], { req: false }),
    ], { role: 'sky', show: gravState }),
    note('Axes: body 2 initially at rest at the origin, body 1 incoming along +x, b along +y, z normal to the orbital plane; '
      + 'observer n = (sin θ cos φ, sin θ sin φ, cos θ), polarisation basis e_θ, e_φ; u = t − D, closest approach of the undeflected paths at u = 0. '
      + 'A bare b is in GM/c² with M = m₁ + m₂.'),
  ],
  // The gravitational sky integrals run progressively (the job), not in the evaluation.
  resultRequest: (req) => (req.force === 'em' ? req : { ...req, energy_flux: false }),
  headline,
  body: (c) => (em(c) ? emBody(c.result, c.tol) : gravityBody(c.result, c.tol)),
  figures: [
    { stem: 'strain', name: 'strain', title: 'Strain h₊, h× against time', when: gravity },
    { stem: 'sky', title: 'Sky map', when: gravity, work: true },
    { stem: 'spectrum', title: 'Spectrum', when: gravity, work: true },
    { stem: 'slow', name: 'slow_motion', title: 'Slow-motion check: quadrupole waveform of the Newtonian hyperbola', when: gravity },
    { stem: 'em', name: 'em_field', title: 'Radiation field E_θ, E_φ against time', when: em },
    { stem: 'em-spectrum', name: 'em_spectrum', title: 'Electromagnetic spectrum', when: em },
  ],
  figureNote: (c) => (em(c) ? 'Electromagnetic: the field, its closed-form spectrum and the energies (the flux integral with interference is in the table); the sky map and the live balance panel are drawn for gravity.' : ''),
  cards: [{ id: 'balance', place: 'results', make: balanceCard }],
  work,
  csv: arraysCsv,
  csvTitle: 'Download the waveform arrays (time, h₊, h× or E_θ, E_φ) as CSV',
  json: (last, kit) => ({ energy_balance: kit.card('balance').snapshot }),
  jsonTitle: 'Download the request, the full result and the energy balance as JSON',
};

