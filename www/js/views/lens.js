// Point-lens view: images, magnifications, time delay; wave-optics amplification |F|(w).
import { el, fmt } from '../util.js';
import { sourceOf } from '../viewkit.js';

const MASS_UNITS = [['Msun', 'M☉ (Msun)'], ['kg', 'kg'], ['Mearth', 'M⊕ (Mearth)'], ['Mjup', 'M♃ (Mjup)']];
const DIST_UNITS = [['kpc', 'kpc'], ['pc', 'pc'], ['Mpc', 'Mpc'], ['au', 'au'], ['m', 'm']];
const FREQ_UNITS = [['Hz', 'Hz'], ['mHz', 'mHz'], ['uHz', 'µHz'], ['kHz', 'kHz'], ['MHz', 'MHz'], ['GHz', 'GHz']];

const LABELS = {
  einstein_radius_rad: ['Einstein radius θ_E', 'rad'],
};

/** Rows from a LensResult: every numeric field, labelled where the view knows it. */
function rows(r) {
  const out = [{ section: 'Point lens' }];
  for (const [k, v] of Object.entries(r)) {
    if (k === 'sources' || k === 'flags' || typeof v === 'object') continue;
    const [label, unit] = LABELS[k] || [k.replace(/_/g, ' '), ''];
    out.push({ key: k, label, value: typeof v === 'boolean' ? String(v) : v, unit, source: sourceOf(r, k) });
  }
  return out;
}

function status(r) {
  return el('span', {}, 'θ_E = ', el('span', { class: 'big' }, fmt(r.einstein_radius_rad * 206264806.2470964, 6)), ' mas');
}

export const lensView = {
  id: 'lens',
  title: 'Lensing',
  kind: 'lens',
  angleOutput: false,
  inputsNote: '(point mass, thin lens)',
  fields: [
    { key: 'mass', label: 'Lens mass', type: 'quantity', units: MASS_UNITS, value: '1', unit: 'Msun' },
    { key: 'lens_distance', label: 'Lens distance D_L', type: 'quantity', units: DIST_UNITS, value: '4', unit: 'kpc' },
    { key: 'source_distance', label: 'Source distance D_S', type: 'quantity', units: DIST_UNITS, value: '8', unit: 'kpc' },
    { key: 'offset', label: 'Source offset β', hint: '(Einstein radii)', type: 'number', value: '0.5' },
    { key: 'frequency', label: 'Wave frequency f', hint: '(for wave optics)', type: 'quantity', units: FREQ_UNITS, value: '', unit: 'Hz', optional: true, group: 'Wave optics' },
    { key: 'lens_redshift', label: 'Lens redshift z_L', type: 'number', value: '0', optional: true },
  ],
  rows,
  status,
  figures: [
    { name: 'amplification', title: '|F| against w', stem: 'amplification' },
  ],
  defaults: { mass: '1Msun', lens_distance: '4kpc', source_distance: '8kpc', offset: 0.5 },
};
