// Point-lens view: Einstein radius, images, magnifications, time delay; wave-optics
// amplification F(w, y) when a frequency is given. Keys are the core's LensResult contract.
import { el, fmt } from '../util.js';
import { quantity, number, group } from '../inputs.js';
import { QUANTITY_COLUMNS, qrow, bestHeadline } from '../table.js';
import { headNumber } from '../viewkit.js';

const MASS_UNITS = [['Msun', 'M☉ (Msun)'], ['kg', 'kg'], ['Mearth', 'M⊕ (Mearth)'], ['Mjup', 'M♃ (Mjup)']];
const DIST_UNITS = [['kpc', 'kpc'], ['pc', 'pc'], ['Mpc', 'Mpc'], ['au', 'au'], ['m', 'm']];
const FREQ_UNITS = [['Hz', 'Hz'], ['mHz', 'mHz'], ['uHz', 'µHz'], ['kHz', 'kHz'], ['MHz', 'MHz'], ['GHz', 'GHz']];

function body({ result: r, A, au, src, tol }) {
  const E = r.estimates || {};
  const rows = [{ section: 'Einstein ring' }];
  const row = (...a) => rows.push(qrow(...a));
  row('einstein_radius_rad', 'Einstein angle θ_E', A(r.einstein_radius_rad), au, src('einstein_radius_rad'));
  row('einstein_radius_au', 'Einstein radius R_E = θ_E D_L', r.einstein_radius_au, 'au', src('einstein_radius_au'));
  row('einstein_radius_m', 'Einstein radius R_E', r.einstein_radius_m, 'm', src('einstein_radius_m'));
  rows.push({ section: 'Images (ray optics)' });
  const names = ['minimum image', 'saddle image'];
  (r.images || []).forEach((im, i) => {
    row(`image_${i}_position`, `${names[i] || `image ${i + 1}`}: position`, im.position, 'θ_E', src('images'));
    row(`image_${i}_magnification`, `${names[i] || `image ${i + 1}`}: magnification μ`, im.magnification, '', src('images'));
  });
  row('total_magnification', 'total magnification |μ₊| + |μ₋|', r.total_magnification, '', src('total_magnification'), E.total_magnification, tol);
  row('time_delay_s', 'time delay (saddle − minimum)', r.time_delay_s, 's', src('time_delay_s'));
  row('time_delay_dimensionless', 'time delay / (4GM(1+z)/c³)', r.time_delay_dimensionless, '', src('time_delay_dimensionless'));
  row('mass_msun', 'lens mass', r.mass_msun, 'M☉', src('mass_msun'));
  row('redshifted_mass_msun', 'redshifted mass (1 + z_L) M', r.redshifted_mass_msun, 'M☉', src('redshifted_mass_msun', 'mass_msun'));
  if (r.w !== undefined) {
    rows.push({ section: 'Wave optics' });
    row('frequency_hz', 'frequency f', r.frequency_hz, 'Hz', 'your input');
    row('w', 'dimensionless frequency w', r.w, '', src('w'));
    row('amplification_abs', 'amplification |F|', r.amplification_abs, '', src('amplification_abs'), E.amplification_abs, tol);
    row('amplification_phase_rad', 'phase arg F', r.amplification_phase_rad, 'rad', src('amplification_phase_rad'));
    if (r.amplification) {
      row('amplification_re', 'Re F', r.amplification.re, '', src('amplification'));
      row('amplification_im', 'Im F', r.amplification.im, '', src('amplification'));
    }
    if (r.amplification_geometric) {
      row('amplification_geometric_re', 'Re F (geometric optics)', r.amplification_geometric.re, '', src('amplification_geometric'), E.amplification_geometric, tol);
      row('amplification_geometric_im', 'Im F (geometric optics)', r.amplification_geometric.im, '', src('amplification_geometric'), E.amplification_geometric, tol);
    }
    row('amplification_method', 'method for F', r.amplification_method || '—', '', src('amplification'));
  }
  return [{ role: 'results', columns: QUANTITY_COLUMNS, rows }];
}

// The view's names of the keys the core may recommend (display text only).
const BEST_NAME = { amplification_abs: 'amplification |F| (wave optics)', total_magnification: 'magnification μ (ray optics)' };

function headline({ result: r, A, au, src, tol }) {
  const b = r.best;
  return el('span', {}, bestHeadline(b, { name: BEST_NAME[b.key] || b.key, shown: fmt(b.value, 8), tol, source: src(b.key) }),
    el('span', { class: 'muted' }, 'θ_E = ', headNumber('einstein', r.einstein_radius_rad, fmt(A(r.einstein_radius_rad), 6), null, 'big2'), ` ${au}`));
}

export const lensView = {
  id: 'lens',
  title: 'Lensing',
  kind: 'lens',
  angles: 'mas',
  digits: 9,
  intro: '(point mass, thin lens)',
  inputs: [
    quantity('mass', 'Lens mass', MASS_UNITS, { value: '0.3', unit: 'Msun' }),
    quantity('lens_distance', 'Lens distance D_L', DIST_UNITS, { value: '4', unit: 'kpc' }),
    quantity('source_distance', 'Source distance D_S', DIST_UNITS, { value: '8', unit: 'kpc' }),
    number('offset', 'Source offset β', { hint: '(Einstein radii)', value: '0.5' }),
    group('Wave optics', [
      quantity('frequency', 'Wave frequency f', FREQ_UNITS, { hint: '(optional)', value: '100', unit: 'Hz', optional: true }),
      number('lens_redshift', 'Lens redshift z_L', { value: '0', optional: true }),
    ]),
  ],
  headline,
  body,
  figures: [
    { stem: 'magnification', name: 'magnification', title: 'Magnification against offset' },
    { stem: 'amplification', name: 'amplification', title: 'Wave-optics amplification |F|(w)' },
  ],
};
