/**
 * The page's side of the server: read the document, write inputs back, hear about changes on disk.
 */

export interface DocPayload {
  text: string;
  /** Hash of the file's bytes when it was read. */
  version: string;
  /** The file as named on the command line. */
  file: string;
  /** Hash of the bytes and git commit, for the sheet's archive footer (as `vaultbook render` gives it). */
  archive?: { hash: string; commit?: string; dirty?: boolean };
  /** `serve --case NAME`: the case to show first. */
  case?: string;
}

export type WriteReply =
  | { ok: true; version: string; changed: string[]; notes: string[]; text: string; archive?: DocPayload['archive'] }
  | { ok: false; conflict?: boolean; version?: string; message: string };

/** GET /__doc */
export async function fetchDocument(): Promise<DocPayload> {
  const res = await fetch('/__doc', { cache: 'no-store' });
  if (!res.ok) throw new Error(`cannot load the document: ${res.status} ${await res.text()}`);
  return res.json() as Promise<DocPayload>;
}

/** POST /__write: the values to write, and the version they were chosen against. */
export async function writeInputs(version: string, values: Record<string, string>): Promise<WriteReply> {
  try {
    const res = await fetch('/__write', {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ version, values }),
    });
    return (await res.json()) as WriteReply;
  } catch (e) {
    return { ok: false, message: `the server did not answer (${(e as Error).message}); check the file before trying again` };
  }
}

/** Calls back with the new version each time the server sees the file change on disk. */
export function onDocumentChanged(callback: (version: string) => void): void {
  // From the development server, its websocket; from the built page, the server's event stream.
  if (import.meta.hot) {
    import.meta.hot.on('vaultbook:doc', (data: { version: string }) => callback(data.version));
    return;
  }
  new EventSource('/__events').addEventListener('doc', (e) => callback((JSON.parse((e as MessageEvent<string>).data) as { version: string }).version));
}
