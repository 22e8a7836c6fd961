// Page start-up: load the core, build the tabs and views, scenarios (built-in and from a file).
import { el, installTooltips, download } from './util.js';
import { makeView } from './viewkit.js';
import { loadCore, info, checkScenario } from './core.js';
import { installReferences } from './references.js';
import { VIEWS } from './views/index.js';
import { SCENARIOS } from '../pkg/scenarios.js';

const main = document.getElementById('main');
const tabs = document.getElementById('tabs');
const note = document.getElementById('scenario-note');
const pick = document.getElementById('scenario-pick');
const fileInput = document.getElementById('scenario-file');
const views = new Map();
let active = null;

function say(text, isError = false) {
  note.textContent = text;
  note.classList.toggle('error', isError);
}

/** The view with id `id` or with `id` among its former ids (#view=radiation is the waveform view). */
function viewFor(id) {
  return views.get(id) || [...views.values()].find((v) => v.aliases.includes(id)) || null;
}

function activate(id, focus = false) {
  const v = viewFor(id);
  if (!v) return;
  active = v;
  for (const [vid, view] of views) {
    const on = view === v;
    view.root.hidden = !on;
    const tab = document.getElementById(`tab-${vid}`);
    tab.setAttribute('aria-selected', on ? 'true' : 'false');
    tab.tabIndex = on ? 0 : -1;
    if (on && focus) tab.focus();
  }
}

function applyScenario(s, origin) {
  const checked = checkScenario(s);
  const kind = checked.request.kind;
  const v = [...views.values()].find((x) => x.kind === kind);
  if (!v) throw Object.assign(new Error(`scenario: no view for kind '${kind}' in this page`), { field: 'kind' });
  activate(v.id);
  v.load(checked.request);
  say(`${origin}: ${checked.name} — ${checked.description}`);
}

async function start() {
  // The raw wasm module, for the console, the bench page and the end-to-end tests.
  window.chiwave = await loadCore();
  const facts = info();
  document.getElementById('notice-text').textContent = facts.notice;
  document.getElementById('version').textContent = `chiwave ${facts.version}`;

  for (const spec of VIEWS) {
    const view = makeView(spec);
    views.set(spec.id, view);
    main.append(view.root);
    const tab = el('button', { type: 'button', role: 'tab', id: `tab-${spec.id}`, 'aria-controls': view.root.id, text: spec.title,
      onclick: () => { activate(spec.id); view.update(); } });
    tabs.append(tab);
  }
  // The views' state (getState/setState), for the end-to-end tests and the console.
  window.chiwavePage = { view: (id) => viewFor(id), get active() { return active; } };
  tabs.addEventListener('keydown', (e) => {
    const ids = [...views.keys()];
    const i = ids.indexOf(active.id);
    if (e.key === 'ArrowRight' || e.key === 'ArrowLeft') {
      const j = (i + (e.key === 'ArrowRight' ? 1 : ids.length - 1)) % ids.length;
      activate(ids[j], true);
      views.get(ids[j]).update();
      e.preventDefault();
    }
  });
  installTooltips(document.body);
  installReferences(document.getElementById('references-open'));

  for (const s of SCENARIOS) pick.append(el('option', { value: s.stem, text: `${s.name} (${s.request.kind})` }));
  pick.addEventListener('change', () => {
    const s = SCENARIOS.find((x) => x.stem === pick.value);
    if (!s) return;
    try { applyScenario(s, 'Demo scenario'); } catch (e) { say(e.message, true); }
  });
  fileInput.addEventListener('change', () => {
    const f = fileInput.files && fileInput.files[0];
    if (!f) return;
    const reader = new FileReader();
    reader.onload = () => {
      try {
        applyScenario(JSON.parse(String(reader.result)), `From ${f.name}`);
        pick.value = '';
      } catch (e) {
        say(`${f.name}: ${e.message}`, true);
      }
      fileInput.value = '';
    };
    reader.onerror = () => say(`${f.name}: could not be read`, true);
    reader.readAsText(f);
  });
  document.querySelector('label.file-btn').addEventListener('keydown', (e) => {
    if (e.key === 'Enter' || e.key === ' ') { e.preventDefault(); fileInput.click(); }
  });
  document.getElementById('scenario-save').addEventListener('click', () => {
    const req = active && active.request();
    if (!req) { say('Nothing to save: fix the marked inputs first.', true); return; }
    const s = { name: `My ${active.title.toLowerCase()} scenario`, description: 'Saved from the chiwave page.', request: req };
    download(`chiwave-${active.id}-scenario.json`, JSON.stringify(s, null, 2), 'application/json');
  });

  // #scenario=stem or #view=id (a former view id still works)
  const hash = new URLSearchParams(location.hash.slice(1));
  activate(viewFor(hash.get('view') || '') ? hash.get('view') : VIEWS[0].id);
  for (const v of views.values()) v.update();
  const want = hash.get('scenario');
  if (want) {
    const s = SCENARIOS.find((x) => x.stem === want);
    if (s) { pick.value = s.stem; applyScenario(s, 'Demo scenario'); } else say(`No built-in scenario '${want.slice(0, 40)}'.`, true);
  }
  document.body.dataset.ready = 'true';
}

start().catch((e) => {
  say(`The calculator could not start: ${e && e.message ? e.message : e}`, true);
  console.error(e);
});
