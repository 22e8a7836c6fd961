// Declarative input forms: each field has a text box and, for quantities, a unit selector.
// The JS only assembles the request; the core parses numbers with units and validates them.
import { el, splitQuantity } from './util.js';

/**
 * Field spec:
 *   { key, label, hint?, type: 'quantity' | 'number' | 'select',
 *     units?: [[value, label], ...]  (quantity; value '' = bare number),
 *     geometric?: true               (quantity: first unit option means "omit the field"),
 *     options?: [[value, label], ...] (select), integer?: bool,
 *     value?: default text, unit?: default unit, optional?: bool (empty → omitted),
 *     group?: 'title of a group starting at this field' }
 */
export function buildForm(fields, onChange) {
  const root = el('form', { class: 'form', novalidate: true, onsubmit: (e) => e.preventDefault() });
  const requestError = el('p', { class: 'request-error', role: 'alert' });
  root.append(requestError);
  const controls = new Map();

  for (const f of fields) {
    if (f.group) root.append(el('div', { class: 'group' }, el('p', { class: 'group-title', text: f.group })));
    const id = `f-${f.view}-${f.key}`;
    const errId = `${id}-err`;
    const wrap = el('div', { class: 'field', 'data-field': f.key });
    const label = el('label', { class: 'name', for: id }, f.label, f.hint ? el('span', { class: 'hint' }, ` ${f.hint}`) : null);
    const err = el('p', { class: 'field-error', id: errId, role: 'alert', 'data-error-for': f.key });
    let input, unit = null;
    if (f.type === 'select') {
      input = el('select', { id, name: f.key, 'aria-describedby': errId });
      for (const [v, l] of f.options) input.append(el('option', { value: v, text: l }));
      input.value = String(f.value ?? f.options[0][0]);
    } else {
      input = el('input', {
        id, name: f.key, type: 'text', inputmode: 'decimal', autocomplete: 'off', spellcheck: 'false',
        value: f.value ?? '', 'aria-describedby': errId, placeholder: f.placeholder || (f.optional ? 'optional' : ''),
      });
      if (f.type === 'quantity') {
        unit = el('select', { id: `${id}-unit`, name: `${f.key}-unit`, 'aria-label': `${f.label} unit` });
        for (const [v, l] of f.units) unit.append(el('option', { value: v, text: l }));
        unit.value = f.unit ?? f.units[0][0];
      }
    }
    const row = el('div', { class: 'row' }, input, unit);
    wrap.append(label, row, err);
    root.append(wrap);
    controls.set(f.key, { f, input, unit, err });
    const sync = () => {
      if (f.geometric && unit) {
        const geo = unit.value === f.units[0][0];
        input.disabled = geo;
        if (geo) input.setAttribute('placeholder', 'M = 1 (geometric units)');
        else input.setAttribute('placeholder', '');
      }
    };
    sync();
    input.addEventListener('input', onChange);
    input.addEventListener('change', onChange);
    if (unit) unit.addEventListener('change', () => { sync(); onChange(); });
    controls.get(f.key).sync = sync;
  }

  /** Reads the request fields; returns {fields} or {errors: {key: message}} for text that is not a number. */
  function read() {
    const out = {};
    const errors = {};
    for (const [key, { f, input, unit }] of controls) {
      const text = input.value.trim();
      if (f.type === 'select') {
        out[key] = f.integer ? Number(input.value) : input.value;
        continue;
      }
      if (f.type === 'quantity') {
        if (f.geometric && unit.value === f.units[0][0]) continue; // geometric: field omitted
        if (text === '' && f.optional) continue;
        out[key] = unit.value ? `${text} ${unit.value}` : text;
        continue;
      }
      // plain number
      if (text === '') {
        if (f.optional) continue;
        errors[key] = `${key}: enter a number`;
        continue;
      }
      const v = Number(text.replace('−', '-'));
      if (Number.isNaN(v) && !/^[+-]?nan$/i.test(text)) {
        errors[key] = `${key}: cannot read '${text}' as a number`;
        continue;
      }
      out[key] = v;
    }
    return Object.keys(errors).length ? { errors } : { fields: out };
  }

  /** Shows errors next to their fields; unknown fields go to the form-level box. */
  function showErrors(errors) {
    const general = [];
    for (const [key, c] of controls) {
      const msg = errors[key];
      c.err.textContent = msg || '';
      if (msg) c.input.setAttribute('aria-invalid', 'true');
      else c.input.removeAttribute('aria-invalid');
    }
    for (const [key, msg] of Object.entries(errors)) if (!controls.has(key)) general.push(msg);
    requestError.textContent = general.join(' ');
  }

  /** Fills the form from a request object (scenario). */
  function load(request) {
    for (const [key, c] of controls) {
      const { f, input, unit } = c;
      const v = request[key];
      if (f.type === 'select') {
        input.value = String(v ?? f.value ?? f.options[0][0]);
      } else if (f.type === 'quantity') {
        if (v === undefined || v === null) {
          if (f.geometric) { unit.value = f.units[0][0]; input.value = f.value ?? ''; }
          else { input.value = f.optional ? '' : (f.value ?? ''); unit.value = f.unit ?? f.units[0][0]; }
        } else {
          const [num, u] = splitQuantity(v);
          input.value = num;
          const want = u || (f.units.some(([x]) => x === '') ? '' : (f.bareUnit ?? f.units[0][0]));
          if (![...unit.options].some((o) => o.value === want)) unit.append(el('option', { value: want, text: want }));
          unit.value = want;
        }
        c.sync();
      } else {
        input.value = v === undefined || v === null ? (f.value ?? '') : String(v);
      }
    }
  }

  return { root, read, showErrors, load, controls };
}
