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
export function field(id: string, label: string, input: HTMLInputElement | HTMLSelectElement, attrs: Attrs = {}): HTMLElement {
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

export function byId<T extends HTMLElement = HTMLElement>(id: string): T {
  return document.getElementById(id) as T;
}

export function str(id: string): string {
  return byId<HTMLInputElement | HTMLSelectElement>(id).value;
}

/** The visible label of a field, for messages. */
export function labelOf(id: string): string {
  return document.getElementById(`${id}-label`)?.textContent ?? id;
}

/** A number from a box, refused with its label when blank or not a number (never read as 0). */
export function num(id: string): number {
  return parseStrictNumber(str(id), labelOf(id));
}
