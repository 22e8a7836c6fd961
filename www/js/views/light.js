// Light deflection view: exact α, each weak-field partial sum with its error, the
// strong-deflection value, PPN, SI values and regime flags. Keys are the core's LightResult.
import { el, fmt } from '../util.js';
import { angle, angleLabel, sourceOf } from '../viewkit.js';

const MASS_UNITS = [['geometric', 'geometric (M = 1)'], ['Msun', 'M☉ (Msun)'], ['kg', 'kg'], ['Mearth', 'M⊕ (Mearth)'], ['Mjup', 'M♃ (Mjup)']];
const LENGTH_UNITS = [['M', 'M (GM/c²)'], ['m', 'm'], ['km', 'km'], ['Rsun', 'R☉ (Rsun)'], ['Rearth', 'R⊕ (Rearth)'], ['Rjup', 'R♃ (Rjup)'], ['au', 'au']];
const SHORT_LENGTH_UNITS = [['m', 'm'], ['cm', 'cm'], ['km', 'km'], ['M', 'M (GM/c²)']];
const ORDERS = Array.from({ length: 12 }, (_, i) => [String(i + 1), String(i + 1)]);
const METRIC = { schwarzschild: 'Schwarzschild', kerr: 'Kerr (equatorial)', 'reissner-nordstrom': 'Reissner–Nordström' };

function rows(r, { angleUnit }) {
  const u = angleLabel(angleUnit);
  const s = (k) => sourceOf(r, k);
  const out = [{ section: `Deflection angle α — ${METRIC[r.metric] || r.metric} lens` }];
  out.push({ key: 'alpha', label: 'exact α', value: r.captured ? 'captured' : angle(r.alpha, angleUnit), unit: r.captured ? '' : u, source: s('alpha') });
  for (const t of r.series || []) {
    out.push({ key: `series_${t.order}`, label: `weak-field series to order ${t.order}`, value: angle(t.alpha, angleUnit), unit: u, rel: t.rel_error, source: s('series') });
  }
  const sd = r.strong_deflection;
  if (sd) {
    out.push({ key: 'strong_deflection', label: 'strong-deflection limit (log form)', value: angle(sd.alpha, angleUnit), unit: u, rel: sd.rel_error, source: s('strong_deflection') });
    out.push({ key: 'strong_deflection_next', label: 'strong-deflection limit, next order', value: angle(sd.alpha_next_order, angleUnit), unit: u, rel: sd.rel_error_next_order, source: s('strong_deflection') });
  }
  if (r.ppn) {
    out.push({ section: 'PPN (first order)' });
    out.push({ key: 'ppn_alpha_1pm', label: `[(1 + γ)/2]·4M/b, γ = ${fmt(r.ppn.gamma)}`, value: angle(r.ppn.alpha_1pm, angleUnit), unit: u, source: s('ppn') });
    out.push({ key: 'ppn_alpha_1pm_gr', label: 'general relativity 4M/b', value: angle(r.ppn.alpha_1pm_gr, angleUnit), unit: u, source: s('ppn') });
    if (r.ppn.alpha_elongation !== undefined) {
      out.push({ key: 'ppn_alpha_elongation', label: `at elongation ${fmt(r.ppn.elongation_deg)}°`, value: angle(r.ppn.alpha_elongation, angleUnit), unit: u, source: s('ppn') });
    }
  }
  out.push({ section: 'Geometry (units of M = GM/c²)' });
  out.push({ key: 'impact_parameter', label: 'impact parameter b', value: r.impact_parameter, unit: 'M', source: 'your input, converted to units of GM/c²' });
  out.push({ key: 'critical_b', label: 'critical impact parameter b_c', value: r.critical_b, unit: 'M', source: s('critical_b') });
  out.push({ key: 'closest_approach', label: 'closest approach r₀', value: r.captured ? 'none (captured)' : r.closest_approach, unit: r.captured ? '' : 'M', source: s('closest_approach') });
  const p = r.physical;
  if (p) {
    out.push({ section: 'Physical units' });
    const src = s('physical');
    out.push({ key: 'mass_msun', label: 'lens mass', value: p.mass_msun, unit: 'M☉', source: src });
    out.push({ key: 'mass_kg', label: 'lens mass', value: p.mass_kg, unit: 'kg', source: src });
    out.push({ key: 'gm_over_c2_m', label: 'GM/c²', value: p.gm_over_c2_m, unit: 'm', source: src });
    out.push({ key: 'b_m', label: 'impact parameter b', value: p.b_m, unit: 'm', source: src });
    out.push({ key: 'critical_b_m', label: 'critical impact parameter b_c', value: p.critical_b_m, unit: 'm', source: src });
    if (p.closest_approach_m !== null && p.closest_approach_m !== undefined) out.push({ key: 'closest_approach_m', label: 'closest approach r₀', value: p.closest_approach_m, unit: 'm', source: src });
    if (p.wavelength_m !== undefined) out.push({ key: 'wavelength_m', label: 'wavelength', value: p.wavelength_m, unit: 'm', source: src });
  }
  return out;
}

