/**
 * In-place editing of the sheet's inputs.
 *
 * Every element `data-input="name"` becomes editable: click it, or tab to it,
 * and a text field opens with the value text in use. A value with the same
 * kind of unit as the document's applies as you type; Enter applies anything
 * (errors then show on the sheet), Escape goes back to the value the field
 * opened with. A bare number keeps the document's unit: `7` for a span
 * written `6.4 m` means `7 m`.
 */
import { evaluateUntrusted } from '../engine/sandbox/index.js';

export interface EditorHost {
  /** The value text in use now. */
  current(name: string): string;
  /** The document's own value (evaluated), for its unit. */
  documentValue(name: string): unknown;
  /** Applies a value text; returns an error message when it is refused. */
  apply(name: string, text: string): string | null;
  /** Called when a field closes, so held-back patches can land. */
  closed(name: string): void;
}

const NUMBER = /^\s*[-+−]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?\s*$/;

interface UnitLike { isUnit: true; units: unknown[]; formatUnits(): string; equalBase(u: unknown): boolean }

function isUnit(v: unknown): v is UnitLike {
  return typeof v === 'object' && v !== null && (v as { isUnit?: boolean }).isUnit === true;
}

/**
 * The value text to apply: a bare number gets the unit of the document's value.
 * @example withDocumentUnit('7', math.unit(6.4, 'm')) // "7 m"
 * @example withDocumentUnit('7 ft', math.unit(6.4, 'm')) // "7 ft"
 */
export function withDocumentUnit(text: string, documentValue: unknown): string {
  const t = text.trim().replace(/^−/, '-');
  if (!NUMBER.test(t) || !isUnit(documentValue) || documentValue.units.length === 0) return t;
  const unit = documentValue.formatUnits().replace(/\s*\/\s*/g, '/').replace(/\s*\^\s*/g, '^').trim();
  return unit ? `${t} ${unit}` : t;
}

/**
 * Can this text be applied while the user is still typing? Only when it reads
 * as a value of the same kind as the document's (so "7 k" on the way to
 * "7 kN" does not flash errors through the sheet).
 */
export function isSameKind(text: string, documentValue: unknown): boolean {
  // Through the same sandbox as every cell; a refused or failing text is not "the same kind".
  const reading = evaluateUntrusted(text);
  if (!reading.ok) return false;
  const value = reading.value;
  if (isUnit(documentValue)) return isUnit(value) && documentValue.equalBase(value);
  if (typeof documentValue === 'number') return typeof value === 'number' && Number.isFinite(value);
  return typeof value === typeof documentValue;
}

/**
 * Makes every `[data-input]` inside root editable.
 * @returns a function that removes the handlers
 */
export function enableEditing(root: HTMLElement, host: EditorHost): () => void {
  const open = (target: HTMLElement) => {
    const name = target.dataset.input!;
    if (target.querySelector('input.lv-edit')) return;
    const opened = host.current(name);
    const field = document.createElement('input');
    field.type = 'text';
    field.className = 'lv-edit';
    field.value = opened;
    field.spellcheck = false;
    field.setAttribute('aria-label', `value of ${name}`);
    field.dataset.edit = name;
    field.size = Math.max(6, opened.length + 2);
    const shown = target.innerHTML;
    target.replaceChildren(field);
    target.classList.add('lv-editing');
    field.focus();
    field.select();
    let lastApplied = opened;
    let closing = false;

    const report = (message: string | null) => {
      field.classList.toggle('lv-edit-bad', message !== null);
      field.title = message ?? '';
    };
    const applyText = (raw: string, force: boolean) => {
      const text = withDocumentUnit(raw, host.documentValue(name));
      if (text === '' || text === lastApplied) return;
      if (!force && !isSameKind(text, host.documentValue(name))) {
        report('not applied yet: press Enter to apply this value anyway');
        return;
      }
      const error = host.apply(name, text);
      report(error);
      if (!error) lastApplied = text;
    };
    const close = () => {
      if (closing) return;
      closing = true;
      target.classList.remove('lv-editing');
      // Put back what was shown; the sheet patches the cell with its new value right after.
      if (target.contains(field)) target.innerHTML = shown;
      host.closed(name);
    };
    field.addEventListener('input', () => applyText(field.value, false));
    field.addEventListener('keydown', (e) => {
      if (e.key === 'Enter') {
        e.preventDefault();
        applyText(field.value, true);
        if (!field.classList.contains('lv-edit-bad')) close();
      } else if (e.key === 'Escape') {
        e.preventDefault();
        if (lastApplied !== opened) host.apply(name, opened);
        close();
      }
    });
    field.addEventListener('blur', () => {
      if (field.value.trim() !== '' && !field.classList.contains('lv-edit-bad')) applyText(field.value, false);
      close();
    });
  };

  const onClick = (e: Event) => {
    const target = (e.target as HTMLElement).closest<HTMLElement>('[data-input]');
    if (target && root.contains(target)) open(target);
  };
  const onKey = (e: KeyboardEvent) => {
    const target = e.target as HTMLElement;
    if ((e.key === 'Enter' || e.key === ' ') && target.matches?.('[data-input]')) {
      e.preventDefault();
      open(target);
    }
  };
  root.addEventListener('click', onClick);
  root.addEventListener('keydown', onKey);
  return () => {
    root.removeEventListener('click', onClick);
    root.removeEventListener('keydown', onKey);
  };
}

/** Marks inputs as editable for keyboard and screen readers (call after each render or patch). */
export function markEditable(root: ParentNode): void {
  for (const el of root.querySelectorAll<HTMLElement>('[data-input]')) {
    if (el.tabIndex !== 0) el.tabIndex = 0;
    el.setAttribute('role', 'button');
    el.title = el.title || 'change this input';
  }
}
