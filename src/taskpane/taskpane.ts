/* global Office */
import { ADDIN_VERSION, CATALOGUE_VERSION } from '../catalogue';
import { ProticError, parseReagentSpec, systemFor, titrantUnit } from '../engine';
import * as impl from '../functions/impl';
import { toCellFailure } from '../functions/outcome';
import { WHAT_IF_TEMPERATURES_C, fractionsBlock, phBlock, recipeBlock, speciesBlock, temperatureTableBlock, titrantBlock } from './blocks';
import type { Block } from './blocks';
import { searchCatalogue, suggestedForms, systemView } from './catalogueView';
import { definitionFromInputs, loadFromSettings, saveDefinition } from './customStore';
import type { SettingsLike } from './customStore';
import { writeBlockAtSelection } from './excelWriter';
import { drawChart } from './plot';

// The side pane. Every string from the catalogue, the workbook or the user goes into the page
// as a text node (textContent), never as markup.

type Attrs = Record<string, string>;

function el<K extends keyof HTMLElementTagNameMap>(tag: K, attrs: Attrs = {}, children: (Node | string)[] = []): HTMLElementTagNameMap[K] {
  const node = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs)) node.setAttribute(k, v);
  for (const c of children) node.append(typeof c === 'string' ? document.createTextNode(c) : c);
  return node;
}

function field(id: string, label: string, input: HTMLInputElement | HTMLSelectElement): HTMLElement {
  input.id = id;
  return el('div', {}, [el('label', { for: id }, [label]), input]);
}

function numberInput(value: string, step = 'any'): HTMLInputElement {
  return el('input', { type: 'number', value, step });
}

function textInput(value = '', placeholder = ''): HTMLInputElement {
  return el('input', { type: 'text', value, placeholder, autocomplete: 'off' });
}

function num(id: string): number {
  return Number((document.getElementById(id) as HTMLInputElement).value);
}

function str(id: string): string {
  return (document.getElementById(id) as HTMLInputElement | HTMLSelectElement).value;
}

const state = { systemId: 'phosphate' };

function setStatus(message: string, isError = false): void {
  const status = document.getElementById('status') as HTMLElement;
  status.textContent = message;
  status.className = isError ? 'status error' : 'status';
}

/** A result with its mixture's model warning beside it (shown as a warning), so no number in the pane is silent. */
function setResultStatus(message: string): void {
  const [reagents, amounts, units, volumeL, temperatureC] = mixtureArgs();
  const row = impl.species(reagents, amounts, units, volumeL, temperatureC).find((r) => r[0] === 'warning');
  const warning = row === undefined || row[1] === 'none' ? '' : String(row[1]);
  setStatus(warning === '' ? message : `${message}\nWarning: ${warning}.`, warning !== '');
}

function failureText(error: unknown): string {
  return error instanceof ProticError || error instanceof Error ? toCellFailure(error).message : String(error);
}

function conditions(): { temperatureC: number; ionicStrengthM: number; targetPH: number } {
  return { temperatureC: num('temperature'), ionicStrengthM: num('ionic-strength'), targetPH: num('target-ph') };
}

function renderResults(): void {
  const list = document.getElementById('results') as HTMLUListElement;
  list.replaceChildren();
  const { temperatureC, targetPH } = conditions();
  const near = (document.getElementById('near-pka') as HTMLInputElement).checked ? targetPH : undefined;
  for (const hit of searchCatalogue(str('search'), near, temperatureC)) {
    const button = el('button', { type: 'button', 'data-system': hit.systemId }, [
      el('span', { class: 'hit-kind' }, [hit.kind]), hit.label, el('span', { class: 'hit-detail' }, [hit.detail]),
    ]);
    button.addEventListener('click', () => { state.systemId = hit.systemId; renderSystem(); });
    list.append(el('li', {}, [button]));
  }
  if (list.children.length === 0) list.append(el('li', {}, [el('span', { class: 'notes' }, ['Nothing matches. Clear the pH filter or try a formula such as Na2HPO4.'])]));
}

