/**
 * The live sheet: wires the document, the sheet, the input fields and the review panel.
 */
import 'katex/dist/katex.min.css';
import './runtime-turn.js';
import { LiveSheet, type PatchEvent } from './preview.js';
import { enableEditing, markEditable } from './editor.js';
import { changeBadge, compareToDocument, flipTone, inputChanges, renderReviewPanel, type PanelModel, type ResultChange } from './review.js';
import { fetchDocument, onDocumentChanged, writeInputs, type DocPayload } from './doc-client.js';
import { SHEET_CSS } from './sheet.js';
import { documentUnitSystem } from '../engine/index.js';
import { LiveCases } from './cases.js';
import { LiveDrivers } from './drivers.js';
import { withoutLimitMarker } from '../engine/cases/read.js';

const sheetEl = document.getElementById('lv-sheet')!;
const panelEl = document.getElementById('lv-review')!;
const statusEl = document.getElementById('lv-status')!;
const fileEl = document.getElementById('lv-file')!;

// The built page's server writes the same style sheet into the page with its first paint.
if (!document.getElementById('lv-sheet-css')) {
  const style = document.createElement('style');
  style.id = 'lv-sheet-css';
  style.textContent = SHEET_CSS;
  document.head.prepend(style);
}

const sheet = new LiveSheet(sheetEl, (el) => el.querySelector('input.lv-edit') !== null);
let loaded: DocPayload = { text: '', version: '', file: '' };
const changes = new Map<string, ResultChange>();
let dropped: string[] = [];
let message: PanelModel['message'] = null;
let writing = false;
let lastPanel = '';

function sigfigs(): number {
  const s = sheet.doc.meta.sigfigs;
  return typeof s === 'number' ? s : 4;
}

/** The change badge inside a result's element, and the loud flip marking on checks. */
function showChange(id: string): void {
  const cell = sheet.cell(id);
  const el = sheet.cellElement(id);
  if (!cell || !el || cell.kind === 'given') return;
  // A check limited to cases shows its verdict over them: its change is that verdict's (as written → as
  // last judged). Evaluating in a worker: the worker compares each result it sends; one it never sent is as loaded.
  const byCases = sheet.caseChange(id);
  const change = byCases !== undefined ? byCases
    : sheet.worker && sheet.workerChange(id) !== undefined ? sheet.workerChange(id)!
      : compareToDocument(cell, sheet.baseline.get(id), sheet.session.states.get(id), sigfigs(), documentUnitSystem(sheet.doc));
  if (change) changes.set(id, change); else changes.delete(id);
  const html = changeBadge(change);
  let badge = el.querySelector<HTMLElement>(':scope > .lv-badge');
  if (!html) badge?.remove();
  else {
    if (!badge) {
      badge = document.createElement('div');
      badge.className = 'lv-badge';
      el.append(badge);
    }
    if (badge.innerHTML !== html) badge.innerHTML = html;
  }
  const flip = change?.kind === 'check' && change.flipped ? flipTone(change.after) : null;
  for (const tone of ['fail', 'warn', 'pass'] as const) el.classList.toggle(`lv-flipped-${tone}`, flip === tone);
}

function renderPanel(): void {
  const flips = [...changes.values()].flatMap((c) => (c.kind === 'check' && c.flipped ? [{ id: c.id, label: withoutLimitMarker(sheet.cell(c.id)?.description ?? '') || c.id, before: c.before, after: c.after }] : []));
  const html = renderReviewPanel({
    file: loaded.file, inputs: inputChanges(sheet.doc, sheet.overrides), flips, changedResults: changes.size,
    dropped, message, writing,
  });
  const reviewing = sheet.overrides.size > 0;
  document.body.classList.toggle('lv-reviewing', reviewing);
  panelEl.hidden = html === '';
  if (html !== lastPanel) {
    panelEl.innerHTML = html;
    lastPanel = html;
  }
}

