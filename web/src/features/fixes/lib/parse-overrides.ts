import { ZReplayOverrides } from '@shared/contracts/replays';

/** Parses the overrides box: empty means the manifest's settings; otherwise JSON the engine accepts. */
export function parseOverrides(text: string): { overrides?: Record<string, unknown>; problem?: string } {
  if (text.trim() === '') return { overrides: {} };
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    return { problem: 'Overrides must be JSON, e.g. {"particles": 2000, "recovery": true}.' };
  }
  const parsed = ZReplayOverrides.safeParse(json);
  if (parsed.success) return { overrides: parsed.data };
  const issue = parsed.error.issues[0];
  return { problem: `Overrides, field "${issue?.path.join('.') || '(root)'}": ${issue?.message}` };
}