function renderSystem(): void {
  const panel = document.getElementById('system') as HTMLElement;
  panel.replaceChildren();
  const { temperatureC, ionicStrengthM, targetPH } = conditions();
  let view;
  try {
    view = systemView(state.systemId, temperatureC, ionicStrengthM);
  } catch (error) {
    setStatus(failureText(error), true);
    return;
  }
  panel.append(el('h3', { id: 'system-name' }, [view.name]));
  const steps = el('table', { id: 'steps' }, [el('tr', {}, ['Step', 'pKa', `pKa′ (I ${ionicStrengthM})`, 'dpKa/dT', 'Source'].map((h) => el('th', {}, [h])))]);
  for (const s of view.steps) {
    steps.append(el('tr', {}, [
      el('td', {}, [String(s.step)]), el('td', { class: 'num' }, [s.pKa.toFixed(3)]), el('td', { class: 'num' }, [s.apparentPKa.toFixed(3)]),
      el('td', { class: 'num' }, [s.dpKaPerK.toFixed(4)]), el('td', { class: 'source' }, [s.source]),
    ]));
  }
  const forms = el('table', { id: 'forms' }, [el('tr', {}, ['Form', 'Charge', 'g/mol'].map((h) => el('th', {}, [h])))]);
  for (const f of view.forms) {
    forms.append(el('tr', {}, [el('td', {}, [f.label]), el('td', { class: 'num' }, [String(f.charge)]), el('td', { class: 'num' }, [f.molarMassGPerMol === undefined ? '—' : f.molarMassGPerMol.toFixed(2)])]));
  }
  const reagents = el('table', { id: 'system-reagents' }, [el('tr', {}, ['Reagent', 'Formula', 'g/mol'].map((h) => el('th', {}, [h])))]);
  for (const r of view.reagents) reagents.append(el('tr', {}, [el('td', {}, [r.name]), el('td', {}, [r.formula]), el('td', { class: 'num' }, [r.molarMassGPerMol.toFixed(2)])]));
  panel.append(
    el('p', { class: 'notes' }, [`Data hold for ${view.rangeC[0]}–${view.rangeC[1]} °C. ${view.notes}`]),
    steps, forms, reagents,
    el('div', { id: 'fractions-chart', class: 'chart' }),
  );
  const series = view.forms.map((form) => ({ label: form.label, points: [] as [number, number][] }));
  try {
    for (let pH = 0; pH <= 14.0001; pH += 0.1) {
      const row = impl.fractions(state.systemId, pH, temperatureC, ionicStrengthM)[0];
      row.forEach((f, j) => series[j].points.push([pH, f]));
    }
  } catch (error) {
    setStatus(failureText(error), true);
    return;
  }
  drawChart(document.getElementById('fractions-chart') as HTMLElement, series, {
    title: `${view.name}: fraction of each form`, xLabel: 'pH', yLabel: 'fraction', xDomain: [0, 14], yDomain: [0, 1], seriesClass: 'series',
    marks: [...view.steps.map((s) => [s.apparentPKa, `pKa${s.step}`, 'pka-mark'] as [number, string, string]), [targetPH, 'target', 'target-mark']],
  });
  fillFormChoices(view.reagents.map((r) => r.name), suggestedForms(state.systemId, targetPH, temperatureC));
}

function fillFormChoices(names: string[], suggested: { acid?: string; base?: string }): void {
  const acid = suggested.acid ?? names[0] ?? '';
  const base = suggested.base ?? names[names.length - 1] ?? '';
  for (const [id, pick] of [['acid-form', acid], ['base-form', base]] as const) {
    const select = document.getElementById(id) as HTMLSelectElement;
    select.replaceChildren(...names.map((n) => el('option', { value: n }, [n])));
    select.value = pick;
  }
  (document.getElementById('row1-reagent') as HTMLInputElement).value = acid;
  (document.getElementById('row2-reagent') as HTMLInputElement).value = base === acid ? '' : base;
}

function mixtureInput(): { rows: { reagent: string; amount: number; unit: string }[]; volumeL: number; temperatureC: number } {
  const rows = [1, 2, 3]
    .map((i) => ({ reagent: str(`row${i}-reagent`).trim(), amount: num(`row${i}-amount`), unit: str(`row${i}-unit`) }))
    .filter((r) => r.reagent !== '');
  return { rows, volumeL: num('volume'), temperatureC: conditions().temperatureC };
}

function mixtureArgs(): [string[][], number[][], string[][], number, number] {
  const m = mixtureInput();
  return [m.rows.map((r) => [r.reagent]), m.rows.map((r) => [r.amount]), m.rows.map((r) => [r.unit]), m.volumeL, m.temperatureC];
}

/** Checks a block's inputs with the very functions the cells will run, before anything is written. */
function checkBeforeInsert(kind: string): void {
  const [reagents, amounts, units, volumeL, temperatureC] = mixtureArgs();
  const { targetPH, ionicStrengthM } = conditions();
  if (kind === 'ph') impl.ph(reagents, amounts, units, volumeL, temperatureC);
  if (kind === 'titrant') impl.titrant(targetPH, reagents, amounts, units, volumeL, str('titrant'), temperatureC);
  if (kind === 'recipe') impl.recipe(str('acid-form'), str('base-form'), targetPH, num('concentration'), volumeL, temperatureC);
  if (kind === 'fractions') impl.fractions(state.systemId, num('from-ph'), temperatureC, ionicStrengthM);
  if (kind === 'species' || kind === 'temperatures') impl.species(reagents, amounts, units, volumeL, temperatureC);
}

