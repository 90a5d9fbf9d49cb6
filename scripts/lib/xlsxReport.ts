// The verify report: a summary for the terminal, and a per-cell report as Markdown or as one
// self-contained HTML page (inline style, no scripts, no external requests) to attach to a record.
import type { SavedValue } from './xlsxRead';
import type { SheetValue } from './sheetEngine';
import type { CellReport, VerifyResult } from './xlsxVerify';
import { currentStamp } from './xlsxVerify';

export function showValue(v: SavedValue | SheetValue): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'object') return v.error;
  return String(v);
}

function showDifference(c: CellReport): string {
  if (c.difference === null) return '';
  return c.difference === 0 ? '0' : c.difference.toExponential(3);
}

const VERDICT: Record<0 | 1 | 2, string> = {
  0: 'every Protic cell agrees with its saved value',
  1: 'some Protic cells differ from their saved values',
  2: 'parts of the workbook could not be read or recomputed (listed above); the rest was verified',
};

function verdict(r: VerifyResult): string {
  return r.exitCode === 0 && r.cells.length === 0 ? 'the workbook holds no Protic formula: nothing was verified' : VERDICT[r.exitCode];
}

function counts(r: VerifyResult): { agree: number; differ: number; notSaved: number; stamps: number } {
  let agree = 0, differ = 0, notSaved = 0, stamps = 0;
  for (const c of r.cells) {
    if (c.status === 'agrees') agree++; else if (c.status === 'differs') differ++; else if (c.status === 'not saved') notSaved++; else stamps++;
  }
  return { agree, differ, notSaved, stamps };
}

function headerLines(r: VerifyResult): string[] {
  const n = counts(r);
  const lines = [
    `workbook: ${r.file} (${r.sheets} sheet(s), ${r.formulas} formula cell(s))`,
    `checked: ${r.cells.length} cell(s) of Protic formulas (spills over their whole range), relative tolerance ${r.tolerance}`,
    `against: ${currentStamp()}`,
    `custom systems: ${r.customSystems}`,
    `saved-formula forms met: ${r.forms.length > 0 ? r.forms.join('; ') : 'none'}`,
    `agree ${n.agree}, differ ${n.differ}, no saved value ${n.notSaved}, VERSION stamps ${n.stamps}`,
  ];
  return lines;
}

function issues(r: VerifyResult): CellReport[] {
  return r.cells.filter((c) => c.status === 'differs' || c.status === 'not saved');
}

/** The terminal summary: counts, stamps, problems and every cell that differs. */
export function textReport(r: VerifyResult): string {
  const out = headerLines(r);
  for (const s of r.stamps) out.push(`VERSION stamp ${s.where}: saved "${s.saved}": ${s.verdict}`);
  for (const s of r.spills) out.push(`spill ${s.where}: saved ${s.saved}, recomputed ${s.recomputed}`);
  for (const p of r.problems) out.push(`cannot verify ${p.where}: ${p.message}`);
  const bad = issues(r);
  if (bad.length > 0) {
    out.push('', 'differences (cell, formula, saved, recomputed, recomputed − saved):');
    for (const c of bad.slice(0, 200)) {
      out.push(`  ${c.where}${c.spillOf ? ` (spill of ${c.spillOf})` : ''}  ${c.formula}  saved ${showValue(c.saved) || '(none)'}  recomputed ${showValue(c.recomputed) || '(blank)'}  ${showDifference(c)}${c.computedInputs.length ? `  inputs computed: ${c.computedInputs.slice(0, 5).join(', ')}` : ''}${c.note ? `  (${c.note})` : ''}`);
    }
    if (bad.length > 200) out.push(`  … and ${bad.length - 200} more (--report FILE.md or FILE.html lists every cell)`);
  }
  out.push('', `result: ${verdict(r)} (exit ${r.exitCode})`);
  return out.join('\n') + '\n';
}

function mdCell(s: string): string {
  return s.replace(/\\/g, '\\\\').replace(/\|/g, '\\|').replace(/\n/g, ' ');
}

