// What the workbook commands (sheet, verify) share: how a failure is reported and how the process runs.
import { XlsxInputError } from './xlsxRead';

/** Exit code 2 for a file that cannot be read (its reason printed) and for an internal error. */
export function failureExit(command: string, file: string | undefined, e: unknown, err: (s: string) => void): number {
  if (e instanceof XlsxInputError) err(`${command}: ${file}: ${e.message}\n`);
  else err(`${command}: internal error, please report it: ${(e as Error).message}\n`);
  return 2;
}

/** Runs a command's main with the process's arguments; a reader that stops early (| head) is not an error. */
export function runCommand(command: string, main: (argv: string[]) => Promise<number>): void {
  process.stdout.on('error', (error: NodeJS.ErrnoException) => { if (error.code === 'EPIPE') process.exit(0); else throw error; });
  main(process.argv.slice(2)).then((code) => { process.exitCode = code; }, (e: Error) => { process.stderr.write(`${command}: internal error: ${e.message}\n`); process.exitCode = 2; });
}
