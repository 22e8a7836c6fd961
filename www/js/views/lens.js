// Point-lens view: Einstein radius, images, magnifications, time delay; wave-optics
// amplification F(w, y) when a frequency is given. Keys are the core's LensResult contract.
import { el, fmt } from '../util.js';
import { angle, angleLabel, sourceOf } from '../viewkit.js';

const MASS_UNITS = [['Msun', 'M☉ (Msun)'], ['kg', 'kg'], ['Mearth', 'M⊕ (Mearth)'], ['Mjup', 'M♃ (Mjup)']];
const DIST_UNITS = [['kpc', 'kpc'], ['pc', 'pc'], ['Mpc', 'Mpc'], ['au', 'au'], ['m', 'm']];
const FREQ_UNITS = [['Hz', 'Hz'], ['mHz', 'mHz'], ['uHz', 'µHz'], ['kHz', 'kHz'], ['MHz', 'MHz'], ['GHz', 'GHz']];

function rows(r, { angleUnit }) {
  const s = (k) => sourceOf(r, k);
  const out = [{ section: 'Einstein ring' }];
  out.push({ key: 'einstein_radius_rad', label: 'Einstein angle θ_E', value: angle(r.einstein_radius_rad, angleUnit), unit: angleLabel(angleUnit), source: s('einstein_radius_rad') });
  out.push({ key: 'einstein_radius_au', label: 'Einstein radius R_E = θ_E D_L', value: r.einstein_radius_au, unit: 'au', source: s('einstein_radius_au') });
  out.push({ key: 'einstein_radius_m', label: 'Einstein radius R_E', value: r.einstein_radius_m, unit: 'm', source: s('einstein_radius_m') });
  out.push({ section: 'Images (ray optics)' });
  const names = ['minimum image', 'saddle image'];
  (r.images || []).forEach((im, i) => {
    out.push({ key: `image_${i}_position`, label: `${names[i] || `image ${i + 1}`}: position`, value: im.position, unit: 'θ_E', source: s('images') });
    out.push({ key: `image_${i}_magnification`, label: `${names[i] || `image ${i + 1}`}: magnification μ`, value: im.magnification, unit: '', source: s('images') });
  });
  out.push({ key: 'total_magnification', label: 'total magnification |μ₊| + |μ₋|', value: r.total_magnification, unit: '', source: s('total_magnification') });
  out.push({ key: 'time_delay_s', label: 'time delay (saddle − minimum)', value: r.time_delay_s, unit: 's', source: s('time_delay_s') });
  out.push({ key: 'time_delay_dimensionless', label: 'time delay / (4GM(1+z)/c³)', value: r.time_delay_dimensionless, unit: '', source: s('time_delay_dimensionless') });
  out.push({ key: 'mass_msun', label: 'lens mass', value: r.mass_msun, unit: 'M☉', source: s('mass_msun') });
  out.push({ key: 'redshifted_mass_msun', label: 'redshifted mass (1 + z_L) M', value: r.redshifted_mass_msun, unit: 'M☉', source: s('redshifted_mass_msun') || s('mass_msun') });
  if (r.w !== undefined) {
    out.push({ section: 'Wave optics' });
    out.push({ key: 'frequency_hz', label: 'frequency f', value: r.frequency_hz, unit: 'Hz', source: 'your input' });
    out.push({ key: 'w', label: 'dimensionless frequency w', value: r.w, unit: '', source: s('w') });
    out.push({ key: 'amplification_abs', label: 'amplification |F|', value: r.amplification_abs, unit: '', source: s('amplification_abs') });
    out.push({ key: 'amplification_phase_rad', label: 'phase arg F', value: r.amplification_phase_rad, unit: 'rad', source: s('amplification_phase_rad') });
    if (r.amplification) {
      out.push({ key: 'amplification_re', label: 'Re F', value: r.amplification.re, unit: '', source: s('amplification') });
      out.push({ key: 'amplification_im', label: 'Im F', value: r.amplification.im, unit: '', source: s('amplification') });
    }
    if (r.amplification_geometric) {
      out.push({ key: 'amplification_geometric_re', label: 'Re F (geometric optics)', value: r.amplification_geometric.re, unit: '', source: s('amplification_geometric') });
      out.push({ key: 'amplification_geometric_im', label: 'Im F (geometric optics)', value: r.amplification_geometric.im, unit: '', source: s('amplification_geometric') });
    }
    out.push({ key: 'amplification_method', label: 'method for F', value: r.amplification_method || '—', unit: '', source: s('amplification') });
  }
  return out;
}

function status(r, { angleUnit }) {
  const parts = ['θ_E = ', el('span', { class: 'big', 'data-role': 'einstein', 'data-value': String(r.einstein_radius_rad) }, fmt(angle(r.einstein_radius_rad, angleUnit), 6)), ` ${angleLabel(angleUnit)}, μ = `,
    el('span', { class: 'big' }, fmt(r.total_magnification, 6))];
  if (r.amplification_abs !== undefined) parts.push(', |F| = ', el('span', { class: 'big' }, fmt(r.amplification_abs, 6)));
  return el('span', {}, ...parts);
}

export const lensView = {
  id: 'lens',
  title: 'Lensing',
  kind: 'lens',
  angleOutput: true,
  angleDefault: 'mas',
  inputsNote: '(point mass, thin lens)',
  fields: [
    { key: 'mass', label: 'Lens mass', type: 'quantity', units: MASS_UNITS, value: '0.3', unit: 'Msun' },
    { key: 'lens_distance', label: 'Lens distance D_L', type: 'quantity', units: DIST_UNITS, value: '4', unit: 'kpc' },
    { key: 'source_distance', label: 'Source distance D_S', type: 'quantity', units: DIST_UNITS, value: '8', unit: 'kpc' },
    { key: 'offset', label: 'Source offset β', hint: '(Einstein radii)', type: 'number', value: '0.5' },
    { key: 'frequency', label: 'Wave frequency f', hint: '(optional)', type: 'quantity', units: FREQ_UNITS, value: '', unit: 'Hz', optional: true, group: 'Wave optics' },
    { key: 'lens_redshift', label: 'Lens redshift z_L', type: 'number', value: '0', optional: true },
  ],
  rows,
  status,
  figures: [
    { name: 'magnification', title: 'Magnification against offset', stem: 'magnification' },
    { name: 'amplification', title: 'Wave-optics amplification |F|(w)', stem: 'amplification' },
  ],
  defaults: { mass: '0.3Msun', lens_distance: '4kpc', source_distance: '8kpc', offset: 0.5, frequency: '100Hz' },
};