export function markdownReport(r: VerifyResult): string {
  const out = ['# Protic verification report', '', ...headerLines(r).map((l) => `- ${mdCell(l)}`), ''];
  if (r.stamps.length > 0) {
    out.push('## VERSION stamps', '', '| cell | saved | verdict |', '|---|---|---|');
    for (const s of r.stamps) out.push(`| ${mdCell(s.where)} | ${mdCell(s.saved)} | ${mdCell(s.verdict)} |`);
    out.push('');
  }
  if (r.problems.length > 0 || r.spills.length > 0) {
    out.push('## Could not verify', '');
    for (const s of r.spills) out.push(`- spill ${mdCell(s.where)}: saved ${s.saved}, recomputed ${s.recomputed}`);
    for (const p of r.problems) out.push(`- ${mdCell(p.where)}: ${mdCell(p.message)}`);
    out.push('');
  }
  out.push('## Cells', '', '| cell | formula | saved | recomputed | recomputed − saved | status | computed inputs |', '|---|---|---|---|---|---|---|');
  for (const c of r.cells) {
    out.push(`| ${mdCell(c.where)}${c.spillOf ? ` (spill of ${mdCell(c.spillOf)})` : ''} | \`${mdCell(c.formula)}\` | ${mdCell(showValue(c.saved))} | ${mdCell(showValue(c.recomputed))} | ${showDifference(c)} | ${c.status === 'agrees' ? 'agrees' : `**${c.status}**`}${c.note ? ` (${mdCell(c.note)})` : ''} | ${mdCell(c.computedInputs.join(', '))} |`);
  }
  out.push('', `**Result: ${verdict(r)} (exit ${r.exitCode}).**`, '', 'A recomputed pH does not replace a measurement with a calibrated meter.', '');
  return out.join('\n');
}

function h(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}

const STYLE = `body{font:14px/1.4 system-ui,sans-serif;margin:1.5rem;color:#1b1b1b}
h1{font-size:1.3rem}h2{font-size:1.05rem;margin-top:1.5rem}
table{border-collapse:collapse;font-size:12px}th,td{border:1px solid #bbb;padding:2px 6px;text-align:left;vertical-align:top}
th{background:#eee;position:sticky;top:0}td.num{font-variant-numeric:tabular-nums;white-space:nowrap}
tr.differs td,tr.not-saved td{background:#fde2e2}tr.stamp td{background:#fff4d6}code{font-size:11px;word-break:break-all}
.verdict{font-weight:bold;padding:.5rem;border:2px solid #333;display:inline-block}.v0{border-color:#2a7a2a}.v1,.v2{border-color:#b00020}
@media print{th{position:static}}`;

export function htmlReport(r: VerifyResult): string {
  const rows = r.cells.map((c) => `<tr class="${c.status.replace(' ', '-')}"><td>${h(c.where)}${c.spillOf ? `<br><small>spill of ${h(c.spillOf)}</small>` : ''}</td><td><code>${h(c.formula)}</code></td><td class="num">${h(showValue(c.saved))}</td><td class="num">${h(showValue(c.recomputed))}</td><td class="num">${h(showDifference(c))}</td><td>${h(c.status)}${c.note ? `<br><small>${h(c.note)}</small>` : ''}</td><td>${h(c.computedInputs.join(', '))}</td></tr>`);
  const problems = [...r.spills.map((s) => `spill ${s.where}: saved ${s.saved}, recomputed ${s.recomputed}`), ...r.problems.map((p) => `${p.where}: ${p.message}`)];
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'">
<title>Protic verification report: ${h(r.file)}</title>
<style>${STYLE}</style></head><body>
<h1>Protic verification report</h1>
<ul>${headerLines(r).map((l) => `<li>${h(l)}</li>`).join('')}</ul>
<p class="verdict v${r.exitCode}" id="verdict">${h(verdict(r))} (exit ${r.exitCode})</p>
${r.stamps.length > 0 ? `<h2>VERSION stamps</h2><table id="stamps"><tr><th>cell</th><th>saved</th><th>verdict</th></tr>${r.stamps.map((s) => `<tr class="${s.changed ? 'stamp' : ''}"><td>${h(s.where)}</td><td>${h(s.saved)}</td><td>${h(s.verdict)}</td></tr>`).join('')}</table>` : ''}
${problems.length > 0 ? `<h2>Could not verify</h2><ul id="problems">${problems.map((p) => `<li>${h(p)}</li>`).join('')}</ul>` : ''}
<h2>Cells</h2>
<table id="cells"><thead><tr><th>cell</th><th>formula</th><th>saved</th><th>recomputed</th><th>recomputed − saved</th><th>status</th><th>computed inputs</th></tr></thead>
<tbody>
${rows.join('\n')}
</tbody></table>
<p><small>A recomputed pH does not replace a measurement with a calibrated meter. Generated by ${h(currentStamp())}.</small></p>
</body></html>
`;
}
