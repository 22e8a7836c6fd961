// A view's inputs: field specs, the form built from them, the request read from the form's state
// and the state filled from a request (a scenario). The one number parser of the page lives here.
// Text and DOM only: the core parses quantities with units and validates every value.
import { el, splitQuantity } from './util.js';

// ---------------------------------------------------------------- parsing

const PLAIN_NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?$/i;
const NON_FINITE_WORD = /^[+-]?(?:nan|inf|infinity)$/i;

/** At most `n` characters of user text, for messages. */
export function clip(text, n = 40) {
  const s = String(text);
  return s.length > n ? `${s.slice(0, n)}…` : s;
}

/** The one number parser: text → {value} (a finite number), {empty} (optional and blank) or
 *  {error} naming the field. "nan", "inf" and overflowing text are refused here. */
export function parseNumber(name, text, { optional = false, integer = false } = {}) {
  const t = String(text ?? '').trim().replace(/−/g, '-');
  if (t === '') return optional ? { empty: true } : { error: `${name}: enter a number` };
  const v = Number(t);
  if (!Number.isFinite(v)) return { error: `${name}: cannot read '${clip(String(text).trim())}' as a finite number` };
  if (integer && !Number.isInteger(v)) return { error: `${name}: enter a whole number` };
  return { value: v };
}

/** Text of a quantity box: {text}, {empty} or {error}. A plain number (or nan/inf) is checked by
 *  parseNumber; a number with a unit typed in goes to the core's quantity parser as it is. */
export function parseQuantityText(name, text, { optional = false } = {}) {
  const t = String(text ?? '').trim().replace(/−/g, '-');
  if (t === '') return optional ? { empty: true } : { error: `${name}: enter a number` };
  if (PLAIN_NUMBER.test(t) || NON_FINITE_WORD.test(t)) {
    const r = parseNumber(name, t);
    if (r.error) return r;
  }
  return { text: t };
}

// ---------------------------------------------------------------- field specs

/**
 * A field is a label, a row of controls and one error line. A control is one element of the
 * form whose value is one entry `{key: string}` of the view's state map:
 *   number  text box read by parseNumber        → request[req] = number
 *   text    text box of a quantity, with `unit` = the key of its unit select; the selected unit
 *           option decides the request key (`key`), whether the text is sent as a number
 *           (`number`), as "text unit" or not at all (`omit`: geometric units)
 *   select  → request[req] = value (Number with `integer`)
 *   check   a checkbox ('true' | 'false'), usually a mode switch (req: false)
 * Common control options: value (default text), req (request path, 'a.b' nests; false = not
 * sent), optional, integer, absent (the value when a loaded request leaves the field out),
 * fromRequest(request) → text (loading a request needs more than a lookup), aria, placeholder.
 * Field options: hint, show(state) → bool (hidden fields are not sent), errors (request keys
 * whose errors show at this field; default: the keys its controls send).
 */
export const control = {
  number: (key, o = {}) => ({ type: 'number', key, req: key, value: '', ...o }),
  text: (key, units, o = {}) => ({ type: 'text', key, req: key, value: '', unit: `${key}_unit`, units: normUnits(units), ...o }),
  select: (key, options, o = {}) => ({ type: 'select', key, req: key, options: normUnits(options), value: String(o.value ?? options[0][0]), ...o }),
  check: (key, text, o = {}) => ({ type: 'check', key, req: false, text, value: 'false', ...o }),
};

function normUnits(list) {
  return list.map((u) => (Array.isArray(u) ? { value: u[0], label: u[1], ...(u[2] || {}) } : u));
}

export function field(key, label, controls, o = {}) {
  return { key, label, hint: o.hint, show: o.show, errors: o.errors, controls };
}

/** A plain number. */
export function number(key, label, o = {}) {
  return field(key, label, [control.number(key, o)], o);
}

/** A text box with a unit select (state keys `key` and `key_unit`). `units`: [[value, label,
 *  {key, number, omit, aliases}]]; `o.unit` is the default unit, `o.unitAria` the select's name. */
export function quantity(key, label, units, o = {}) {
  const text = control.text(key, units, { value: o.value ?? '', req: o.req ?? key, optional: o.optional, placeholder: o.placeholder });
  const unit = control.select(`${key}_unit`, units, { value: o.unit ?? normUnits(units)[0].value, req: false, aria: o.unitAria ?? `${label} unit` });
  return field(key, label, [text, unit], o);
}

/** A select. */
export function choice(key, label, options, o = {}) {
  return field(key, label, [control.select(key, options, o)], o);
}

/** A checkbox with its text. */
export function check(key, label, text, o = {}) {
  return field(key, label, [control.check(key, text, o)], o);
}

