// The references the core uses: a References dialog listing every entry with a "Copy BibTeX"
// button each, and a source dialog that any number's source opens (click, or Enter/Space on the
// focused number) with the BibTeX of each reference its source text cites. The list comes from
// the core (`references()`: id, short citation, full fields, BibTeX); a source text cites an
// entry when it contains the entry's short citation, which is exactly how the core writes it.
// Nothing is fetched: the page makes no network request. No physics here.
import { el } from './util.js';
import { references as coreReferences } from './core.js';

let list = [];

/** Copies `text`: the Clipboard API where the page may use it, else a selected textarea. */
async function copy(text, button, host) {
  let ok = false;
  try {
    if (navigator.clipboard && window.isSecureContext) {
      await navigator.clipboard.writeText(text);
      ok = true;
    }
  } catch (e) {
    ok = false;
  }
  if (!ok) {
    // Inside the open dialog (a modal dialog makes the rest of the page inert).
    const ta = el('textarea', { class: 'copy-buffer', 'aria-hidden': 'true', readonly: true });
    ta.value = text;
    host.append(ta);
    ta.select();
    try { ok = document.execCommand('copy'); } catch (e) { ok = false; }
    ta.remove();
  }
  const was = button.dataset.label || button.textContent;
  button.dataset.label = was;
  button.textContent = ok ? 'Copied' : 'Copy failed: select the BibTeX below';
  button.setAttribute('data-copied', ok ? 'yes' : 'no');
  setTimeout(() => { button.textContent = was; }, 2500);
  return ok;
}

/** One reference: its short citation, full reference, what it is used for and its BibTeX. */
function entry(r, host, { usedFor = true } = {}) {
  const pre = el('pre', { class: 'bibtex', text: r.bibtex, tabindex: '0', 'aria-label': `BibTeX of ${r.short}` });
  pre.hidden = true;
  const show = el('button', { type: 'button', class: 'small', 'aria-expanded': 'false', text: 'Show BibTeX',
    onclick: () => {
      pre.hidden = !pre.hidden;
      show.setAttribute('aria-expanded', pre.hidden ? 'false' : 'true');
      show.textContent = pre.hidden ? 'Show BibTeX' : 'Hide BibTeX';
    } });
  const btn = el('button', { type: 'button', class: 'small copy-bibtex', 'data-ref': r.id, text: 'Copy BibTeX',
    onclick: () => { pre.hidden = false; show.textContent = 'Hide BibTeX'; copy(r.bibtex, btn, host); } });
  const links = [r.arxiv ? `arXiv:${r.arxiv}` : null, r.doi ? `doi:${r.doi}` : null].filter(Boolean).join(' · ');
  return el('li', { class: 'ref', 'data-ref': r.id },
    el('div', { class: 'ref-head' }, el('b', { text: r.short }), el('span', { class: 'ref-tools' }, btn, show)),
    el('div', { class: 'ref-title', text: `${r.authors.join('; ')} (${r.year}). ${r.title}.` }),
    links ? el('div', { class: 'ref-ids', text: links }) : null,
    usedFor ? el('div', { class: 'muted', text: `Used for: ${r.used_for}` }) : null,
    pre);
}

function dialog(id, title) {
  const close = el('button', { type: 'button', class: 'small', text: 'Close' });
  const body = el('div', { class: 'dialog-body' });
  const d = el('dialog', { id, class: 'ref-dialog', 'aria-labelledby': `${id}-title` },
    el('div', { class: 'dialog-head' }, el('h2', { id: `${id}-title`, text: title }), close), body);
  close.addEventListener('click', () => d.close());
  document.body.append(d);
  return { d, body };
}

let refsDialog = null;
let srcDialog = null;

/** The references cited by a source text (its short citations), in the order the text cites them. */
export function citedIn(text) {
  return list.filter((r) => text.includes(r.short)).sort((a, b) => text.indexOf(a.short) - text.indexOf(b.short));
}

/** Opens the dialog listing every reference. */
export function showReferences() {
  refsDialog.d.showModal();
}

/** Opens the dialog for one source text: the text and the BibTeX of each reference it cites. */
export function showSource(text) {
  const { d, body } = srcDialog;
  const cited = citedIn(text);
  body.replaceChildren(
    el('p', { class: 'source-text', text }),
    cited.length
      ? el('ul', { class: 'ref-list' }, cited.map((r) => entry(r, d, { usedFor: false })))
      : el('p', { class: 'muted', text: 'This text cites no publication: it is a regime check, or chiwave\'s own derivation in the docs/physics notes of its repository.' }),
  );
  d.showModal();
  const first = body.querySelector('button');
  if (first) first.focus();
}

/** Builds both dialogs, the References button and the click/keyboard hook on every source. */
export function installReferences(button) {
  list = coreReferences();
  refsDialog = dialog('references-dialog', `References (${list.length})`);
  const all = el('button', { type: 'button', class: 'small', text: 'Copy all BibTeX' });
  all.addEventListener('click', () => copy(list.map((r) => r.bibtex).join('\n'), all, refsDialog.d));
  refsDialog.body.append(
    el('p', { class: 'muted' }, 'Every publication chiwave uses. The page and the CLI (', el('code', { text: 'chiwave sources --bibtex' }), ') give the same list. ', all),
    el('ul', { class: 'ref-list' }, list.map((r) => entry(r, refsDialog.d))),
  );
  srcDialog = dialog('source-dialog', 'Source');
  button.addEventListener('click', showReferences);
  // A source element, unless the event is meant for a control inside it or for a dialog.
  const find = (e) => {
    if (!(e.target instanceof Element) || e.target.closest('input, select, textarea, button, a, label, dialog')) return null;
    return e.target.closest('[data-source]');
  };
  document.addEventListener('click', (e) => {
    const t = find(e);
    if (t) showSource(t.getAttribute('data-source'));
  });
  document.addEventListener('keydown', (e) => {
    if (e.key !== 'Enter' && e.key !== ' ') return;
    const t = find(e);
    if (t) {
      e.preventDefault();
      showSource(t.getAttribute('data-source'));
    }
  });
}