function showStatus(text: string): void {
  statusEl.textContent = text;
}

/** Document images are served from beside the document, under /__asset/. */
function pointAssets(): void {
  for (const img of sheetEl.querySelectorAll<HTMLImageElement>('img[src]')) {
    const src = img.getAttribute('src')!;
    if (!/^([a-z][a-z0-9+.-]*:|\/|#)/i.test(src)) img.setAttribute('src', `/__asset/${src.replace(/^\.\//, '')}`);
  }
}

/**
 * Lays every part out once, so that each remembers its height (see .lv-measure in app.css): the frames
 * after a load, and again once the fonts that this layout asked for have arrived.
 */
function reserveHeights(): void {
  const frames = () => new Promise((ok) => requestAnimationFrame(() => requestAnimationFrame(ok)));
  document.body.classList.add('lv-measure');
  void frames().then(() => document.fonts.ready).then(frames).then(() => document.body.classList.remove('lv-measure'));
}

function afterLoad(): void {
  reserveHeights();
  changes.clear();
  for (const cell of sheet.doc.graph.cells) showChange(cell.id);
  markEditable(sheetEl, describeInput);
  pointAssets();
  fileEl.textContent = loaded.file;
  const title = sheet.doc.meta.title;
  document.title = `${typeof title === 'string' ? title : loaded.file} — vaultbook`;
  cases.loaded(loaded.case);
  renderPanel();
  document.dispatchEvent(new CustomEvent('vaultbook:loaded', { detail: { version: loaded.version } }));
}

const cases = new LiveCases(sheet, document.getElementById('lv-case') as HTMLSelectElement, () => renderPanel());
document.addEventListener('vaultbook:settled', () => cases.refresh());
// Clicking a check shows what drives it and marks its dependency path.
new LiveDrivers(sheet, () => loaded.text);

sheet.onPatch((e: PatchEvent) => {
  for (const id of e.changed) showChange(id);
  for (const id of e.patched) {
    const el = sheet.cellElement(id);
    if (el && sheet.cell(id)?.kind === 'given') markEditable(el, describeInput);
  }
  renderPanel();
});

// Loads are serialised: a file change arriving during a write or another load waits its turn.
let queue: Promise<unknown> = Promise.resolve();
function serially<T>(task: () => Promise<T>): Promise<T> {
  const run = queue.then(task, task);
  queue = run.catch(() => undefined);
  return run;
}

async function show(doc: DocPayload, why: 'start' | 'disk' | 'write'): Promise<void> {
  const scroll = window.scrollY;
  loaded = doc;
  const result = await sheet.load(doc.text, doc.file, doc.archive, (d) => cases.judgeLoading(d));
  dropped = result.dropped.map((d) => d.name);
  if (why === 'disk') {
    message = { kind: 'info', text: `${doc.file} changed on disk and was reloaded.${sheet.overrides.size ? ' Your trial values are kept.' : ''}` };
  }
  afterLoad();
  window.scrollTo(0, scroll);
  showStatus(`version ${doc.version.slice(0, 8)} · watching for changes`);
}

function reloadFromDisk(): Promise<void> {
  return serially(async () => {
    const doc = await fetchDocument();
    if (doc.version !== loaded.version) await show(doc, 'disk');
  });
}

function writeBack(): Promise<void> {
  return serially(async () => {
    const values = Object.fromEntries(sheet.overrides);
    writing = true;
    message = null;
    renderPanel();
    const reply = await writeInputs(loaded.version, values);
    writing = false;
    if (reply.ok) {
      await show({ text: reply.text, version: reply.version, file: loaded.file, archive: reply.archive }, 'write');
      const names = reply.changed.join(', ');
      message = { kind: 'ok', text: `Wrote ${reply.changed.length} input${reply.changed.length === 1 ? '' : 's'} into ${loaded.file}: ${names}.${reply.notes.length ? ' ' + reply.notes.join(' ') : ''}` };
    } else {
      message = { kind: 'error', text: reply.message, conflict: reply.conflict === true };
    }
    renderPanel();
    document.dispatchEvent(new CustomEvent('vaultbook:written', { detail: reply }));
  });
}

panelEl.addEventListener('click', (e) => {
  const button = (e.target as HTMLElement).closest<HTMLElement>('[data-action], [data-goto]');
  if (!button) return;
  e.preventDefault();
  if (button.dataset.goto) {
    sheet.cellElement(button.dataset.goto)?.scrollIntoView({ block: 'center', behavior: 'smooth' });
    return;
  }
  switch (button.dataset.action) {
    case 'reset-all':
      sheet.resetAll();
      dropped = [];
      message = null;
      break;
    case 'reset-one':
      sheet.resetInput(button.dataset.name!);
      break;
    case 'write':
      void writeBack();
      return;
    case 'reload':
      void reloadFromDisk();
      return;
  }
  renderPanel();
});

document.getElementById('lv-print')!.addEventListener('click', () => window.print());

// Alt+R: to the trial values from anywhere (the write action is then one or two Tab presses away).
document.addEventListener('keydown', (e) => {
  if (!e.altKey || e.ctrlKey || e.metaKey || e.key.toLowerCase() !== 'r' || panelEl.hidden) return;
  e.preventDefault();
  (panelEl.querySelector<HTMLElement>('[data-action="write"]') ?? panelEl).focus();
});

/** What an input is, for its accessible name: "t, ring thickness". */
function describeInput(name: string): string {
  const description = sheet.cell(name)?.description;
  return description ? `${name}, ${description}` : name;
}

enableEditing(sheetEl, {
  current: (name) => sheet.sourceOf(name),
  documentText: (name) => sheet.documentSourceOf(name),
  describe: describeInput,
  documentValue: (name) => {
    const s = sheet.baseline.get(name);
    return s?.status === 'ok' ? s.value : undefined;
  },
  apply: (name, text) => {
    const d = sheet.setInput(name, text);
    if (!d) message = null;
    // With the edit's results (a patch renders the panel too), so that the edit's own task writes nothing.
    sheet.withAnswer(renderPanel);
    return d ? d.message : null;
  },
  closed: () => sheet.release(),
  withAnswer: (fn) => sheet.withAnswer(fn),
});

onDocumentChanged((version) => {
  if (version !== loaded.version) void reloadFromDisk();
});

/** For tests and the benchmark: the live objects. */
declare global {
  interface Window {
    vaultbook: { sheet: LiveSheet; cases: LiveCases; version(): string; ready: Promise<void>; reload(): Promise<void>; write(): Promise<void> };
  }
}

/**
 * First paint: the built page's server renders the sheet when it starts; it is shown at once, marked
 * as waiting (not editable yet), until the live sheet, evaluated here, takes its place. The server
 * writes it into the page itself; /__sheet is asked only when it did not.
 */
function paintFirst(): void {
  if (import.meta.hot) return; // the development server has no /__sheet
  document.body.classList.add('lv-waiting');
  showStatus('computing the sheet…');
  if (sheetEl.firstElementChild) return;
  void fetch('/__sheet', { cache: 'no-store' }).then((r) => (r.ok ? r.json() as Promise<{ html: string }> : null)).then((first) => {
    if (first && document.body.classList.contains('lv-waiting')) {
      sheetEl.innerHTML = first.html;
      pointAssets();
    }
  }, () => undefined);
}
paintFirst();

const ready = serially(async () => {
  try {
    await show(await fetchDocument(), 'start');
    document.body.classList.remove('lv-waiting');
  } catch (e) {
    showStatus((e as Error).message);
    throw e;
  }
});
window.vaultbook = { sheet, cases, version: () => loaded.version, ready, reload: reloadFromDisk, write: writeBack };
