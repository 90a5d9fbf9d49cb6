/* global Office */
import { ADDIN_VERSION, CATALOGUE_VERSION } from '../catalogue';
import { renderResults, renderSystem, resultsKeyboard, whenSystemShown } from './catalogueSection';
import { customSection, renderStoredList } from './customSection';
import { loadFromSettings } from './customStore';
import type { SettingsLike } from './customStore';
import { byId, el, field, numberInput, textInput } from './dom';
import { offerForms, sheetSection, startSheetSection } from './sheetSection';
import { setStatus } from './status';
import { applyOfficeTheme } from './theme';

// The side pane: lays out its sections and starts them. Each section lives in its own file.

function settings(): SettingsLike {
  return Office.context.document.settings as unknown as SettingsLike;
}

function build(): void {
  const app = byId('app');
  const search = textInput('', 'name, alias or formula');
  search.addEventListener('input', renderResults);
  const nearPka = el('input', { type: 'checkbox', id: 'near-pka' });
  nearPka.addEventListener('change', renderResults);
  const results = el('ul', { id: 'results', class: 'results', role: 'listbox', 'aria-label': 'Search results' });
  resultsKeyboard(results);

  app.append(
    el('header', {}, [el('h1', {}, ['Protic']), el('p', { class: 'version' }, [`add-in ${ADDIN_VERSION}, catalogue ${CATALOGUE_VERSION}`])]),
    el('section', { 'aria-labelledby': 'h-conditions' }, [
      el('h2', { id: 'h-conditions' }, ['Conditions']),
      el('div', { class: 'row three' }, [
        field('temperature', 'Temperature (°C)', numberInput('25')), field('ionic-strength', 'Ionic strength (mol/L)', numberInput('0')), field('target-ph', 'Target pH', numberInput('7.4')),
      ]),
    ]),
    el('section', { 'aria-labelledby': 'h-catalogue' }, [
      el('h2', { id: 'h-catalogue' }, ['Catalogue']),
      field('search', 'Find a reagent or system', search),
      el('label', { class: 'check', for: 'near-pka' }, [nearPka, 'Only systems with a pKa within ±1 of the target pH']),
      results,
      el('div', { id: 'system', role: 'region', 'aria-label': 'Chosen system' }),
    ]),
    el('section', { 'aria-labelledby': 'h-sheet' }, [el('h2', { id: 'h-sheet' }, ['Into the sheet']), ...sheetSection()]),
    el('section', { 'aria-labelledby': 'h-custom' }, [el('h2', { id: 'h-custom' }, ['Custom systems']), ...customSection(settings, () => { renderResults(); renderSystem(); })]),
    // the one live region, kept in view at the pane's foot
    el('div', { id: 'status', class: 'status', role: 'status', 'aria-live': 'polite' }),
    el('footer', {}, [
      el('p', {}, ['A calculated pH does not replace a measurement with a calibrated meter.']),
      el('p', {}, ['Handle concentrated acids and bases as their safety data sheets say.']),
      el('p', {}, ['Site procedures, local codes and licensed practice come first.']),
    ]),
  );
  for (const id of ['temperature', 'ionic-strength', 'target-ph']) byId(id).addEventListener('change', () => { renderResults(); renderSystem(); });
}

function start(): void {
  applyOfficeTheme();
  build();
  whenSystemShown(offerForms);
  startSheetSection();
  const problems = loadFromSettings(settings());
  if (problems.length > 0) setStatus(problems.join('\n'), 'error');
  renderStoredList();
  renderResults();
  renderSystem();
}

Office.onReady(() => start());
