/**
 * In-place editing of the sheet's inputs.
 *
 * Every element `data-input="name"` becomes editable: click it, or tab to it
 * and press Enter, and a text field opens with the value text in use. Nothing
 * is applied while typing, so no half-typed value ever shows as a result. The
 * edit is applied when it is committed: Enter, or leaving the field. A value
 * must evaluate and keep the input's dimension (a thickness stays a length);
 * otherwise it is refused with a message beside the field, the field is
 * marked invalid, and it stays open — a value is never dropped without a
 * word. Escape goes back to the value the field opened with. A bare number
 * keeps the document's unit: `7` for a span written `6.4 m` means `7 m`; the
 * document's value typed again (`5.40` for `5.4 m`) is no change.
 */
import { readInputValue, sameValue, valueOfText } from '../engine/values/input-value.js';

export { withDocumentUnit } from '../engine/values/input-value.js';

export interface EditorHost {
  /** The value text in use now. */
  current(name: string): string;
  /** The document's own value text. */
  documentText(name: string): string;
  /** The document's own value (evaluated), for its unit and dimension. */
  documentValue(name: string): unknown;
  /** Applies a value text; returns an error message when it is refused. */
  apply(name: string, text: string): string | null;
  /** Called when a field closes, so held-back patches can land. */
  closed(name: string): void;
  /** What the input is, for its accessible name: "t, ring thickness". */
  describe(name: string): string;
  /**
   * Runs a change of the page that follows an applied edit (closing its field), when the edit's
   * results are patched or soon after (LiveSheet.withAnswer); at once when absent.
   */
  withAnswer?(fn: () => void): void;
}

/**
 * Makes every `[data-input]` inside root editable.
 * @returns a function that removes the handlers
 */
export function enableEditing(root: HTMLElement, host: EditorHost): () => void {
  /** The input whose element should get focus back once the sheet has patched it. */
  let refocus: string | null = null;

  const open = (target: HTMLElement) => {
    const name = target.dataset.input!;
    if (target.querySelector('input.lv-edit')) return;
    const opened = host.current(name);
    const field = document.createElement('input');
    field.type = 'text';
    field.className = 'lv-edit';
    field.value = opened;
    field.spellcheck = false;
    field.setAttribute('aria-label', `${host.describe(name)}: value`);
    field.dataset.edit = name;
    field.size = Math.max(6, opened.length + 2);
    const msg = document.createElement('span');
    msg.className = 'lv-edit-msg';
    msg.id = `lv-edit-msg-${name}`;
    msg.setAttribute('role', 'alert');
    field.setAttribute('aria-describedby', msg.id);
    const shown = target.innerHTML;
    target.replaceChildren(field, msg);
    target.classList.add('lv-editing');
    field.focus();
    field.select();
    let closing = false;

    const report = (message: string | null) => {
      field.classList.toggle('lv-edit-bad', message !== null);
      if (message === null) field.removeAttribute('aria-invalid');
      else field.setAttribute('aria-invalid', 'true');
      msg.textContent = message ?? '';
    };
    /** Applies the field's text; false (with the message shown) when it is refused. */
    const commit = (): boolean => {
      const reading = field.value.trim() === opened.trim() ? null : readInputValue(name, field.value, host.documentValue(name));
      let error: string | null = null;
      if (reading && !reading.ok) error = reading.message;
      // The value in use, typed again another way, is no change; the document's value clears the override.
      else if (reading && !sameValue(reading.value, valueOfText(host.current(name)))) {
        error = host.apply(name, sameValue(reading.value, host.documentValue(name)) ? host.documentText(name) : reading.text);
      }
      report(error);
      return error === null;
    };
    const close = (keepFocus: boolean) => {
      if (closing) return;
      closing = true;
      target.classList.remove('lv-editing');
      // Put back what was shown; the sheet patches the cell with its new value right after.
      if (target.contains(field)) target.innerHTML = shown;
      refocus = keepFocus ? name : null;
      if (keepFocus) target.focus();
      host.closed(name);
    };
    field.addEventListener('keydown', (e) => {
      if (e.key === 'Enter') {
        e.preventDefault();
        if (commit()) (host.withAnswer ?? ((fn: () => void) => fn()))(() => close(true));
      } else if (e.key === 'Escape') {
        e.preventDefault();
        close(true);
      }
    });
    field.addEventListener('blur', () => {
      if (closing) return;
      // Leaving the field commits it; a refused value keeps the field open with its message.
      if (commit()) close(false);
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
  /** The sheet replaced the input's element: put the focus back on the new one. */
  const onPatched = () => {
    if (!refocus) return;
    const active = document.activeElement;
    if (active && active !== document.body && root.contains(active) && (active as HTMLElement).dataset.input === refocus) return;
    if (active && active !== document.body && !root.contains(active)) {
      refocus = null;
      return;
    }
    const el = root.querySelector<HTMLElement>(`[data-input="${CSS.escape(refocus)}"]`);
    el?.focus({ preventScroll: true });
  };
  root.addEventListener('click', onClick);
  root.addEventListener('keydown', onKey);
  document.addEventListener('vaultbook:patched', onPatched);
  document.addEventListener('vaultbook:settled', onPatched);
  return () => {
    root.removeEventListener('click', onClick);
    root.removeEventListener('keydown', onKey);
    document.removeEventListener('vaultbook:patched', onPatched);
    document.removeEventListener('vaultbook:settled', onPatched);
  };
}

/**
 * Marks inputs as editable for keyboard and screen readers (call after each render or patch).
 * @param describe what an input is ("t, ring thickness"), for its accessible name
 */
export function markEditable(root: ParentNode, describe: (name: string) => string = (n) => n): void {
  for (const el of root.querySelectorAll<HTMLElement>('[data-input]')) {
    if (el.querySelector('input.lv-edit')) continue;
    if (el.tabIndex !== 0) el.tabIndex = 0;
    el.setAttribute('role', 'button');
    const label = `${describe(el.dataset.input!)} = ${el.textContent?.trim() ?? ''}; press Enter to change`;
    if (el.getAttribute('aria-label') !== label) el.setAttribute('aria-label', label);
    el.title = el.title || 'change this input';
  }
}
