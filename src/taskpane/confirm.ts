import { el } from './dom';

// Questions asked in the pane itself (never a browser dialog, which Office blocks): a sentence and two buttons.

/** The open question's answer in each host, so a newer question answers an older one "no" instead of leaving it waiting. */
const open = new WeakMap<HTMLElement, (value: boolean) => void>();

/** Shows a question in `host`, replacing any earlier one there (which is answered "no"); resolves true when the user confirms. */
export function askInPane(host: HTMLElement, message: string, confirmLabel: string, cancelLabel = 'Cancel'): Promise<boolean> {
  open.get(host)?.(false);
  host.replaceChildren();
  return new Promise((resolve) => {
    const text = el('p', { id: `${host.id}-question` }, [message]);
    const yes = el('button', { type: 'button', class: 'danger', 'data-answer': 'yes' }, [confirmLabel]);
    const no = el('button', { type: 'button', class: 'secondary', 'data-answer': 'no' }, [cancelLabel]);
    const box = el('div', { class: 'ask', role: 'alertdialog', 'aria-labelledby': `${host.id}-question` }, [text, el('div', { class: 'buttons' }, [yes, no])]);
    const answer = (value: boolean): void => {
      if (open.get(host) !== answer) return;
      open.delete(host);
      box.remove();
      resolve(value);
    };
    open.set(host, answer);
    yes.addEventListener('click', () => answer(true));
    no.addEventListener('click', () => answer(false));
    box.addEventListener('keydown', (e) => { if (e.key === 'Escape') answer(false); });
    host.append(box);
    no.focus();
  });
}
