/**
 * A screen's code that failed to load fails with the same words whether the tablet is offline or a
 * newer build replaced the file: only asking the server for the file again tells them apart. The
 * server answers an address it has no file for with the kiosk's index.html, so a missing module
 * comes back as HTML.
 */
export type LoadFailure = 'checking' | 'updated' | 'offline' | 'retry' | 'other';

/** What the server said when asked for the module again: `unreachable` when nothing answered. */
export type ModuleProbe = { status: number; contentType: string | null } | 'unreachable';

const MODULE_LOAD_FAILED = /dynamically imported module|Importing a module script/i;
const MODULE_URL = /(https?:\/\/\S+?\.m?js)\b/i;

export function isModuleLoadError(error: unknown): error is Error {
  return error instanceof Error && MODULE_LOAD_FAILED.test(error.message);
}

/** The module's address, when the browser names it (Chromium and Firefox do; Safari does not). */
export function failedModuleUrl(error: unknown): string | null {
  return isModuleLoadError(error) ? (MODULE_URL.exec(error.message)?.[1] ?? null) : null;
}

/**
 * What a failed load means, from the server's answer to `probeTarget` (null: not answered yet).
 * Only the module's own address shows it gone; an answer for the kiosk's start page shows merely
 * that the server is there, and reloading is then the way forward either way.
 */
export function loadFailure(error: unknown, probe: ModuleProbe | null): LoadFailure {
  if (!isModuleLoadError(error)) return 'other';
  if (probe === null) return 'checking';
  if (probe === 'unreachable') return 'offline';
  const isScript = /javascript/i.test(probe.contentType ?? '');
  const there = probe.status >= 200 && probe.status < 300 && isScript;
  return there && failedModuleUrl(error) !== null ? 'retry' : 'updated';
}

/** What to ask the server for: the module itself, or else the kiosk's start page. */
export function probeTarget(error: unknown, base: string): string {
  return failedModuleUrl(error) ?? base;
}

/**
 * Asks the server for the module again. HEAD is not among the requests the service worker answers
 * from its cache, so this reaches the server or fails.
 */
export async function probeModule(url: string, fetcher: typeof fetch = fetch): Promise<ModuleProbe> {
  try {
    const answer = await fetcher(url, { method: 'HEAD', cache: 'no-store' });
    return { status: answer.status, contentType: answer.headers.get('content-type') };
  } catch {
    return 'unreachable';
  }
}
