import * as impl from '../functions/impl';
import { BLOCK_KINDS, MODEL_CHOICES, blockKind, mixtureArgs, titrantUnitSymbol } from './blockKinds';
import type { BlockInputs, FieldGroup } from './blockKinds';
import type { MixtureInput } from './blocks';
import { askInPane } from './confirm';
import { byId, el, field, fitHeight, num, numberInput, setText, str, textInput, wrappingTextInput } from './dom';
import { writeBlockAtSelection } from './excelWriter';
import { conditions, state } from './paneState';
import { drawChart } from './plot';
import { failureText, setStatus } from './status';
import { Refusal } from './refusal';

// "Into the sheet": the chosen block's fields, Insert (which asks before replacing anything) and the titration preview.

const UNITS = ['g', 'mg', 'mol', 'mmol', 'M', 'mM', 'mL', 'L'];
const ROWS = [1, 2, 3];

function mixtureInput(): MixtureInput {
  const rows = ROWS
    .filter((i) => str(`row${i}-reagent`).trim() !== '')
    .map((i) => ({ reagent: str(`row${i}-reagent`).trim(), amount: num(`row${i}-amount`), unit: str(`row${i}-unit`) }));
  if (rows.length === 0) throw new Refusal('No reagent: type at least one reagent name, formula or stock.');
  return { rows, volumeL: num('volume'), temperatureC: conditions().temperatureC, model: str('model') };
}

const inputs: BlockInputs = {
  mixture: mixtureInput,
  volumeL: () => num('volume'),
  model: () => str('model'),
  titrant: () => { const t = str('titrant').trim(); if (t === '') throw new Refusal('Titrant is blank: type a stock such as 1 M NaOH.'); return t; },
  targetPH: () => conditions().targetPH,
  temperatureC: () => conditions().temperatureC,
  ionicStrengthM: () => conditions().ionicStrengthM,
  curveEnd: () => num('max-amount'),
  points: () => num('points'),
  acidForm: () => str('acid-form'),
  baseForm: () => str('base-form'),
  concentrationM: () => num('concentration'),
  fromPH: () => num('from-ph'),
  toPH: () => num('to-ph'),
  stepPH: () => num('step-ph'),
  systemId: () => state.systemId,
  salt: () => { const s = str('salt').trim(); if (s === '') throw new Refusal('Salt is blank: type a salt such as NaCl, or a stock such as 4 M NaCl.'); return s; },
  targetIonicStrengthM: () => num('target-ionic-strength'),
};

/** A result with its mixture's model warning beside it, so no number in the pane is silent. */
function setResultStatus(message: string): void {
  let warning = '';
  try {
    const row = impl.species(...mixtureArgs(mixtureInput())).find((r) => r[0] === 'warning');
    warning = row === undefined || row[1] === 'none' ? '' : String(row[1]);
  } catch {
    warning = '';
  }
  setStatus(warning === '' ? message : `${message}\nWarning: ${warning}.`, warning === '' ? 'ok' : 'warning');
}

/** Shows only the fields of the chosen block. */
export function showFieldsOf(kindId: string): void {
  const groups = new Set<FieldGroup>(blockKind(kindId).fields);
  for (const node of Array.from(document.querySelectorAll<HTMLElement>('[data-group]'))) {
    node.hidden = !(node.getAttribute('data-group') ?? '').split(' ').some((g) => groups.has(g as FieldGroup));
  }
}

/** The curve-end label names the titrant's own unit (mL of a stock, g of a solid). */
function updateTitrantUnit(): void {
  let unit = 'mL';
  try { unit = titrantUnitSymbol(str('titrant')); } catch { /* an unreadable titrant is reported on Insert */ }
  byId('max-amount-label').textContent = `Curve ends at (${unit} of titrant)`;
}

let reagentNames: string[] = [];
let suggested: { acid?: string; base?: string } = {};

/**
 * Called when a system is shown: the recipe's form lists follow the system, keeping the user's choice
 * when it is still offered; typed reagents are never replaced, only empty rows are filled.
 */
