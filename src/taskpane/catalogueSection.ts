import * as impl from '../functions/impl';
import { searchCatalogue, suggestedForms, systemView } from './catalogueView';
import { byId, el, str } from './dom';
import { conditions, state } from './paneState';
import { drawChart } from './plot';
import { failureText, setStatus } from './status';

// The catalogue part of the pane: search, the chosen system's constants and a plot of its forms.

/** Called when a system is shown, with its reagents and the forms suggested for the target pH. */
export type SystemShown = (reagentNames: string[], suggested: { acid?: string; base?: string }) => void;

let onShown: SystemShown = () => undefined;

export function whenSystemShown(callback: SystemShown): void {
  onShown = callback;
}

function markSelected(list: HTMLElement): void {
  for (const option of Array.from(list.querySelectorAll<HTMLElement>('[role="option"]'))) {
    option.setAttribute('aria-selected', String(option.getAttribute('data-hit') === state.pickedHit));
  }
}

export function renderResults(): void {
  const list = byId<HTMLUListElement>('results');
  list.replaceChildren();
  let c;
  try {
    c = conditions();
  } catch (error) {
    setStatus(failureText(error), 'error');
    return;
  }
  const near = byId<HTMLInputElement>('near-pka').checked ? c.targetPH : undefined;
  for (const hit of searchCatalogue(str('search'), near, c.temperatureC)) {
    const key = `${hit.kind}:${hit.label}`;
    const option = el('button', { type: 'button', role: 'option', 'aria-selected': String(key === state.pickedHit), 'data-system': hit.systemId, 'data-hit': key }, [
      el('span', { class: 'hit-kind' }, [hit.kind]), el('span', { class: 'hit-label' }, [hit.label]), el('span', { class: 'hit-detail' }, [hit.detail]),
    ]);
    option.addEventListener('click', () => {
      state.pickedHit = key;
      state.systemId = hit.systemId;
      markSelected(list);
      renderSystem();
    });
    list.append(el('li', { role: 'none' }, [option]));
  }
  if (list.children.length === 0) list.append(el('li', { role: 'none' }, [el('span', { class: 'notes' }, ['Nothing matches. Clear the pH filter or try a formula such as Na2HPO4.'])]));
}

/** Up and down arrows move between results (Tab still walks them too). */
export function resultsKeyboard(list: HTMLElement): void {
  list.addEventListener('keydown', (e) => {
    if (e.key !== 'ArrowDown' && e.key !== 'ArrowUp') return;
    const options = Array.from(list.querySelectorAll<HTMLElement>('[role="option"]'));
    const at = options.indexOf(document.activeElement as HTMLElement);
    const next = options[Math.max(0, Math.min(options.length - 1, at + (e.key === 'ArrowDown' ? 1 : -1)))];
    if (next) { next.focus(); e.preventDefault(); }
  });
}

function table(id: string, headers: string[], rows: { text: string; cls?: string }[][]): HTMLTableElement {
  const t = el('table', { id }, [el('thead', {}, [el('tr', {}, headers.map((h) => el('th', { scope: 'col' }, [h])))])]);
  const body = el('tbody');
  for (const r of rows) body.append(el('tr', {}, r.map((cell) => el('td', cell.cls ? { class: cell.cls } : {}, [cell.text]))));
  t.append(body);
  return t;
}

/** An ionic strength as it is written in a header: "I = 0.1 mol/L". */
export function ionicStrengthText(ionicStrengthM: number): string {
  return `I = ${ionicStrengthM} mol/L`;
}

export function renderSystem(): void {
  const panel = byId('system');
  let view, c;
  try {
    c = conditions();
    view = systemView(state.systemId, c.temperatureC, c.ionicStrengthM);
  } catch (error) {
    setStatus(failureText(error), 'error');
    return;
  }
  panel.replaceChildren();
  const { temperatureC, ionicStrengthM, targetPH } = c;
  panel.append(el('h3', { id: 'system-name' }, [view.name]));
  const steps = table('steps', ['Step', `pKa at ${temperatureC} °C`, `pKa′ at ${ionicStrengthText(ionicStrengthM)}`, 'dpKa/dT (K⁻¹)'], view.steps.map((s) => [
    { text: String(s.step) }, { text: s.pKa.toFixed(3), cls: 'num' }, { text: s.apparentPKa.toFixed(3), cls: 'num' }, { text: s.dpKaPerK.toFixed(4), cls: 'num' },
  ]));
  // one source for every step is said once
  const distinct = [...new Set(view.steps.map((s) => s.source))];
  const sources = distinct.length === 1
    ? el('p', { class: 'caption sources' }, [`Source, every step: ${distinct[0]}`])
    : el('ol', { class: 'sources', 'aria-label': 'Sources of each step' }, view.steps.map((s) => el('li', {}, [s.source])));
  const forms = table('forms', ['Form', 'Charge', 'g/mol'], view.forms.map((f) => [
    { text: f.label }, { text: String(f.charge), cls: 'num' }, { text: f.molarMassGPerMol === undefined ? '—' : f.molarMassGPerMol.toFixed(2), cls: 'num' },
  ]));
  const reagents = table('system-reagents', ['Reagent', 'Formula', 'g/mol'], view.reagents.map((r) => [
    { text: r.name, cls: 'wrap' }, { text: r.formula, cls: 'wrap' }, { text: r.molarMassGPerMol.toFixed(2), cls: 'num' },
  ]));
  panel.append(
    el('p', { class: 'notes' }, [`Data hold for ${view.rangeC[0]}–${view.rangeC[1]} °C. ${view.notes}`]),
    steps, ...(distinct.length === 1 ? [] : [el('p', { class: 'caption' }, ['Sources, by step:'])]), sources,
    el('div', { id: 'fractions-chart', class: 'chart' }),
    el('details', {}, [el('summary', {}, [`Forms and reagents (${view.reagents.length})`]), forms, reagents]),
  );
  const series = view.forms.map((form) => ({ label: form.label, points: [] as [number, number][] }));
  try {
    for (let i = 0; i <= 140; i++) {
      const row = impl.fractions(state.systemId, i / 10, temperatureC, ionicStrengthM)[0];
      row.forEach((f, j) => series[j].points.push([i / 10, f]));
    }
  } catch (error) {
    setStatus(failureText(error), 'error');
    return;
  }
  drawChart(byId('fractions-chart'), series, {
    title: `${view.name}: fraction of each form`, xLabel: 'pH', yLabel: 'fraction', xDomain: [0, 14], yDomain: [0, 1], seriesClass: 'series',
    marks: [...view.steps.map((s) => [s.apparentPKa, `pKa${s.step}`, 'pka-mark'] as [number, string, string]), [targetPH, 'target', 'target-mark']],
  });
  onShown(view.reagents.map((r) => r.name), suggestedForms(state.systemId, targetPH, temperatureC));
}
