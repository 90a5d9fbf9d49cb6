import { el } from './dom';

// Questions asked in the pane itself (never a browser dialog, which Office blocks): a sentence and two buttons.

/** Shows a question in `host`, replacing any earlier one there; resolves true when the user confirms. */
export function askInPane(host: HTMLElement, message: string, confirmLabel: string, cancelLabel = 'Cancel'): Promise<boolean> {
  host.replaceChildren();
  return new Promise((resolve) => {
    const text = el('p', { id: `${host.id}-question` }, [message]);
    const yes = el('button', { type: 'button', class: 'danger', 'data-answer': 'yes' }, [confirmLabel]);
    const no = el('button', { type: 'button', class: 'secondary', 'data-answer': 'no' }, [cancelLabel]);
    const box = el('div', { class: 'ask', role: 'alertdialog', 'aria-labelledby': `${host.id}-question` }, [text, el('div', { class: 'buttons' }, [yes, no])]);
    const answer = (value: boolean): void => { host.replaceChildren(); resolve(value); };
    yes.addEventListener('click', () => answer(true));
    no.addEventListener('click', () => answer(false));
    box.addEventListener('keydown', (e) => { if (e.key === 'Escape') answer(false); });
    host.append(box);
    no.focus();
  });
}
