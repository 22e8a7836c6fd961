// The page's one door to the wasm core. Every call a view makes into wasm goes through this module,
// and every place where the page depends on the shape of the core's answers (class names, result
// keys, flag labels, the angle-unit table) is an accessor here: a change in the core's interface is
// mended in this file. No physics here.
import * as glue from '../pkg/chiwave_web.js';
import { WASM_BYTES } from './wasm-bytes.js';

let facts = null;

/** Instantiates the wasm module (inlined bytes in the single file, or fetched beside the bundle)
 *  and returns the raw wasm-bindgen module (for the console, the bench page and the tests). */
export async function loadCore() {
  if (WASM_BYTES) glue.initSync({ module: WASM_BYTES });
  else await glue.default();
  facts = glue.info();
  return glue;
}

/** Static facts of the core: version, notice, unit lists. */
export function info() {
  return facts;
}

/** The message of a thrown core error (a JS Error with `field` and `kind`). */
export function message(e) {
  return e && e.message ? e.message : String(e);
}

/** Runs `fn`; returns {value} or {error: message}. */
export function attempt(fn) {
  try {
    return { value: fn() };
  } catch (e) {
    return { error: message(e) };
  }
}

/**
 * One evaluation for one input change: the result of `resultRequest` (default `request`) and the
 * figures `[{name, options}]` drawn for `request`, each as {value: rendered} or {error}.
 * Throws the core's error (with `field`) when the request is refused.
 * Today this is one `evaluate` plus one `figure` call per figure; a core entry point that returns
 * the result and its figures from one validation replaces the body of this function only.
 */
export function evaluateView({ request, resultRequest = request, figures = [] }) {
  const result = glue.evaluate(resultRequest);
  const drawn = figures.map(({ name, options }) => attempt(() => glue.figure(request, name, options || {})));
  return { result, figures: drawn };
}

/** Every reference the core uses, `[{id, short, authors, year, title, arxiv, doi, used_for,
 *  bibtex, …}]`. FALLBACK for cores without `references()`: an empty list (no BibTeX offered). */
export function references() {
  return typeof glue.references === 'function' ? glue.references() : [];
}

/** Validates a scenario object; returns {name, description, request} or throws. */
export function checkScenario(scenario) {
  return glue.check_scenario(scenario);
}

/** The core's comparison of NR rows (CSV text) with the predictions, angles in `angleUnit`. */
export function compareNr(csvText, angleUnit) {
  return glue.encounter_nr(csvText, angleUnit);
}

/** Starts the progressive sky work of a gravitational waveform request (`map`: energy | memory). */
export function startWaveformJob(request, map) {
  // The class is RadiationJob in cores before the rename to WaveformJob (same methods); looked
  // up by name so that the bundler accepts either glue.
  const Job = ['WaveformJob', 'RadiationJob'].map((name) => glue[name]).find(Boolean);
  return new Job(request, map);
}

// ---- accessors for what the core sends ----

/** A flag's human name. Fallback (cores that send no `label`): its key. */
export function flagLabel(flag) {
  return flag.label ?? flag.key.replace(/_/g, ' ');
}

/** Looks up a source text in a result's keyed `sources` map by the first key present. */
export function sourceOf(result, ...keys) {
  const s = result && result.sources;
  if (!s || Array.isArray(s)) return null;
  for (const k of keys) if (k && s[k]) return typeof s[k] === 'string' ? s[k] : JSON.stringify(s[k]);
  return null;
}

// Waveform results list their sources as an array in cores before the keyed map: the position
// of each name in that array (gravity, em). Remove the positions once every core sends the map.
const WAVEFORM_SOURCE_POSITION = {
  gravity: { waveform: 0, closed_form: 1, memory: 2, zero_frequency: 3, antenna: 4 },
  em: { field: 0, closed_form: 1, flux: 2, memory: 3, spectrum: 4 },
};

/** A waveform result's source by name (keyed map, or the older positional array). */
export function waveformSource(result, force, name) {
  const s = result && result.sources;
  if (Array.isArray(s)) return s[WAVEFORM_SOURCE_POSITION[force][name]] ?? null;
  return sourceOf(result, name);
}

/** b/(GM/c²) of a waveform result (`b_over_gm`; `b_over_m` in older cores). */
export function bOverGm(result) {
  return result.b_over_gm ?? result.b_over_m;
}

// Output angle units. FALLBACK for cores whose info() has no `angle_units` yet: remove this
// table once every core sends them (the core's AngleUnit is the one list).
const ANGLE_UNITS_FALLBACK = [
  { key: 'rad', label: 'rad', rad_per_unit: 1 },
  { key: 'deg', label: 'deg', rad_per_unit: Math.PI / 180 },
  { key: 'arcsec', label: 'arcsec', rad_per_unit: Math.PI / 648000 },
  { key: 'mas', label: 'mas', rad_per_unit: Math.PI / 648000e3 },
  { key: 'uas', label: 'µas', rad_per_unit: Math.PI / 648000e6 },
];

/** The output angle units `[{key, label, rad_per_unit}]`. */
export function angleUnits() {
  return (facts && facts.angle_units) || ANGLE_UNITS_FALLBACK;
}

function angleUnit(key) {
  const u = angleUnits().find((x) => x.key === key);
  if (!u) throw new Error(`unknown angle unit '${key}'`);
  return u;
}

/** Display conversion of an angle in radians to `unit` (a unit change, not physics). */
export function angle(rad, unit) {
  return rad === null || rad === undefined ? null : rad / angleUnit(unit).rad_per_unit;
}

/** An angle given in unit `from` expressed in unit `to`. */
export function convertAngle(x, from, to) {
  return (x * angleUnit(from).rad_per_unit) / angleUnit(to).rad_per_unit;
}

export function angleLabel(unit) {
  return angleUnit(unit).label;
}
