// Light deflection view: exact α, each weak-field partial sum with its error, the
// strong-deflection value, PPN, SI values and regime flags. Keys are the core's LightResult.
import { el, fmt } from '../util.js';
import { quantity, number, choice, group } from '../inputs.js';
import { QUANTITY_COLUMNS, qrow, bestHeadline } from '../table.js';

const MASS_UNITS = [['geometric', 'geometric (M = 1)', { omit: true, aliases: [''] }], ['Msun', 'M☉ (Msun)'], ['kg', 'kg'], ['Mearth', 'M⊕ (Mearth)'], ['Mjup', 'M♃ (Mjup)']];
const LENGTH_UNITS = [['M', 'M (GM/c²)', { aliases: [''] }], ['m', 'm'], ['km', 'km'], ['Rsun', 'R☉ (Rsun)'], ['Rearth', 'R⊕ (Rearth)'], ['Rjup', 'R♃ (Rjup)'], ['au', 'au']];
const SHORT_LENGTH_UNITS = [['m', 'm'], ['cm', 'cm'], ['km', 'km'], ['M', 'M (GM/c²)', { aliases: [''] }]];
const ORDERS = Array.from({ length: 12 }, (_, i) => [String(i + 1), String(i + 1)]);
const METRIC = { schwarzschild: 'Schwarzschild', kerr: 'Kerr (equatorial)', 'reissner-nordstrom': 'Reissner–Nordström' };

function body({ result: r, A, au, src, tol }) {
  const E = r.estimates || {};
  const rows = [{ section: `Deflection angle α — ${METRIC[r.metric] || r.metric} lens` }];
  const row = (...a) => rows.push(qrow(...a));
  row('alpha', 'exact α', r.captured ? 'captured' : A(r.alpha), r.captured ? '' : au, src('alpha'), E.alpha, tol);
  for (const t of r.series || []) row(`series_${t.order}`, `weak-field series to order ${t.order}`, A(t.alpha), au, src('series'), t, tol);
  const sd = r.strong_deflection;
  const sdE = E['strong_deflection.alpha'];
  if (sd) {
    row('strong_deflection', 'strong-deflection limit (log form)', A(sd.alpha), au, src('strong_deflection'), sdE, tol);
    row('strong_deflection_next', 'strong-deflection limit, next order', A(sd.alpha_next_order), au, src('strong_deflection'), E['strong_deflection.alpha_next_order'], tol);
  } else if (sdE && !r.captured) {
    // Not reported here: the row says why (the core's reason), no number.
    row('strong_deflection', 'strong-deflection limit (log form)', 'not reported', '', src('strong_deflection'), sdE, tol);
  }
  if (r.ppn) {
    rows.push({ section: 'PPN (first order)' });
    row('ppn_alpha_1pm', `[(1 + γ)/2]·4M/b, γ = ${fmt(r.ppn.gamma)}`, A(r.ppn.alpha_1pm), au, src('ppn'), E['ppn.alpha_1pm'], tol);
    row('ppn_alpha_1pm_gr', 'general relativity 4M/b', A(r.ppn.alpha_1pm_gr), au, src('ppn'), E['ppn.alpha_1pm_gr'], tol);
    if (r.ppn.alpha_elongation !== undefined) row('ppn_alpha_elongation', `at elongation ${fmt(r.ppn.elongation_deg)}°`, A(r.ppn.alpha_elongation), au, src('ppn'), E['ppn.alpha_elongation'], tol);
  }
  rows.push({ section: 'Geometry (units of M = GM/c²)' });
  row('impact_parameter', 'impact parameter b', r.impact_parameter, 'M', 'your input, converted to units of GM/c²');
  row('critical_b', 'critical impact parameter b_c', r.critical_b, 'M', src('critical_b'));
  row('closest_approach', 'closest approach r₀', r.captured ? 'none (captured)' : r.closest_approach, r.captured ? '' : 'M', src('closest_approach'));
  const p = r.physical;
  if (p) {
    rows.push({ section: 'Physical units' });
    const s = src('physical');
    row('mass_msun', 'lens mass', p.mass_msun, 'M☉', s);
    row('mass_kg', 'lens mass', p.mass_kg, 'kg', s);
    row('gm_over_c2_m', 'GM/c²', p.gm_over_c2_m, 'm', s);
    row('b_m', 'impact parameter b', p.b_m, 'm', s);
    row('critical_b_m', 'critical impact parameter b_c', p.critical_b_m, 'm', s);
    if (p.closest_approach_m !== null && p.closest_approach_m !== undefined) row('closest_approach_m', 'closest approach r₀', p.closest_approach_m, 'm', s);
    if (p.wavelength_m !== undefined) row('wavelength_m', 'wavelength', p.wavelength_m, 'm', s);
  }
  return [{ role: 'results', columns: QUANTITY_COLUMNS, rows }];
}

function headline({ result: r, A, au, src, tol }) {
  if (r.captured) {
    return el('span', {}, el('span', { class: 'badge captured', 'data-role': 'captured', text: 'captured' }),
      ` The ray falls into the hole: b = ${fmt(r.impact_parameter, 6)} M ≤ b_c = ${fmt(r.critical_b, 6)} M. Capture is a result: there is no deflection angle.`,
      bestHeadline(r.best, { tol }));
  }
  return el('span', {}, bestHeadline(r.best, { name: 'exact α', shown: fmt(A(r.best.value), 10), unit: au, tol, source: src('alpha') }),
    el('span', { class: 'muted' }, `(b = ${fmt(r.impact_parameter, 6)} M, r₀ = ${fmt(r.closest_approach, 6)} M)`));
}

export const lightView = {
  id: 'light',
  title: 'Light deflection',
  kind: 'light',
  angles: 'rad',
  digits: 9,
  inputs: [
    quantity('mass', 'Lens mass', MASS_UNITS, { value: '1', unit: 'geometric' }),
    quantity('b', 'Impact parameter b', LENGTH_UNITS, { value: '10', unit: 'M' }),
    group('Lens', [
      number('spin', 'Spin a/M', { hint: '(signed, + prograde)', value: '0', optional: true }),
      number('charge', 'Charge Q/M', { hint: '(geometrised Gaussian)', value: '0', optional: true }),
      number('ppn_gamma', 'PPN γ', { hint: '(1 = general relativity)', value: '1', optional: true }),
    ]),
    group('Series', [choice('orders', 'Weak-field series orders', ORDERS, { value: '8', integer: true })]),
    group('Optional: optics checks', [
      quantity('wavelength', 'Wavelength', SHORT_LENGTH_UNITS, { hint: '(optional)', value: '', unit: 'm', optional: true }),
      quantity('beam_width', 'Beam width', LENGTH_UNITS, { hint: '(optional)', value: '', unit: 'km', optional: true }),
      number('elongation_deg', 'Solar elongation φ', { hint: '(degrees, optional)', value: '', optional: true }),
    ]),
  ],
  headline,
  body,
  figures: [
    { stem: 'alpha-b', name: 'alpha_b', title: 'Deflection α against impact parameter b' },
    { stem: 'rays', name: 'rays', title: 'Rays in the lens plane' },
  ],
};
