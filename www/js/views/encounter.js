// Two-body encounter view: every number of the core's EncounterResult in one table (each with
// its source from the result's `sources` map), and the regime flags. No figures yet.
import { sourceOf } from '../viewkit.js';

const MASS = [['', 'geometric (bare)'], ['Msun', 'M☉ (Msun)'], ['kg', 'kg'], ['Mearth', 'M⊕'], ['Mjup', 'M♃']];
const SPEED = [['', 'fraction of c'], ['km/s', 'km/s'], ['m/s', 'm/s']];
const LENGTH = [['', 'GM/c² (bare)'], ['au', 'au'], ['km', 'km'], ['m', 'm'], ['Rsun', 'R☉']];
const CHARGE = [['', 'geometric Gaussian'], ['C', 'C'], ['statC', 'statC'], ['e', 'e']];

/** Flattens nested objects/arrays of numbers into table rows keyed by their path. */
function flatten(r, value, path, top, out) {
  if (value === null || value === undefined) return;
  if (typeof value === 'number' || typeof value === 'string' || typeof value === 'boolean') {
    out.push({ key: path, label: path.replace(/_/g, ' ').replace(/\./g, ' › '), value: typeof value === 'boolean' ? String(value) : value, unit: '', source: sourceOf(r, path, top) });
    return;
  }
  if (Array.isArray(value)) {
    if (value.length > 24) return; // long plot arrays are not table material
    value.forEach((v, i) => flatten(r, v, `${path}[${i + 1}]`, top, out));
    return;
  }
  for (const [k, v] of Object.entries(value)) flatten(r, v, path ? `${path}.${k}` : k, top || k, out);
}

function rows(r) {
  const out = [];
  for (const [k, v] of Object.entries(r)) {
    if (k === 'flags' || k === 'sources') continue;
    const before = out.length;
    out.push({ section: k.replace(/_/g, ' ') });
    flatten(r, v, k, k, out);
    if (out.length === before + 1) out.pop();
  }
  return out;
}

export const encounterView = {
  id: 'encounter',
  title: 'Two-body encounter',
  kind: 'encounter',
  angleOutput: false,
  inputsNote: '(give γ or v, and b or j)',
  fields: [
    { key: 'force', label: 'Interaction', type: 'select', options: [['gravity', 'gravity'], ['em', 'electromagnetic']], value: 'gravity' },
    { key: 'm1', label: 'Mass m₁', type: 'quantity', units: MASS, value: '1', unit: '', optional: true },
    { key: 'm2', label: 'Mass m₂', type: 'quantity', units: MASS, value: '1.6', unit: '', optional: true },
    { key: 'gamma', label: 'Lorentz factor γ', type: 'number', value: '1.25', optional: true, group: 'Kinematics' },
    { key: 'v', label: 'Relative speed v', hint: '(instead of γ)', type: 'quantity', units: SPEED, value: '', unit: '', optional: true },
    { key: 'b', label: 'Impact parameter b', type: 'quantity', units: LENGTH, value: '18', unit: '', optional: true },
    { key: 'j', label: 'Angular momentum j', hint: '(instead of b)', type: 'number', value: '', optional: true },
    { key: 'q1', label: 'Charge q₁', type: 'quantity', units: CHARGE, value: '', unit: '', optional: true, group: 'Charges (electromagnetic)' },
    { key: 'q2', label: 'Charge q₂', type: 'quantity', units: CHARGE, value: '', unit: '', optional: true },
  ],
  rows,
  status: null,
  figures: [],
  defaults: { m1: 1, m2: 1.6, gamma: 1.25, b: 18 },
};