export function offerForms(names: string[], forms: { acid?: string; base?: string }): void {
  reagentNames = names;
  suggested = forms;
  const acid = forms.acid ?? names[0] ?? '';
  const base = forms.base ?? names[names.length - 1] ?? '';
  for (const [id, pick] of [['acid-form', acid], ['base-form', base]] as const) {
    const select = byId<HTMLSelectElement>(id);
    const keep = select.value;
    select.replaceChildren(...names.map((n) => el('option', { value: n }, [n])));
    select.value = names.includes(keep) ? keep : pick;
  }
  if (str('row1-reagent').trim() === '' && str('row2-reagent').trim() === '') {
    setText('row1-reagent', acid);
    setText('row2-reagent', base === acid ? '' : base);
  }
  byId('suggested-text').textContent = acid === '' ? 'No suggestion for the system on show.' : `Suggested for the target pH: ${acid}${base && base !== acid ? ` + ${base}` : ''}.`;
}

/**
 * The explicit "use suggested forms": for the recipe, its two form lists; otherwise reagent rows 1 and 2 (the
 * fields on show, never hidden ones the user cannot see change).
 */
function useSuggested(): void {
  const acid = suggested.acid ?? reagentNames[0] ?? '';
  const base = suggested.base ?? reagentNames[reagentNames.length - 1] ?? '';
  const both = `${acid}${base !== acid ? ` and ${base}` : ''}`;
  if (blockKind(str('formula-kind')).fields.includes('recipe')) {
    byId<HTMLSelectElement>('acid-form').value = acid;
    byId<HTMLSelectElement>('base-form').value = base;
    setStatus(`The recipe's acid and base forms are now the suggested ${both}.`);
    return;
  }
  setText('row1-reagent', acid);
  setText('row2-reagent', base === acid ? '' : base);
  setStatus(`Reagent rows 1 and 2 now hold the suggested ${both}.`);
}

/** Counts Insert clicks: a question answered "no" by a newer Insert leaves the status to the newer one. */
let insertCount = 0;

async function insert(): Promise<void> {
  const kind = blockKind(str('formula-kind'));
  const mine = ++insertCount;
  try {
    const build = kind.prepare(inputs);
    const outcome = await writeBlockAtSelection(build, (range, count) => askInPane(byId('insert-question'),
      `${range} has ${count} cell${count === 1 ? '' : 's'} with content. Replace ${count === 1 ? 'it' : 'them'} with the “${kind.label}” block?`,
      `Replace ${count} cell${count === 1 ? '' : 's'}`, 'Keep my cells'));
    if (outcome.kind === 'cancelled') {
      if (mine !== insertCount) return;
      setStatus(`Nothing written: ${outcome.range} kept as it was. Select an empty area and insert again.`);
      return;
    }
    const message = `Wrote ${outcome.range}${outcome.replaced > 0 ? ` (replaced ${outcome.replaced} cell${outcome.replaced === 1 ? '' : 's'}, as you agreed)` : ''}.`;
    if (kind.showsMixtureWarning) setResultStatus(message);
    else setStatus(message);
  } catch (error) {
    setStatus(failureText(error), 'error');
  }
}

function previewCurve(): void {
  try {
    const m = mixtureInput();
    const titrant = inputs.titrant(), curveEnd = inputs.curveEnd();
    const unit = titrantUnitSymbol(titrant);
    const [reagents, amounts, units, volumeL, temperatureC, model] = mixtureArgs(m);
    const points = impl.curve(reagents, amounts, units, volumeL, titrant, curveEnd, 41, temperatureC, model, unit) as number[][];
    drawChart(byId('curve-chart'), [{ label: `pH with ${titrant}`, points: points.map((p) => [p[0], p[1]] as [number, number]) }], {
      title: 'Titration preview', xLabel: `titrant added (${unit})`, yLabel: 'pH', xDomain: [0, curveEnd], seriesClass: 'curve',
    });
    setResultStatus(`Preview: pH ${points[0][1].toFixed(2)} to ${points[points.length - 1][1].toFixed(2)}.`);
  } catch (error) {
    setStatus(failureText(error), 'error');
  }
}

