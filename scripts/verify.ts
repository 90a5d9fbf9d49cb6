// npm run verify -- FILE.xlsx [--tolerance 1e-9] [--report FILE.html|FILE.md] [--systems FILE.json]
//   [--strict-version] [--max-size MB]: recomputes every Protic cell of a saved workbook and
// compares it with the value Excel saved. Exit 0 all agree, 1 some differ, 2 cannot be read.
import { writeFileSync } from 'fs';
import { failureExit, runCommand } from './lib/cli';
import { htmlReport, markdownReport, textReport } from './lib/xlsxReport';
import { verifyFile } from './lib/xlsxVerify';

const USAGE = 'usage: npm run verify -- FILE.xlsx [--tolerance 1e-9] [--report FILE.html|FILE.md] [--systems FILE.json] [--strict-version] [--max-size MB]\n';

function option(argv: string[], name: string): string | undefined {
  const i = argv.indexOf(name);
  return i >= 0 ? argv[i + 1] : undefined;
}

export async function main(argv: string[], out: (s: string) => void = (s) => process.stdout.write(s), err: (s: string) => void = (s) => process.stderr.write(s)): Promise<number> {
  const valued = ['--tolerance', '--report', '--systems', '--max-size'];
  const files = argv.filter((a, i) => !a.startsWith('--') && !valued.includes(argv[i - 1]));
  const unknown = argv.filter((a) => a.startsWith('--') && !valued.includes(a) && a !== '--strict-version');
  if (files.length !== 1 || unknown.length > 0) { err(unknown.length ? `unknown option ${unknown[0]}\n${USAGE}` : USAGE); return 2; }
  const tolerance = Number(option(argv, '--tolerance') ?? 1e-9);
  if (!Number.isFinite(tolerance) || tolerance < 0) { err(`--tolerance: a number ≥ 0, not ${option(argv, '--tolerance')}\n`); return 2; }
  const maxMB = option(argv, '--max-size') === undefined ? undefined : Number(option(argv, '--max-size'));
  if (maxMB !== undefined && !(maxMB > 0)) { err('--max-size: a size in MB above 0\n'); return 2; }
  const report = option(argv, '--report');
  if (report !== undefined && !/\.(html?|md)$/i.test(report)) { err('--report: FILE.html or FILE.md\n'); return 2; }
  const tty = Boolean(process.stderr.isTTY);
  let lastLine = 0;
  const progress = (message: string): void => {
    if (tty) { err(`\r${message}`.padEnd(lastLine)); lastLine = message.length + 1; return; }
    err(`${message}\n`);
  };
  try {
    const result = await verifyFile(files[0], { tolerance, systemsFile: option(argv, '--systems'), strictVersion: argv.includes('--strict-version'), maxMB, progress });
    if (tty && lastLine > 0) err('\n');
    out(textReport(result));
    if (report) {
      writeFileSync(report, /\.md$/i.test(report) ? markdownReport(result) : htmlReport(result));
      out(`report written to ${report}\n`);
    }
    return result.exitCode;
  } catch (e) {
    return failureExit('verify', files[0], e, err);
  }
}

if (require.main === module) runCommand('verify', (argv) => main(argv));