/** A group of fields with an optional title; `o.show(state)` hides it, `o.role` names it. */
export function group(title, items, o = {}) {
  return { group: title, items, show: o.show, role: o.role };
}

/** A line of explanation in the form. */
export function note(text) {
  return { note: text };
}

// ---------------------------------------------------------------- the form

function setPath(obj, path, value) {
  const keys = path.split('.');
  let o = obj;
  for (const k of keys.slice(0, -1)) o = o[k] ??= {};
  o[keys[keys.length - 1]] = value;
}

function getPath(obj, path) {
  let o = obj;
  for (const k of path.split('.')) {
    if (o === null || o === undefined) return undefined;
    o = o[k];
  }
  return o;
}

/** The request keys a control can send. */
function sentKeys(c) {
  if (c.req === false) return [];
  if (c.type === 'text') return [c.req, ...c.units.map((u) => u.key).filter(Boolean)];
  return [c.req];
}

/**
 * Builds the form of `items` (fields, groups, notes) for view `viewId`. Element ids are
 * `f-<view>-<state key>`; error lines carry `data-error-for` = the field's first request key.
 * `onChange(control)` runs on every input and change event.
 * Returns {root, controls: Map(state key → control), sync(state), read(state), fromRequest(request, state), showErrors(errors)}.
 */