function blockBuilder(kind: string): (top: number, left: number) => Block {
  const m = mixtureInput();
  const { targetPH, temperatureC, ionicStrengthM } = conditions();
  switch (kind) {
    case 'titrant': return (t, l) => titrantBlock(m, str('titrant'), targetPH, t, l);
    case 'recipe': return (t, l) => recipeBlock({ acidForm: str('acid-form'), baseForm: str('base-form'), targetPH, concentrationM: num('concentration'), volumeL: m.volumeL, temperatureC }, t, l);
    case 'fractions': {
      const sys = systemFor(state.systemId);
      return (t, l) => fractionsBlock({ system: sys.name, forms: sys.forms, fromPH: num('from-ph'), toPH: num('to-ph'), stepPH: num('step-ph'), temperatureC, ionicStrengthM }, t, l);
    }
    case 'species': {
      const [reagents, amounts, units, volumeL] = mixtureArgs();
      const speciesRows = impl.species(reagents, amounts, units, volumeL, temperatureC).length;
      const constantsRows = impl.constants(reagents, amounts, units, volumeL, temperatureC).length;
      return (t, l) => speciesBlock(m, speciesRows, constantsRows, t, l);
    }
    case 'temperatures': return (t, l) => temperatureTableBlock(m, WHAT_IF_TEMPERATURES_C, t, l);
    default: return (t, l) => phBlock(m, t, l);
  }
}

async function insert(): Promise<void> {
  const kind = str('formula-kind');
  try {
    checkBeforeInsert(kind);
    const written = await writeBlockAtSelection(blockBuilder(kind));
    if (kind === 'ph' || kind === 'titrant' || kind === 'species') setResultStatus(`Wrote ${written}.`);
    else setStatus(`Wrote ${written}.`);
  } catch (error) {
    setStatus(failureText(error), true);
  }
}

function previewCurve(): void {
  const [reagents, amounts, units, volumeL, temperatureC] = mixtureArgs();
  try {
    const points = impl.curve(reagents, amounts, units, volumeL, str('titrant'), num('max-amount'), 41, temperatureC) as number[][];
    const unit = titrantUnit(undefined, parseReagentSpec(str('titrant'), 'titrant'), 'resultUnit').symbol;
    drawChart(document.getElementById('curve-chart') as HTMLElement, [{ label: `pH with ${str('titrant')}`, points: points.map((p) => [p[0], p[1]] as [number, number]) }], {
      title: 'Titration preview', xLabel: `titrant added (${unit})`, yLabel: 'pH', xDomain: [0, num('max-amount')], seriesClass: 'curve',
    });
    setResultStatus(`Preview: pH ${points[0][1].toFixed(2)} to ${points[points.length - 1][1].toFixed(2)}.`);
  } catch (error) {
    setStatus(failureText(error), true);
  }
}

function settings(): SettingsLike {
  return Office.context.document.settings as unknown as SettingsLike;
}

async function defineCustom(): Promise<void> {
  const def = definitionFromInputs(str('custom-name'), str('custom-pka'), str('custom-charge'), str('custom-dh'), [1, 2].map((i) => ({
    name: str(`custom-form${i}-name`), formula: str(`custom-form${i}-formula`), protonsLost: str(`custom-form${i}-lost`),
  })));
  const problems = await saveDefinition(settings(), def);
  if (problems.length > 0) {
    setStatus(problems.join('\n'), true);
    return;
  }
  setStatus(`Saved ${def.name} in this workbook; cells can use it now, e.g. =PROTIC.FRACTIONS("${def.name}", 7).`);
  renderResults();
}