/** The section's elements. */
export function sheetSection(): HTMLElement[] {
  const kind = el('select', {}, BLOCK_KINDS.map((k) => el('option', { value: k.id }, [k.label])));
  kind.addEventListener('change', () => showFieldsOf(kind.value));
  const unitSelect = (value: string): HTMLSelectElement => {
    const s = el('select', {}, UNITS.map((u) => el('option', { value: u }, [u])));
    s.value = value;
    return s;
  };
  const model = el('select', {}, MODEL_CHOICES.map((m) => el('option', { value: m.id }, [m.label])));
  const reagentRow = (i: number, amount: string, unit: string): HTMLElement => el('div', { class: 'reagent-row', role: 'group', 'aria-label': `Reagent ${i}` }, [
    field(`row${i}-reagent`, `Reagent ${i}`, wrappingTextInput(), { class: 'field reagent' }),
    el('div', { class: 'row' }, [field(`row${i}-amount`, 'Amount', numberInput(amount)), field(`row${i}-unit`, 'Unit', unitSelect(unit))]),
  ]);
  const insertButton = el('button', { type: 'button', id: 'insert' }, ['Insert at selected cell']);
  insertButton.addEventListener('click', () => { void insert(); });
  const previewButton = el('button', { type: 'button', id: 'preview', class: 'secondary' }, ['Preview titration']);
  previewButton.addEventListener('click', previewCurve);
  const suggest = el('button', { type: 'button', id: 'use-suggested', class: 'secondary small' }, ['Use suggested forms']);
  suggest.addEventListener('click', useSuggested);
  const titrant = textInput('1 M NaOH');
  titrant.addEventListener('input', updateTitrantUnit);

  const nodes = [
    field('formula-kind', 'Block to write', kind),
    el('div', { 'data-group': 'mixture' }, [
      ...ROWS.map((i) => reagentRow(i, ['3.40', '3.55', '0'][i - 1], ['g', 'g', 'mM'][i - 1])),
      el('p', { class: 'hint' }, ['Reagent names, formulas or stocks (1 M HCl). Only empty rows are filled from the system on show.']),
    ]),
    el('div', { class: 'suggestion', 'data-group': 'mixture recipe' }, [el('p', { id: 'suggested-text', class: 'hint' }), suggest]),
    el('div', { 'data-group': 'mixture recipe' }, [field('volume', 'Final volume (L)', numberInput('1'))]),
    el('div', { 'data-group': 'model' }, [field('model', 'Activity model', model)]),
    el('div', { 'data-group': 'salt' }, [
      field('salt', 'Salt (a solid such as NaCl, or a stock such as 4 M NaCl)', textInput('NaCl')),
      field('target-ionic-strength', 'Target ionic strength (mol/L)', numberInput('0.15')),
      el('p', { class: 'hint' }, ['The salt is written as one more row; the volume above is the final volume, salt included.']),
    ]),
    el('div', { 'data-group': 'titrant' }, [field('titrant', 'Titrant (a stock such as 1 M NaOH, or a solid)', titrant)]),
    el('div', { class: 'row', 'data-group': 'curve-end points' }, [
      field('max-amount', 'Curve ends at (mL of titrant)', numberInput('20'), { 'data-group': 'curve-end' }),
      field('points', 'Points', numberInput('21'), { 'data-group': 'points' }),
    ]),
    el('div', { 'data-group': 'recipe' }, [
      field('acid-form', 'Acid form', el('select')), field('base-form', 'Base form', el('select')),
      field('concentration', 'Buffer concentration, both forms together (mol/L)', numberInput('0.1')),
    ]),
    el('div', { class: 'row', 'data-group': 'fractions' }, [field('from-ph', 'pH from', numberInput('2')), field('to-ph', 'to', numberInput('12')), field('step-ph', 'step', numberInput('0.5'))]),
    el('p', { class: 'hint', 'data-group': 'fractions' }, ['For the system on show above, at the conditions’ temperature and ionic strength.']),
    el('p', { class: 'hint', 'data-group': 'recipe' }, ['Forms of the system on show above, weighed for the target pH at the conditions’ temperature.']),
    el('div', { class: 'buttons' }, [insertButton, el('span', { 'data-group': 'curve-end' }, [previewButton])]),
    el('div', { id: 'insert-question' }),
    el('div', { id: 'curve-chart', class: 'chart', 'data-group': 'curve-end' }),
  ];
  return nodes;
}

export function startSheetSection(): void {
  showFieldsOf(str('formula-kind'));
  for (const i of ROWS) fitHeight(byId<HTMLTextAreaElement>(`row${i}-reagent`));
  updateTitrantUnit();
}
