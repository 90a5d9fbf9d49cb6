import { readStoredSystems } from '../functions/workbookSystems';
import type { SettingsLike } from '../functions/workbookSystems';
import { askInPane } from './confirm';
import { deleteDefinition, definitionFromInputs, saveDefinition } from './customStore';
import { byId, el, field, numberInput, str, textInput } from './dom';
import { failureText, setStatus } from './status';

// The custom-system form and the list of what the workbook stores (each valid or invalid, with its reason).

let firstList = true;
let settings: () => SettingsLike = () => { throw new Error('no workbook settings'); };
let changed: () => void = () => undefined;

/** Asks Excel to recalculate, so cells that use a changed custom system show its new values. */
async function recalculate(): Promise<void> {
  const excel = (globalThis as { Excel?: typeof Excel }).Excel;
  if (!excel) return;
  try {
    await excel.run(async (context) => {
      context.workbook.application.calculate('Full');
      await context.sync();
    });
  } catch {
    // a host without calculate: cells recalculate on their next edit
  }
}

export function renderStoredList(): void {
  const list = byId('custom-list');
  list.replaceChildren();
  let stored;
  try {
    stored = readStoredSystems(settings());
  } catch (error) {
    list.append(el('p', { class: 'notes' }, [failureText(error)]));
    return;
  }
  // the form starts open only in a workbook with nothing stored yet, to keep the pane short
  if (firstList) byId<HTMLDetailsElement>('custom-define').open = stored.entries.length === 0;
  firstList = false;
  if (stored.unreadable !== undefined) list.append(el('p', { class: 'invalid' }, [`Stored setting not usable: ${stored.unreadable}.`]));
  if (stored.entries.length === 0 && stored.unreadable === undefined) list.append(el('p', { class: 'notes' }, ['This workbook stores no custom systems yet.']));
  stored.entries.forEach((entry, index) => {
    const remove = el('button', { type: 'button', class: 'secondary small', 'data-delete': String(index) }, ['Delete']);
    remove.setAttribute('aria-label', `Delete ${entry.name}`);
    remove.addEventListener('click', () => { void removeEntry(index, entry.name); });
    list.append(el('div', { class: entry.problem ? 'stored invalid' : 'stored', 'data-name': entry.name }, [
      el('div', { class: 'stored-text' }, [
        el('span', { class: 'stored-name' }, [entry.name]),
        el('span', { class: 'stored-state' }, [entry.problem ? `Not in use: ${entry.problem}` : 'In use by cells']),
      ]),
      remove,
    ]));
  });
}

async function removeEntry(index: number, name: string): Promise<void> {
  if (!(await askInPane(byId('custom-question'), `Delete “${name}” from this workbook? Cells that use it will show #VALUE!.`, `Delete ${name}`, 'Keep it'))) return;
  const problems = await deleteDefinition(settings(), index);
  setStatus(problems.length > 0 ? problems.join('\n') : `Deleted ${name} from this workbook.`, problems.length > 0 ? 'error' : 'ok');
  await recalculate();
  renderStoredList();
  changed();
}

async function save(): Promise<void> {
  let def;
  try {
    def = definitionFromInputs({
      name: str('custom-name'), pKa: str('custom-pka'), charge: str('custom-charge'), dH: str('custom-dh'),
      forms: [1, 2].map((i) => ({ name: str(`custom-form${i}-name`), formula: str(`custom-form${i}-formula`), protonsLost: str(`custom-form${i}-lost`) })),
    });
  } catch (error) {
    setStatus(failureText(error), 'error');
    return;
  }
  let outcome = await saveDefinition(settings(), def);
  const host = byId('custom-question');
  if (outcome.kind === 'needs-confirmation') {
    if (!(await askInPane(host, `This workbook already stores “${outcome.existing}”. Replace it with this “${def.name}”?`, `Replace ${outcome.existing}`, 'Keep the stored one'))) {
      setStatus(`Nothing saved: “${outcome.existing}” kept as it was.`);
      return;
    }
    outcome = await saveDefinition(settings(), def, true);
  } else if (outcome.kind === 'needs-overwrite') {
    if (!(await askInPane(host, `${outcome.reason}. Saving replaces that stored setting. Replace it?`, 'Replace the stored setting', 'Cancel'))) {
      setStatus('Nothing saved: the stored setting kept as it was.');
      return;
    }
    outcome = await saveDefinition(settings(), def, true);
  }
  if (outcome.kind === 'invalid') {
    setStatus(`Not saved: ${outcome.problems.join('\n')}`, 'error');
    return;
  }
  if (outcome.kind !== 'saved') return;
  const verb = outcome.replaced ? `Replaced ${outcome.replaced} with ${def.name}` : `Saved ${def.name}`;
  setStatus(outcome.problems.length > 0 ? `${verb}; ${outcome.problems.join('\n')}` : `${verb} in this workbook; cells can use it now, e.g. =PROTIC.FRACTIONS("${def.name}", 7).`, outcome.problems.length > 0 ? 'warning' : 'ok');
  await recalculate();
  renderStoredList();
  changed();
}

export function customSection(getSettings: () => SettingsLike, onChange: () => void): HTMLElement[] {
  settings = getSettings;
  changed = onChange;
  const saveButton = el('button', { type: 'button', id: 'custom-save' }, ['Save system in workbook']);
  saveButton.addEventListener('click', () => { void save(); });
  return [
    el('div', { id: 'custom-list', class: 'stored-list', 'aria-label': 'Custom systems stored in this workbook' }),
    el('details', { class: 'define', id: 'custom-define' }, [el('summary', {}, ['Define a new system']), el('fieldset', {}, [
      el('legend', {}, ['A system this workbook carries']),
      field('custom-name', 'Name', textInput()),
      field('custom-pka', 'pKa values at 25 °C, I = 0 mol/L (first proton lost first)', textInput('', '6.1; 9.2')),
      field('custom-charge', 'Charge of the most protonated form', numberInput('0')),
      field('custom-dh', 'ΔrH° per step, kJ/mol (optional)', textInput('', '20')),
      ...[1, 2].map((i) => el('div', { class: 'form-def', role: 'group', 'aria-label': `Form ${i}` }, [
        field(`custom-form${i}-name`, `Form ${i} name`, textInput()),
        el('div', { class: 'row' }, [field(`custom-form${i}-formula`, 'Formula', textInput()), field(`custom-form${i}-lost`, 'H⁺ lost', numberInput(String(i - 1)))]),
      ])),
      el('p', { class: 'hint' }, ['Decimals take a point or a comma (4,76); separate values with “;” or a space.']),
      saveButton,
    ])]),
    el('div', { id: 'custom-question' }),
  ];
}