function build(): void {
  const app = document.getElementById('app') as HTMLElement;
  const kind = el('select', {}, [
    el('option', { value: 'ph' }, ['pH of the mixture']), el('option', { value: 'titrant' }, ['Titrant for the target pH']),
    el('option', { value: 'recipe' }, ['Recipe: grams of two forms']), el('option', { value: 'fractions' }, ['Fractions table across pH']),
    el('option', { value: 'species' }, ['Audit: every species and constant']), el('option', { value: 'temperatures' }, ['What-if: pH across temperatures']),
  ]);
  const unitSelect = (value: string): HTMLSelectElement => {
    const s = el('select', {}, ['g', 'mg', 'mol', 'mmol', 'M', 'mM', 'mL', 'L'].map((u) => el('option', { value: u }, [u])));
    s.value = value;
    return s;
  };
  const mixtureRow = (i: number, amount: string, unit: string): HTMLElement => el('div', { class: 'row' }, [
    field(`row${i}-reagent`, `Reagent ${i}`, textInput()), field(`row${i}-amount`, 'Amount', numberInput(amount)), field(`row${i}-unit`, 'Unit', unitSelect(unit)),
  ]);
  const insertButton = el('button', { type: 'button', id: 'insert' }, ['Insert at selected cell']);
  insertButton.addEventListener('click', () => { void insert(); });
  const previewButton = el('button', { type: 'button', id: 'preview', class: 'secondary' }, ['Preview titration']);
  previewButton.addEventListener('click', previewCurve);
  const defineButton = el('button', { type: 'button', id: 'custom-save' }, ['Save system in workbook']);
  defineButton.addEventListener('click', () => { void defineCustom(); });
  const search = textInput('', 'name, alias or formula');
  search.addEventListener('input', renderResults);
  const nearPka = el('input', { type: 'checkbox', id: 'near-pka' });
  nearPka.addEventListener('change', renderResults);

  app.append(
    el('h1', {}, ['Protic']),
    el('p', { class: 'version' }, [`add-in ${ADDIN_VERSION}, catalogue ${CATALOGUE_VERSION}`]),
    el('h2', {}, ['Conditions']),
    el('div', { class: 'row' }, [field('temperature', 'Temperature (°C)', numberInput('25')), field('ionic-strength', 'Ionic strength (mol/L)', numberInput('0')), field('target-ph', 'Target pH', numberInput('7.4'))]),
    el('h2', {}, ['Catalogue']),
    field('search', 'Find a reagent or system', search),
    el('label', { class: 'check', for: 'near-pka' }, [nearPka, 'Only systems with a pKa within ±1 of the target pH']),
    el('ul', { id: 'results', class: 'results', 'aria-label': 'Search results' }),
    el('section', { id: 'system', 'aria-label': 'Chosen system' }),
    el('h2', {}, ['Into the sheet']),
    field('formula-kind', 'Write', kind),
    mixtureRow(1, '3.40', 'g'), mixtureRow(2, '3.55', 'g'), mixtureRow(3, '0', 'mM'),
    el('div', { class: 'row' }, [field('volume', 'Volume (L)', numberInput('1')), field('titrant', 'Titrant', textInput('1 M NaOH')), field('max-amount', 'Up to (mL or g)', numberInput('20'))]),
    el('div', { class: 'row' }, [field('acid-form', 'Acid form', el('select')), field('base-form', 'Base form', el('select'))]),
    el('div', { class: 'row' }, [field('concentration', 'Total (mol/L)', numberInput('0.1')), field('from-ph', 'pH from', numberInput('2')), field('to-ph', 'to', numberInput('12')), field('step-ph', 'step', numberInput('0.5'))]),
    el('div', { class: 'row' }, [insertButton, previewButton]),
    el('div', { id: 'curve-chart', class: 'chart' }),
    el('div', { id: 'status', class: 'status', role: 'status' }),
    el('h2', {}, ['Custom system']),
    el('fieldset', {}, [
      el('legend', {}, ['Define a system this workbook carries']),
      field('custom-name', 'Name', textInput()),
      el('div', { class: 'row' }, [field('custom-pka', 'pKa values (25 °C, I = 0)', textInput('', '6.1, 9.2')), field('custom-charge', 'Charge, most protonated', numberInput('0', '1'))]),
      field('custom-dh', 'ΔrH° per step, kJ/mol (optional)', textInput('', '20')),
      ...[1, 2].map((i) => el('div', { class: 'row' }, [
        field(`custom-form${i}-name`, `Form ${i} name`, textInput()), field(`custom-form${i}-formula`, 'Formula', textInput()), field(`custom-form${i}-lost`, 'H⁺ lost', numberInput(String(i - 1), '1')),
      ])),
      defineButton,
    ]),
    el('footer', {}, [
      el('p', {}, ['A calculated pH does not replace a measurement with a calibrated meter.']),
      el('p', {}, ['Handle concentrated acids and bases as their safety data sheets say.']),
      el('p', {}, ['Site procedures, local codes and licensed practice come first.']),
    ]),
  );
  for (const id of ['temperature', 'ionic-strength', 'target-ph']) document.getElementById(id)?.addEventListener('change', () => { renderResults(); renderSystem(); });
}

function start(): void {
  build();
  const problems = loadFromSettings(settings());
  if (problems.length > 0) setStatus(problems.join('\n'), true);
  renderResults();
  renderSystem();
}

Office.onReady(() => start());