export function buildForm(viewId, items, onChange) {
  const controls = new Map();
  const fields = [];
  const shown = []; // [node, show(state)] of every field and group
  const requestError = el('p', { class: 'request-error', role: 'alert' });

  function makeControl(c, errId) {
    const id = `f-${viewId}-${c.key}`;
    let node;
    if (c.type === 'select') {
      node = el('select', { id, name: c.key, 'aria-label': c.aria || null, 'aria-describedby': c.aria ? null : errId });
      for (const o of c.options) node.append(el('option', { value: o.value, text: o.label }));
      node.value = c.value;
    } else if (c.type === 'check') {
      node = el('input', { type: 'checkbox', id, name: c.key });
      node.checked = c.value === 'true';
    } else {
      node = el('input', {
        id, name: c.key, type: 'text', inputmode: 'decimal', autocomplete: 'off', spellcheck: 'false', value: c.value,
        'aria-describedby': errId, 'aria-label': c.aria || null, placeholder: c.placeholder || (c.optional ? 'optional' : null),
      });
    }
    const units = c.type === 'select' ? [...c.options] : null; // per view: a loaded request may add a unit
    const ctl = {
      key: c.key, spec: c, node, units,
      get: () => (c.type === 'check' ? String(node.checked) : node.value),
      /** Sets the value; false when it is not one of a select's options (add: make it one). */
      set(v, { add = false } = {}) {
        const s = String(v);
        if (c.type === 'check') {
          if (s !== 'true' && s !== 'false') return false;
          node.checked = s === 'true';
        } else if (c.type === 'select') {
          if (![...node.options].some((o) => o.value === s)) {
            if (!add) return false;
            node.append(el('option', { value: s, text: s }));
            units.push({ value: s, label: s, key: add.key });
          }
          node.value = s;
        } else node.value = s;
        return true;
      },
      reset() { this.set(c.value); },
    };
    node.addEventListener('input', () => onChange(ctl));
    node.addEventListener('change', () => onChange(ctl));
    controls.set(c.key, ctl);
    return c.type === 'check' ? el('label', { for: id }, node, ` ${c.text}`) : node;
  }

  function build(item) {
    if (item.note) return el('p', { class: 'muted', text: item.note });
    if (item.items) {
      const g = el('div', { class: item.group ? 'group' : null, 'data-group': item.role || null },
        item.group ? el('p', { class: 'group-title', text: item.group }) : null, item.items.map(build));
      shown.push([g, item.show]);
      return g;
    }
    const f = { spec: item, errorKeys: item.errors || [...new Set(item.controls.flatMap(sentKeys))], visible: true };
    const errFor = f.errorKeys[0] || item.key;
    const errId = `f-${viewId}-${item.key}-err`;
    f.err = el('p', { class: 'field-error', id: errId, role: 'alert', 'data-error-for': errFor });
    const nodes = item.controls.map((c) => makeControl(c, errId));
    f.root = el('div', { class: 'field', 'data-field': item.key },
      el('label', { class: 'name', for: `f-${viewId}-${item.controls[0].key}` }, item.label, item.hint ? el('span', { class: 'hint' }, ` ${item.hint}`) : null),
      el('div', { class: 'row' }, nodes), f.err);
    fields.push(f);
    shown.push([f.root, item.show]);
    return f.root;
  }

  const root = el('form', { class: 'form', novalidate: true, onsubmit: (e) => e.preventDefault() }, requestError, items.map(build));

  /** The selected unit option of a quantity's text control. */
  function unitOf(c, state) {
    const u = state[c.spec.unit];
    return controls.get(c.spec.unit).units.find((o) => o.value === u) || { value: u };
  }

  /** Shows and hides fields and groups for `state`; greys out a quantity in geometric units. */
  function sync(state) {
    for (const [node, show] of shown) node.hidden = show ? !show(state) : false;
    for (const f of fields) f.visible = !f.root.hidden && !f.root.parentElement.closest('form [hidden]');
    for (const c of controls.values()) {
      if (c.spec.type !== 'text' || !c.spec.units.some((u) => u.omit)) continue;
      const geo = !!unitOf(c, state).omit;
      c.node.disabled = geo;
      c.node.setAttribute('placeholder', geo ? 'M = 1 (geometric units)' : '');
    }
  }

  /** The request fields of `state` (visible fields only): {fields} or {errors: {key: message}}. */
  function read(state) {
    const out = {};
    const errors = {};
    for (const f of fields) {
      if (!f.visible) continue;
      for (const c of f.spec.controls) {
        if (c.req === false) continue;
        const text = state[c.key];
        if (c.type === 'select') { setPath(out, c.req, c.integer ? Number(text) : text); continue; }
        if (c.type === 'check') { setPath(out, c.req, text === 'true'); continue; }
        if (c.type === 'number') {
          const r = parseNumber(c.req, text, c);
          if (r.error) errors[c.req] = r.error;
          else if (!r.empty) setPath(out, c.req, r.value);
          continue;
        }
        const u = unitOf(controls.get(c.key), state);
        if (u.omit) continue;
        const key = u.key || c.req;
        const r = u.number ? parseNumber(key, text, c) : parseQuantityText(key, text, c);
        if (r.error) errors[key] = r.error;
        else if (!r.empty) setPath(out, key, u.number ? r.value : u.value ? `${r.text} ${u.value}` : r.text);
      }
    }
    return Object.keys(errors).length ? { errors } : { fields: out };
  }

  /** The state that shows `request` (a scenario): every control the request speaks for is set;
   *  display controls (req: false, no fromRequest) keep their value. */
  function fromRequest(request, state) {
    const next = { ...state };
    const add = {}; // unit options a request needs that the list lacks: {state key: [value, request key]}
    for (const ctl of controls.values()) {
      const c = ctl.spec;
      if (c.fromRequest) {
        const v = c.fromRequest(request);
        if (v !== undefined) next[c.key] = v;
        continue;
      }
      if (c.req === false) continue;
      if (c.type !== 'text') {
        const v = getPath(request, c.req);
        next[c.key] = v !== undefined && v !== null ? String(v) : (c.absent ?? c.value);
        continue;
      }
      const units = controls.get(c.unit).units;
      const key = sentKeys(c).find((k) => request[k] !== undefined && request[k] !== null);
      if (!key) {
        const geo = units.find((u) => u.omit);
        next[c.unit] = geo ? geo.value : controls.get(c.unit).spec.value;
        next[c.key] = c.optional && !geo ? '' : c.value;
        continue;
      }
      const v = request[key];
      const mine = units.filter((u) => (u.key || c.req) === key);
      const asNumber = mine.find((u) => u.number);
      if (typeof v === 'number' && asNumber) {
        next[c.unit] = asNumber.value;
        next[c.key] = String(v);
        continue;
      }
      const [n, unit] = splitQuantity(v);
      const u = mine.find((x) => !x.number && (x.value === unit || (x.aliases || []).includes(unit))) || (unit === '' ? asNumber : null);
      next[c.key] = n;
      next[c.unit] = u ? u.value : unit;
      if (!u) add[c.unit] = [unit, key];
    }
    for (const [k, [value, key]] of Object.entries(add)) controls.get(k).set(value, { add: { key } });
    return next;
  }

  /** Shows errors beside their fields; the rest above the form. */
  function showErrors(errors) {
    const used = new Set();
    for (const f of fields) {
      const k = f.errorKeys.find((x) => errors[x]);
      if (k) used.add(k);
      f.err.textContent = k ? errors[k] : '';
      for (const c of f.spec.controls) {
        const n = controls.get(c.key).node;
        if (c.type === 'select' || c.type === 'check') continue;
        if (k) n.setAttribute('aria-invalid', 'true'); else n.removeAttribute('aria-invalid');
      }
    }
    requestError.textContent = Object.entries(errors).filter(([k]) => !used.has(k)).map(([, m]) => m).join(' ');
  }

  return { root, controls, sync, read, fromRequest, showErrors };
}
