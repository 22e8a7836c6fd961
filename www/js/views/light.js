// Light deflection view: exact α, each weak-field order, strong-deflection value, flags.
import { el, fmt } from '../util.js';
import { angle, angleLabel, sourceOf } from '../viewkit.js';

const MASS_UNITS = [['geometric', 'geometric (M = 1)'], ['Msun', 'M☉ (Msun)'], ['kg', 'kg'], ['Mearth', 'M⊕ (Mearth)'], ['Mjup', 'M♃ (Mjup)']];
const LENGTH_UNITS = [['M', 'M (GM/c²)'], ['m', 'm'], ['km', 'km'], ['Rsun', 'R☉ (Rsun)'], ['Rearth', 'R⊕'], ['Rjup', 'R♃'], ['au', 'au']];
const ORDERS = Array.from({ length: 12 }, (_, i) => [String(i + 1), String(i + 1)]);

/** Rows of the results table from a LightResult (keys are the core's JSON contract). */
function rows(r, { angleUnit }) {
  const u = angleLabel(angleUnit);
  const out = [];
  out.push({ section: 'Deflection angle α' });
  out.push({ key: 'alpha', label: 'exact α', value: r.captured ? 'captured' : angle(r.alpha, angleUnit), unit: r.captured ? '' : u, source: sourceOf(r, 'alpha') });
  const series = r.series || r.partial_sums || [];
  for (const [i, term] of series.entries()) {
    const order = term.order ?? i + 1;
    const val = term.alpha ?? term.value ?? term.sum ?? null;
    out.push({ key: `series_${order}`, label: `weak-field series to order ${order}`, value: angle(val, angleUnit), unit: u, source: term.source || sourceOf(r, 'series', `series_${order}`) });
    const rel = term.rel_error ?? term.relative_error;
    if (rel !== undefined && rel !== null) out.push({ key: `series_${order}_rel`, label: `  relative error of order ${order}`, value: rel, unit: '', source: 'relative difference to the exact α' });
  }
  if (r.strong !== undefined || r.strong_deflection !== undefined) {
    const s = r.strong ?? r.strong_deflection;
    out.push({ key: 'strong', label: 'strong-deflection limit', value: angle(typeof s === 'object' && s ? s.alpha : s, angleUnit), unit: u, source: sourceOf(r, 'strong', 'strong_deflection') });
  }
  out.push({ section: 'Geometry' });
  out.push({ key: 'critical_b', label: 'critical impact parameter b꜀', value: r.critical_b, unit: 'M', source: sourceOf(r, 'critical_b') });
  out.push({ key: 'closest_approach', label: 'closest approach r₀', value: r.closest_approach, unit: 'M', source: sourceOf(r, 'closest_approach') });
  return out;
}

function status(r, { angleUnit }) {
  if (r.captured) {
    return el('span', {}, el('span', { class: 'badge captured', 'data-role': 'captured', text: 'captured' }),
      ` The ray falls into the hole: b ≤ b꜀ = ${fmt(r.critical_b, 6)} M. Capture is a result, not an error.`);
  }
  return el('span', {}, 'α = ', el('span', { class: 'big', 'data-role': 'alpha', 'data-value': String(r.alpha) }, fmt(angle(r.alpha, angleUnit), 9)), ` ${angleLabel(angleUnit)}`);
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
    { key: 'spin', label: 'Spin a/M', hint: '(+ prograde, equatorial)', type: 'number', value: '0', optional: true, group: 'Lens' },
    { key: 'charge', label: 'Charge Q/M', hint: '(geometrised Gaussian)', type: 'number', value: '0', optional: true },
    { key: 'ppn_gamma', label: 'PPN γ', hint: '(1 = general relativity)', type: 'number', value: '1', optional: true },
    { key: 'orders', label: 'Weak-field series orders', type: 'select', options: ORDERS, value: '8', integer: true, group: 'Series' },
  ],
  rows,
  status,
  figures: [
    { name: 'alpha_b', title: 'α against b', stem: 'alpha-b' },
    { name: 'rays', title: 'Rays in the lens plane', stem: 'rays' },
  ],
  defaults: { b: 10, orders: 8 },
};