function status(r, { angleUnit }) {
  if (r.captured) {
    return el('span', {}, el('span', { class: 'badge captured', 'data-role': 'captured', text: 'captured' }),
      ` The ray falls into the hole: b = ${fmt(r.impact_parameter, 6)} M ≤ b_c = ${fmt(r.critical_b, 6)} M. Capture is a result: there is no deflection angle.`);
  }
  return el('span', {}, 'exact α = ', el('span', { class: 'big', 'data-role': 'alpha', 'data-value': String(r.alpha), 'data-source': sourceOf(r, 'alpha'), tabindex: '0' }, fmt(angle(r.alpha, angleUnit), 10)),
    ` ${angleLabel(angleUnit)}`, el('span', { class: 'muted' }, `  (b = ${fmt(r.impact_parameter, 6)} M, r₀ = ${fmt(r.closest_approach, 6)} M)`));
}

export const lightView = {
  id: 'light',
  title: 'Light deflection',
  kind: 'light',
  angleOutput: true,
  angleDefault: 'rad',
  inputsNote: '(recomputed as you type)',
  fields: [
    { key: 'mass', label: 'Lens mass', type: 'quantity', units: MASS_UNITS, geometric: true, value: '1', unit: 'geometric' },
    { key: 'b', label: 'Impact parameter b', type: 'quantity', units: LENGTH_UNITS, value: '10', unit: 'M', bareUnit: 'M' },
    { key: 'spin', label: 'Spin a/M', hint: '(signed, + prograde)', type: 'number', value: '0', optional: true, group: 'Lens' },
    { key: 'charge', label: 'Charge Q/M', hint: '(geometrised Gaussian)', type: 'number', value: '0', optional: true },
    { key: 'ppn_gamma', label: 'PPN γ', hint: '(1 = general relativity)', type: 'number', value: '1', optional: true },
    { key: 'orders', label: 'Weak-field series orders', type: 'select', options: ORDERS, value: '8', integer: true, group: 'Series' },
    { key: 'wavelength', label: 'Wavelength', hint: '(optional)', type: 'quantity', units: SHORT_LENGTH_UNITS, value: '', unit: 'm', optional: true, bareUnit: 'M', group: 'Optional: optics checks' },
    { key: 'beam_width', label: 'Beam width', hint: '(optional)', type: 'quantity', units: LENGTH_UNITS, value: '', unit: 'km', optional: true, bareUnit: 'M' },
    { key: 'elongation_deg', label: 'Solar elongation φ', hint: '(degrees, optional)', type: 'number', value: '', optional: true },
  ],
  rows,
  status,
  figures: [
    { name: 'alpha_b', title: 'Deflection α against impact parameter b', stem: 'alpha-b' },
    { name: 'rays', title: 'Rays in the lens plane', stem: 'rays' },
  ],
  defaults: { b: 10, orders: 8 },
};
