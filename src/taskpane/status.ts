import { byId } from './dom';

// The pane's one live region: status and results only, so typing is never re-announced.

export type Tone = 'ok' | 'warning' | 'error';

export function setStatus(message: string, tone: Tone = 'ok'): void {
  const status = byId('status');
  status.textContent = message;
  status.className = tone === 'ok' ? 'status' : `status ${tone}`;
}

export function failureText(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
