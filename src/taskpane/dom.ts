import { parseStrictNumber } from './numbers';

// Small DOM helpers. Every string from the catalogue, the workbook or the user goes into the page as a
// text node (textContent), never as markup.

type Attrs = Record<string, string>;

export function el<K extends keyof HTMLElementTagNameMap>(tag: K, attrs: Attrs = {}, children: (Node | string)[] = []): HTMLElementTagNameMap[K] {
  const node = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs)) node.setAttribute(k, v);
  for (const c of children) node.append(typeof c === 'string' ? document.createTextNode(c) : c);
  return node;
}

/** A labelled input; `group` names the block fields it belongs to, so only the chosen block's fields show. */
export function field(id: string, label: string, input: HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement, attrs: Attrs = {}): HTMLElement {
  input.id = id;
  return el('div', { class: 'field', ...attrs }, [el('label', { for: id, id: `${id}-label` }, [label]), input]);
}

/** A number box: text with a decimal keyboard, so "4,76" reaches the parser instead of becoming blank. */
export function numberInput(value: string): HTMLInputElement {
  return el('input', { type: 'text', inputmode: 'decimal', value, autocomplete: 'off', spellcheck: 'false' });
}

export function textInput(value = '', placeholder = ''): HTMLInputElement {
  const input = el('input', { type: 'text', value, autocomplete: 'off', spellcheck: 'false' });
  if (placeholder !== '') input.placeholder = placeholder;
  return input;
}

/** Grows a wrapping text box to its content, so a long name shows whole at 320 px. */
export function fitHeight(box: HTMLTextAreaElement): void {
  box.style.height = 'auto';
  box.style.height = `${box.scrollHeight + 2}px`;
}

/**
 * A one-line text box that wraps instead of scrolling sideways (a reagent name of 40 characters shows whole
 * in a narrow pane); Enter does not add a line, and pasted line breaks become spaces.
 */
export function wrappingTextInput(value = ''): HTMLTextAreaElement {
  const box = el('textarea', { rows: '1', autocomplete: 'off', spellcheck: 'false', class: 'wrapping' }, [value]);
  box.addEventListener('keydown', (e) => { if (e.key === 'Enter') e.preventDefault(); });
  box.addEventListener('input', () => {
    if (/[\r\n]/.test(box.value)) box.value = box.value.replace(/[\r\n]+/g, ' ');
    fitHeight(box);
  });
  return box;
}

/** Sets a box's text as the user would see it typed (a wrapping box refits its height). */
export function setText(id: string, value: string): void {
  const box = byId<HTMLInputElement | HTMLTextAreaElement>(id);
  box.value = value;
  if (box instanceof HTMLTextAreaElement) fitHeight(box);
}

export function byId<T extends HTMLElement = HTMLElement>(id: string): T {
  return document.getElementById(id) as T;
}

export function str(id: string): string {
  return byId<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>(id).value;
}

/** The visible label of a field, for messages. */
export function labelOf(id: string): string {
  return document.getElementById(`${id}-label`)?.textContent ?? id;
}

/** A number from a box, refused with its label when blank or not a number (never read as 0). */
export function num(id: string): number {
  return parseStrictNumber(str(id), labelOf(id));
}
